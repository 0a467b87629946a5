/** Library rows → API representations (lib/library/schemas.ts). */
import type { CircuitRow, ObservableRow } from "@/db/schema";
import type { CircuitView, ObservableView } from "./schemas";

type Common = Pick<
  CircuitRow,
  "id" | "name" | "description" | "tags" | "qubits" | "createdByUserId" | "createdAt" | "updatedAt"
>;

export function commonView(row: Common) {
  return {
    id: row.id,
    name: row.name,
    description: row.description,
    tags: row.tags,
    qubits: row.qubits,
    createdBy: row.createdByUserId,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

export function toCircuitView(row: CircuitRow): CircuitView {
  return { ...commonView(row), format: row.format, source: row.source };
}

export function toObservableView(row: ObservableRow): ObservableView {
  if (row.format === "pauli")
    return { ...commonView(row), format: "pauli", terms: row.terms ?? "" };
  const matrix = row.matrix ?? { real: [[0]] };
  return {
    ...commonView(row),
    format: "matrix",
    real: matrix.real,
    ...(matrix.imag ? { imag: matrix.imag } : {}),
  };
}

export function toSummaryView<F extends string>(row: Common & { format: F }) {
  return { ...commonView(row), format: row.format };
}

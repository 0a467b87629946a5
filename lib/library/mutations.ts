/**
 * Writes of the library. Names are unique per organisation and kind: saving a
 * second item with a taken name is 409. Every function takes the organisation id.
 */
import "server-only";
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { db } from "@/db";
import { circuits, observables } from "@/db/schema";
import { conflict } from "@/lib/api/problem";
import { pauliTermsToText } from "@/lib/quantum";
import { isDuplicateKey } from "@/lib/runs/mutations";
import { getCircuitOrThrow, getObservableOrThrow } from "./queries";
import type { CircuitCreateInput, ObservableCreateInput } from "./schemas";

const taken = (kind: string, name: string) =>
  conflict(
    `A saved ${kind} named "${name}" already exists in this organisation; pick another name.`,
    [{ path: "name", message: "already taken" }],
  );

export async function createCircuit(
  orgId: string,
  userId: string | null,
  input: CircuitCreateInput,
  qubits: number,
) {
  const id = randomUUID();
  try {
    await db.insert(circuits).values({
      id,
      orgId,
      createdByUserId: userId,
      name: input.name,
      description: input.description,
      tags: [...new Set(input.tags)],
      format: input.format,
      source: input.source,
      qubits,
    });
  } catch (error) {
    if (isDuplicateKey(error)) throw taken("circuit", input.name);
    throw error;
  }
  return getCircuitOrThrow(orgId, id);
}

export async function createObservable(
  orgId: string,
  userId: string | null,
  input: ObservableCreateInput,
  qubits: number,
) {
  const id = randomUUID();
  try {
    await db.insert(observables).values({
      id,
      orgId,
      createdByUserId: userId,
      name: input.name,
      description: input.description,
      tags: [...new Set(input.tags)],
      // A JSON term list is kept as the equivalent Pauli-sum text (same numbers, same words).
      format: input.format === "terms" ? "pauli" : input.format,
      terms:
        input.format === "pauli"
          ? input.terms
          : input.format === "terms"
            ? pauliTermsToText(input.terms)
            : null,
      matrix:
        input.format === "matrix"
          ? { real: input.real, ...(input.imag ? { imag: input.imag } : {}) }
          : null,
      qubits,
    });
  } catch (error) {
    if (isDuplicateKey(error)) throw taken("observable", input.name);
    throw error;
  }
  return getObservableOrThrow(orgId, id);
}

/** Deletes a saved circuit; false when this organisation has no such item. */
export async function deleteCircuit(orgId: string, id: string): Promise<boolean> {
  const [result] = await db
    .delete(circuits)
    .where(and(eq(circuits.orgId, orgId), eq(circuits.id, id)));
  return result.affectedRows > 0;
}

export async function deleteObservable(orgId: string, id: string): Promise<boolean> {
  const [result] = await db
    .delete(observables)
    .where(and(eq(observables.orgId, orgId), eq(observables.id, id)));
  return result.affectedRows > 0;
}

/**
 * Layout of a circuit diagram (pure; the SVG component only draws what this returns).
 *
 * - One horizontal wire per qubit, qubit 0 at the top (the same reading order as bitstrings: qubit 0 first).
 * - Operations are packed as early as possible ("as soon as possible" scheduling, common
 *   practice): an operation goes into the first column after the last column used on any
 *   row it covers. A multi-qubit operation covers every row from its lowest to its highest
 *   qubit, because its connecting line or box crosses them; a barrier covers its qubits'
 *   span and also fences later operations.
 * - Column widths fit the widest label in the column; x positions are cumulative.
 * - At most `maxOps` operations are laid out; the rest are counted in `truncated`.
 */
import { formatAngle } from "./angle";
import { gateRole, type GateRole } from "./gate-roles";

export type DiagramOp =
  | { kind: "gate"; name: string; qubits: readonly number[]; params?: readonly number[] }
  | { kind: "measure"; qubit: number; clbit?: number }
  | { kind: "reset"; qubit: number }
  | { kind: "barrier"; qubits: readonly number[] };

export type PlacedOp = {
  op: DiagramOp;
  /** Index of the op in the input list. */
  index: number;
  column: number;
  /** Qubits the op acts on, in operand order. */
  qubits: number[];
  /** First and last row covered (inclusive). */
  top: number;
  bottom: number;
  role: GateRole | { kind: "measure" } | { kind: "reset" } | { kind: "barrier" };
  /** Main label (gate name as written) and parameter label ("" when none). */
  label: string;
  paramLabel: string;
  /** Width of the op's box in px. */
  width: number;
};

export type DiagramGeometry = {
  rowHeight: number;
  gutter: number;
  labelWidth: number;
  charWidth: number;
  minBox: number;
  padX: number;
};

export const DEFAULT_GEOMETRY: DiagramGeometry = {
  rowHeight: 44,
  gutter: 14,
  labelWidth: 56,
  charWidth: 7.2,
  minBox: 30,
  padX: 10,
};

export type DiagramLayout = {
  numQubits: number;
  items: PlacedOp[];
  /** Left x and width of each column. */
  columns: { x: number; width: number }[];
  width: number;
  height: number;
  /** Operations left out beyond `maxOps`. */
  truncated: number;
  geometry: DiagramGeometry;
};

function opQubits(op: DiagramOp): number[] {
  return op.kind === "gate" || op.kind === "barrier" ? [...op.qubits] : [op.qubit];
}

function describe(op: DiagramOp): Pick<PlacedOp, "role" | "label" | "paramLabel"> {
  if (op.kind === "measure") return { role: { kind: "measure" }, label: "m", paramLabel: "" };
  if (op.kind === "reset") return { role: { kind: "reset" }, label: "|0⟩", paramLabel: "" };
  if (op.kind === "barrier") return { role: { kind: "barrier" }, label: "", paramLabel: "" };
  const role = gateRole(op.name, op.qubits.length);
  const params = (op.params ?? []).map(formatAngle).join(", ");
  const label = role.kind === "controlled" ? role.label : op.name;
  return { role, label, paramLabel: params };
}

function boxWidth(
  label: string,
  paramLabel: string,
  role: PlacedOp["role"],
  g: DiagramGeometry,
): number {
  if (role.kind === "barrier") return 12;
  if (role.kind === "swap" || (role.kind === "controlled" && role.target !== "box"))
    return g.minBox - 6;
  const chars = Math.max(label.length, paramLabel.length * 0.85);
  return Math.max(g.minBox, Math.ceil(chars * g.charWidth + 2 * g.padX));
}

export function layoutCircuit(
  numQubits: number,
  ops: readonly DiagramOp[],
  {
    maxOps = 400,
    geometry = DEFAULT_GEOMETRY,
    labelChars = 4,
  }: { maxOps?: number; geometry?: DiagramGeometry; labelChars?: number } = {},
): DiagramLayout {
  const g = {
    ...geometry,
    labelWidth: Math.max(geometry.labelWidth, Math.ceil(labelChars * geometry.charWidth) + 20),
  };
  const nextFree = new Array<number>(numQubits).fill(0);
  const items: PlacedOp[] = [];
  const shown = ops.slice(0, maxOps);
  shown.forEach((op, index) => {
    const qubits = opQubits(op).filter((q) => Number.isInteger(q) && q >= 0 && q < numQubits);
    if (qubits.length === 0) return;
    const top = Math.min(...qubits);
    const bottom = Math.max(...qubits);
    let column = 0;
    for (let r = top; r <= bottom; r++) column = Math.max(column, nextFree[r]);
    for (let r = top; r <= bottom; r++) nextFree[r] = column + 1;
    const d = describe(op);
    items.push({
      op,
      index,
      column,
      qubits,
      top,
      bottom,
      ...d,
      width: boxWidth(d.label, d.paramLabel, d.role, g),
    });
  });
  const count = items.reduce((m, it) => Math.max(m, it.column + 1), 0);
  const widths = new Array<number>(count).fill(0);
  for (const it of items) widths[it.column] = Math.max(widths[it.column], it.width);
  const columns: { x: number; width: number }[] = [];
  let x = g.labelWidth + g.gutter;
  for (const w of widths) {
    columns.push({ x, width: w });
    x += w + g.gutter;
  }
  return {
    numQubits,
    items,
    columns,
    width: x + g.gutter,
    height: Math.max(1, numQubits) * g.rowHeight,
    truncated: ops.length - shown.length,
    geometry: g,
  };
}

/** Centre y of a qubit row. */
export function rowY(layout: DiagramLayout, row: number): number {
  return layout.geometry.rowHeight * (row + 0.5);
}

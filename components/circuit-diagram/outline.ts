/**
 * What the new-run page needs to draw a circuit and offer its parameters: the qubit labels,
 * the OpenQASM 3 inputs and the top-level operations (measure/reset/barrier/gates with
 * numeric parameters). Produced on the server (the parser stays out of the browser).
 */
import type { DiagramOp } from "./layout";

export type CircuitOutline = {
  qubits: number;
  qubitLabels: string[];
  inputs: { name: string; type: "float" | "angle" }[];
  ops: DiagramOp[];
  /** Operations beyond the ones sent (the diagram shows the first `ops.length`). */
  omitted: number;
  /** True when inputs were drawn with placeholder values (0 for ones without a value). */
  placeholders: string[];
};

export type OutlineAnswer =
  | { ok: true; outline: CircuitOutline }
  | { ok: false; message: string; line?: number; column?: number };

/**
 * The checked, compiled form of a program: everything `bind` needs, with parameter
 * expressions as closures and constant matrices computed once.
 */
import type { Compiled } from "./expressions";
import type { PrimitiveGate } from "./gate-library";
import type { QasmFormat } from "./parse-source";

/** Limits that keep a hostile program from exhausting memory (code "too_large"). */
export const LIMITS = {
  maxQubits: 1024,
  maxClbits: 4096,
  /** Primitive gate applications after expanding user gates and broadcasting. */
  maxParts: 1_000_000,
  /** Top-level operations after broadcasting. */
  maxOps: 1_000_000,
} as const;

/**
 * One primitive application inside a top-level gate op, with qubits given as positions.
 * `params[j]` is the compiled expression of the gate's j-th angle in terms of the program
 * inputs (loops are unrolled and `const`s folded, so every application has its own
 * template). `gate` may be a gate changed by OpenQASM 3 modifiers (`gate.modification`
 * set: base primitive, control pattern, inverse — see modified-gates.ts); its matrix is
 * exact, and `pow(k) @` has already become k separate parts.
 */
export interface PartTemplate {
  gate: PrimitiveGate;
  /** Positions into the op's qubit list (the gate's formal arguments). */
  formals: number[];
  params: Compiled[];
  /** The matrix when all parameters are constant — shared by every bind, never mutated. */
  constMatrix: Float64Array | null;
  /** Index into the per-bind matrix table when a parameter depends on an input, else −1. */
  slot: number;
}

export type CompiledOp =
  | {
      kind: "gate";
      name: string;
      qubits: number[];
      params: Compiled[];
      parts: PartTemplate[];
      /** Circuit qubits of each part (parallel to `parts`). */
      partQubits: number[][];
      line: number;
    }
  | { kind: "measure"; qubit: number; clbit: number; line: number }
  | { kind: "reset"; qubit: number; line: number }
  | { kind: "barrier"; qubits: number[]; line: number };

export interface ProgramInput {
  name: string;
  type: "float" | "angle";
}

export interface CompiledProgram {
  format: QasmFormat;
  numQubits: number;
  numClbits: number;
  qubitLabels: string[];
  inputs: ProgramInput[];
  ops: CompiledOp[];
  /** Templates whose matrix depends on inputs (index = PartTemplate.slot). */
  slots: PartTemplate[];
  hasMidCircuitMeasurement: boolean;
  hasReset: boolean;
}

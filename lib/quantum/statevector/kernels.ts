/**
 * Public gate-application entry points on statevectors.
 *
 * Matrix convention (types.ts): a gate on operands (q_0, …, q_{k−1}) has a 2^k × 2^k
 * matrix, row-major, interleaved (re, im), whose local basis index is
 * i = Σ_j b_j · 2^(k−1−j) — the FIRST operand is the most significant local bit.
 * Internally amplitude index bit k is qubit k.
 */
import type { StateVector } from "../types";
import { applyToAmplitudes } from "./dispatch";

/** ψ ← (U on `qubits`) ψ, in place. Throws RangeError on a malformed call (a programming error). */
export function applyMatrix(state: StateVector, qubits: number[], matrix: Float64Array): void {
  checkGateShape(state.n, qubits, matrix);
  applyToAmplitudes(state.re, state.im, qubits, matrix);
}

/** Validates operand indices (integers in [0, n), distinct) and matrix length 2·4^k. */
export function checkGateShape(n: number, qubits: readonly number[], matrix: Float64Array): void {
  const k = qubits.length;
  if (k < 1) throw new RangeError("a gate needs at least one qubit");
  const seen = new Set<number>();
  for (const q of qubits) {
    if (!Number.isInteger(q) || q < 0 || q >= n) {
      throw new RangeError(`qubit index ${q} is out of range for a ${n}-qubit register`);
    }
    if (seen.has(q)) throw new RangeError(`qubit ${q} appears twice in one gate`);
    seen.add(q);
  }
  const want = 2 * 4 ** k;
  if (matrix.length !== want) {
    throw new RangeError(
      `a ${k}-qubit gate needs a matrix of ${want} numbers (interleaved re/im), got ${matrix.length}`,
    );
  }
}

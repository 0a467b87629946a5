/**
 * Statevector storage: split real/imaginary Float64Arrays of
 * length 2^n; amplitude index bit k is qubit k (little-endian in the index).
 */
import type { StateVector } from "../types";

/** |0…0⟩ on n qubits: amplitude 1 at index 0. */
export function createZeroState(n: number): StateVector {
  if (!Number.isInteger(n) || n < 0 || n > 30) {
    throw new RangeError(`createZeroState: qubit count must be an integer in [0, 30], got ${n}`);
  }
  const dim = 2 ** n;
  const re = new Float64Array(dim);
  const im = new Float64Array(dim);
  re[0] = 1;
  return { n, re, im };
}

/** Born-rule probabilities p_i = |ψ_i|² = re_i² + im_i², same index order as the state. */
export function probabilities(state: StateVector): Float64Array {
  const { re, im } = state;
  const p = new Float64Array(re.length);
  for (let i = 0; i < re.length; i++) p[i] = re[i] * re[i] + im[i] * im[i];
  return p;
}

/** ‖ψ‖² = Σ |ψ_i|² (1 for a normalised state). */
export function normSquared(state: StateVector): number {
  const { re, im } = state;
  let s = 0;
  for (let i = 0; i < re.length; i++) s += re[i] * re[i] + im[i] * im[i];
  return s;
}

/** A deep copy of a statevector. */
export function cloneState(state: StateVector): StateVector {
  return { n: state.n, re: state.re.slice(), im: state.im.slice() };
}

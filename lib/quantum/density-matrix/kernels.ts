/**
 * Unitary evolution of a density matrix in place: ρ → U ρ U†.
 *
 * With ρ stored row-major (entry index (r << n) | c), (UρU†)_{rc} = Σ U_{rr'} ρ_{r'c'} conj(U_{cc'}):
 * U acts on the row bits (qubit q ↦ bit q + n) and conj(U) on the column bits (qubit q ↦ bit q)
 * of the vectorised ρ — two statevector-style passes with the same kernels.
 */
import type { DensityMatrix } from "../types";
import { checkGateShape } from "../statevector/kernels";
import { applyToAmplitudes } from "../statevector/dispatch";

/** Element-wise complex conjugate of an interleaved matrix. */
export function conjugateMatrix(m: Float64Array): Float64Array {
  const out = m.slice();
  for (let i = 1; i < out.length; i += 2) out[i] = -out[i];
  return out;
}

/** ρ ← U ρ U† with U on `qubits` (types.ts matrix convention), in place. */
export function applyUnitaryDM(rho: DensityMatrix, qubits: number[], matrix: Float64Array): void {
  checkGateShape(rho.n, qubits, matrix);
  const n = rho.n;
  applyToAmplitudes(rho.re, rho.im, qubits.map((q) => q + n), matrix);
  applyToAmplitudes(rho.re, rho.im, qubits, conjugateMatrix(matrix));
}

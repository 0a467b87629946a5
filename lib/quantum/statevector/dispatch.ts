/**
 * Chooses the kernel for one gate on raw split re/im amplitude arrays. Shared by the
 * statevector (bits = qubits) and the density matrix (bits = qubits + n for rows,
 * qubits for columns of the vectorised ρ).
 */
import { applyGeneral1q, applyGeneral2q, applyGeneralK, applyReal1q } from "./kernels-general";

/** True when every imaginary part of the interleaved matrix is exactly zero. */
export function isRealMatrix(m: Float64Array): boolean {
  for (let i = 1; i < m.length; i += 2) if (m[i] !== 0) return false;
  return true;
}

/** ψ ← (U on index bits `bits`) ψ, in place; no argument checks (callers validate). */
export function applyToAmplitudes(re: Float64Array, im: Float64Array, bits: readonly number[], m: Float64Array): void {
  const k = bits.length;
  if (k === 1) {
    if (isRealMatrix(m)) applyReal1q(re, im, bits[0], m);
    else applyGeneral1q(re, im, bits[0], m);
    return;
  }
  if (k === 2) {
    applyGeneral2q(re, im, bits[0], bits[1], m);
    return;
  }
  applyGeneralK(re, im, bits, m);
}

/**
 * Unitary evolution of a density matrix in place: ρ → U ρ U†.
 *
 * With ρ stored row-major (entry index (r << n) | c), (UρU†)_{rc} = Σ U_{rr'} ρ_{r'c'} conj(U_{cc'}):
 * U acts on the row bits (qubit q ↦ bit q + n) and conj(U) on the column bits (qubit q ↦ bit q)
 * of the vectorised ρ. For one qubit this is a single pass of the 4×4 matrix U ⊗ conj(U) on
 * the bit pair (q + n, q); for more qubits, two passes with the statevector kernels.
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

/** U ⊗ conj(U) for a 2×2 U (4×4, first factor = most significant local bit). */
function withConjugate1q(u: Float64Array): Float64Array {
  const out = new Float64Array(32);
  for (let a = 0; a < 2; a++)
    for (let b = 0; b < 2; b++)
      for (let c = 0; c < 2; c++)
        for (let e = 0; e < 2; e++) {
          const ur = u[2 * (a * 2 + c)],
            ui = u[2 * (a * 2 + c) + 1];
          const vr = u[2 * (b * 2 + e)],
            vi = -u[2 * (b * 2 + e) + 1];
          const idx = 2 * ((a * 2 + b) * 4 + (c * 2 + e));
          out[idx] = ur * vr - ui * vi;
          out[idx + 1] = ur * vi + ui * vr;
        }
  return out;
}

/** ρ ← U ρ U† without argument checks (callers validated the circuit). */
export function applyUnitaryDMUnchecked(
  rho: DensityMatrix,
  qubits: readonly number[],
  matrix: Float64Array,
): void {
  const n = rho.n;
  if (qubits.length === 1) {
    applyToAmplitudes(rho.re, rho.im, [qubits[0] + n, qubits[0]], withConjugate1q(matrix));
    return;
  }
  applyToAmplitudes(
    rho.re,
    rho.im,
    qubits.map((q) => q + n),
    matrix,
  );
  applyToAmplitudes(rho.re, rho.im, qubits, conjugateMatrix(matrix));
}

/** ρ ← U ρ U† with U on `qubits` (types.ts matrix convention), in place. */
export function applyUnitaryDM(rho: DensityMatrix, qubits: number[], matrix: Float64Array): void {
  checkGateShape(rho.n, qubits, matrix);
  applyUnitaryDMUnchecked(rho, qubits, matrix);
}

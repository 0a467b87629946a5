/**
 * Outcome law of a matrix observable measured in its eigenbasis (the outcomes are its eigenvalues):
 * outcome k (eigenvector v_k, ascending eigenvalues) has probability |⟨v_k|ψ⟩|² for a
 * statevector and ⟨v_k|ρ|v_k⟩ for a density matrix; its value is λ_k. Dense O(d²)/O(d³)
 * work, fine for the ≤ 8-qubit matrices accepted.
 */
import type { HermitianEigen } from "../observable/hermitian-eigen";
import type { DensityMatrix, StateVector } from "../types";

export function eigenbasisLawOfState(state: StateVector, eig: HermitianEigen): Float64Array {
  const d = eig.dim;
  const p = new Float64Array(d);
  for (let k = 0; k < d; k++) {
    let ar = 0;
    let ai = 0;
    for (let i = 0; i < d; i++) {
      const vr = eig.vecRe[k * d + i];
      const vi = -eig.vecIm[k * d + i];
      ar += vr * state.re[i] - vi * state.im[i];
      ai += vr * state.im[i] + vi * state.re[i];
    }
    p[k] = ar * ar + ai * ai;
  }
  return p;
}

export function eigenbasisLawOfDensity(rho: DensityMatrix, eig: HermitianEigen): Float64Array {
  const d = eig.dim;
  const p = new Float64Array(d);
  const wr = new Float64Array(d);
  const wi = new Float64Array(d);
  for (let k = 0; k < d; k++) {
    const vr = eig.vecRe.subarray(k * d, (k + 1) * d);
    const vi = eig.vecIm.subarray(k * d, (k + 1) * d);
    for (let i = 0; i < d; i++) {
      let sr = 0;
      let si = 0;
      for (let j = 0; j < d; j++) {
        const r = rho.re[i * d + j];
        const m = rho.im[i * d + j];
        sr += r * vr[j] - m * vi[j];
        si += r * vi[j] + m * vr[j];
      }
      wr[i] = sr;
      wi[i] = si;
    }
    let s = 0;
    for (let i = 0; i < d; i++) s += vr[i] * wr[i] + vi[i] * wi[i];
    p[k] = Math.max(0, s);
  }
  return p;
}

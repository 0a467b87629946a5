/**
 * Exact expectation of a dense Hermitian matrix observable (n ≤ 8, so dense work is cheap):
 * ⟨ψ|H|ψ⟩ = Σ_ij conj(ψ_i) H_ij ψ_j and Tr(ρH) = Σ_ij ρ_ij H_ji (real parts; the
 * imaginary parts vanish for Hermitian H and ρ).
 */
import type { DensityMatrix, StateVector } from "../types";
import type { HermitianMatrix } from "./matrix-observable";

export function matrixExpectationOnState(state: StateVector, h: HermitianMatrix): number {
  const d = h.dim;
  let s = 0;
  for (let i = 0; i < d; i++) {
    let wr = 0;
    let wi = 0;
    const row = i * d;
    for (let j = 0; j < d; j++) {
      const a = h.re[row + j];
      const b = h.im[row + j];
      wr += a * state.re[j] - b * state.im[j];
      wi += a * state.im[j] + b * state.re[j];
    }
    s += state.re[i] * wr + state.im[i] * wi;
  }
  return s;
}

export function matrixExpectationOnDensity(rho: DensityMatrix, h: HermitianMatrix): number {
  const d = h.dim;
  let s = 0;
  for (let i = 0; i < d; i++) {
    for (let j = 0; j < d; j++) {
      // Re(ρ_ij H_ji)
      s += rho.re[i * d + j] * h.re[j * d + i] - rho.im[i * d + j] * h.im[j * d + i];
    }
  }
  return s;
}

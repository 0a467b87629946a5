/**
 * Density-matrix storage: row-major d×d with d = 2^n, split
 * real/imaginary Float64Arrays of length d²; element (r, c) sits at index r·d + c, and
 * bit k of a row or column index is qubit k.
 *
 * Viewed as one array of 2n bits, entry index = (r << n) | c: column qubit k is bit k and
 * row qubit k is bit k + n. The kernels use this view (ρ as a "vectorised" 2n-qubit state).
 */
import type { DensityMatrix, StateVector } from "../types";
import { sliceOf } from "../parallel/shares";
import { allocateAmplitudes } from "../statevector/state";
import { wasmBinding } from "../wasm/runtime";

/**
 * ρ = |0…0⟩⟨0…0| on n qubits: in a WebAssembly kernel memory like a 2n-qubit state when the
 * engine uses them (statevector/state.ts allocateAmplitudes), else in SharedArrayBuffers for
 * engine threads when `shared`, else plain arrays.
 */
export function createZeroDensity(n: number, shared = false): DensityMatrix {
  if (!Number.isInteger(n) || n < 0 || n > 15) {
    throw new RangeError(`createZeroDensity: qubit count must be an integer in [0, 15], got ${n}`);
  }
  // like a 2n-qubit state: in a kernel memory (the SIMD noisy-gate kernel) when the engine
  // uses them, pages written before the kernels read them (parallel/kernel-pool.ts, "Pages")
  const { re, im } = allocateAmplitudes(2 * n, shared, 0);
  if (shared && !wasmBinding(re, im)) {
    re.fill(0);
    im.fill(0);
  }
  re[0] = 1;
  return { n, re, im };
}

/**
 * Slice `index` of `parts` of ρ (the entries whose top log2(parts) row bits equal index): a
 * DensityMatrix view the kernels treat as a whole ρ for steps on qubits below those bits.
 */
export function densitySlice(rho: DensityMatrix, index: number, parts: number): DensityMatrix {
  return { n: rho.n, re: sliceOf(rho.re, index, parts), im: sliceOf(rho.im, index, parts) };
}

/** The diagonal ρ_ii (the Born probabilities, real for a Hermitian ρ), index bit k = qubit k. */
export function diagonal(rho: DensityMatrix): Float64Array {
  const d = 2 ** rho.n;
  const out = new Float64Array(d);
  for (let i = 0; i < d; i++) out[i] = rho.re[i * d + i];
  return out;
}

/** Tr ρ (real part; the imaginary part of a Hermitian ρ's trace is 0). */
export function trace(rho: DensityMatrix): number {
  const d = 2 ** rho.n;
  let s = 0;
  for (let i = 0; i < d; i++) s += rho.re[i * d + i];
  return s;
}

/** ρ = |ψ⟩⟨ψ| for a statevector ψ: ρ_rc = ψ_r · conj(ψ_c). */
export function densityFromState(state: StateVector): DensityMatrix {
  const d = state.re.length;
  const re = new Float64Array(d * d);
  const im = new Float64Array(d * d);
  for (let r = 0; r < d; r++) {
    const ar = state.re[r];
    const ai = state.im[r];
    const row = r * d;
    for (let c = 0; c < d; c++) {
      const br = state.re[c];
      const bi = -state.im[c];
      re[row + c] = ar * br - ai * bi;
      im[row + c] = ar * bi + ai * br;
    }
  }
  return { n: state.n, re, im };
}

/**
 * Statevector storage: split real/imaginary Float64Arrays of
 * length 2^n; amplitude index bit k is qubit k (little-endian in the index).
 */
import { noteSharedAllocation } from "../parallel/memory-pressure";
import type { StateVector } from "../types";
import { engineWasm } from "../parallel/config";
import { bindMemory, createKernelMemory, stateViews } from "../wasm/runtime";
import { tileTailBytes } from "./tiling";

/**
 * Below this many qubits states stay in plain arrays. Measured (CPU time, loaded 2-core VM):
 * a kernel memory and its instance cost 15–35 µs against 3–11 µs for two plain arrays, and a
 * layer of n 1-qubit and n − 1 dense 2-qubit gates takes 2.0 / 6.6 / 8.4 / 38 µs with the
 * SIMD kernels against 1.6 / 3.4 / 15 / 66 µs in JavaScript at n = 4 / 6 / 8 / 10: the wasm
 * path wins from n = 8 after two layers and from n = 10 after one.
 */
export const WASM_MIN_QUBITS = 10;

/**
 * Zero-filled re and im arrays of 2^n amplitudes: in a WebAssembly kernel memory (the SIMD
 * kernels run on them) when enabled and n ≥ WASM_MIN_QUBITS, else plain Float64Arrays
 * (over SharedArrayBuffers when `shared`: engine threads will work on them). A kernel memory
 * has room for the tile buffers of `threads` threads (tiling.ts). `zeroFill: false` skips
 * writing its pages first, for a caller that overwrites every amplitude at once (a copy).
 */
export function allocateAmplitudes(
  n: number,
  shared = false,
  threads = 1,
  zeroFill = true,
  companion = false,
): { re: Float64Array; im: Float64Array } {
  if (n >= WASM_MIN_QUBITS && engineWasm()) {
    const memory = createKernelMemory(n, tileTailBytes(n, threads), companion);
    if (memory && bindMemory(memory, 0)) {
      const views = stateViews(memory, n);
      // write every page once: a kernel's first read would map the shared zero page and its
      // store then replace it (a TLB flush per page, sent to every thread of the process)
      if (zeroFill) {
        views.re.fill(0);
        views.im.fill(0);
      }
      return views;
    }
  }
  const dim = 2 ** n;
  if (shared) {
    noteSharedAllocation(16 * dim);
    return {
      re: new Float64Array(new SharedArrayBuffer(8 * dim)),
      im: new Float64Array(new SharedArrayBuffer(8 * dim)),
    };
  }
  return { re: new Float64Array(dim), im: new Float64Array(dim) };
}

/** |0…0⟩ on n qubits: amplitude 1 at index 0 (with a companion state: wasm/runtime.ts companionOf). */
export function createZeroState(n: number, companion = false): StateVector {
  if (!Number.isInteger(n) || n < 0 || n > 30) {
    throw new RangeError(`createZeroState: qubit count must be an integer in [0, 30], got ${n}`);
  }
  const { re, im } = allocateAmplitudes(n, false, 1, true, companion);
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

/**
 * The Pauli flip-mask pass (observable/pauli-mask-pass.ts) on amplitudes bound to a kernel
 * memory: one SIMD pass over the state per mask x and batch of up to PAULI_BATCH terms,
 * signs from i32.popcnt parities. Terms are written into the memory's Pauli table
 * (runtime.ts) and the per-term sums read back.
 */
import type { MaskTerm } from "../observable/pauli-mask-pass";
import {
  PAULI_ACC_AT,
  PAULI_BATCH,
  PAULI_OUT_AT,
  PAULI_TERMS_AT,
  type WasmBinding,
} from "./runtime";

const SIGN = -2147483648; // the high word of an f64 with only the sign bit set

/** Writes ⟨P_t⟩ into out[t.index] for every term t with flip mask x (state of ≥ 4 amplitudes). */
export function wasmMaskPass(
  w: WasmBinding,
  re: Float64Array,
  im: Float64Array,
  x: number,
  terms: readonly MaskTerm[],
  out: Float64Array,
): void {
  const len = re.length;
  const h = x === 0 ? -1 : 31 - Math.clz32(x);
  // h ≥ 2: visit the half with bit h clear (each pair once, doubled at the end); else all of b
  const half = h >= 2;
  const run = half ? 2 ** h : len;
  const stride = half ? 2 ** (h + 1) : len;
  const factor = half ? 2 : 1;
  const table = new Int32Array(w.buffer, PAULI_TERMS_AT, 12 * PAULI_BATCH);
  const sums = new Float64Array(w.buffer, PAULI_OUT_AT, PAULI_BATCH);
  for (let from = 0; from < terms.length; from += PAULI_BATCH) {
    const g = Math.min(PAULI_BATCH, terms.length - from);
    table.fill(0, 0, 12 * g);
    for (let t = 0; t < g; t++) {
      const { z, k } = terms[from + t];
      const o = 12 * t;
      table[o] = z;
      table[o + 1] = k & 1;
      // lane j's sign (−1)^{|j & z|} for j = 1, 2, 3 (lane 0: +1)
      if (z & 1) table[o + 7] = SIGN;
      if (z & 2) table[o + 9] = SIGN;
      if (((z & 1) ^ ((z >> 1) & 1)) === 1) table[o + 11] = SIGN;
    }
    w.k.pauliMask(
      re.byteOffset,
      im.byteOffset,
      x,
      run,
      stride,
      len,
      g,
      PAULI_TERMS_AT,
      PAULI_ACC_AT,
      PAULI_OUT_AT,
    );
    for (let t = 0; t < g; t++) {
      const { index, k } = terms[from + t];
      const sign = x === 0 || k === 0 || k === 3 ? 1 : -1;
      out[index] = factor * sign * sums[t];
    }
  }
}

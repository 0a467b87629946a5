/**
 * The adjoint sweep's local cross matrix (gradient/local-cross.ts) with the SIMD kernels, for
 * λ and φ in ONE kernel memory (a state and its companion, wasm/runtime.ts): a read-only pass
 * over both. Sums run in lanes, so they differ from the JavaScript pass in the last bits only.
 */
import type { WasmBinding } from "./runtime";

/**
 * R on 1 or 2 index bits for λ and φ in the binding's memory; on 2 bits only the entries set in
 * `needed` (bit e = entry e of the 4×4, nonZeroPattern order) are summed, the others are 0.
 */
export function wasmCross(
  w: WasmBinding,
  lre: Float64Array,
  lim: Float64Array,
  pre: Float64Array,
  pim: Float64Array,
  bits: readonly number[],
  needed: number,
): Float64Array {
  const out = w.scratchAt;
  const acc = w.scratchAt + 1024;
  const len = pre.length;
  if (bits.length === 1) {
    w.k.cross1q(
      lre.byteOffset,
      lim.byteOffset,
      pre.byteOffset,
      pim.byteOffset,
      len,
      bits[0],
      out,
      acc,
    );
    return w.scratch.slice(0, 8);
  }
  w.k.cross2q(
    lre.byteOffset,
    lim.byteOffset,
    pre.byteOffset,
    pim.byteOffset,
    len,
    bits[0],
    bits[1],
    needed,
    out,
    acc,
  );
  return w.scratch.slice(0, 32);
}

/**
 * The adjoint sweep's local cross matrix (gradient/local-cross.ts) with the SIMD kernels, for
 * λ and φ in ONE kernel memory (a state and its companion, wasm/runtime.ts): a read-only pass
 * over both. Sums run in lanes, so they differ from the JavaScript pass in the last bits only.
 */
import { classifyMatrix, twoBlocks } from "../statevector/matrix-classify";
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

/**
 * The adjoint sweep's whole step for a two-block U (a cx fused with gates on its target) on
 * index bits ≥ 1, λ and φ in the binding's memory: φ ← Uφ, R, λ ← Uλ (when `updateLambda`)
 * in one pass (assembly/two-block-step.ts). `bits` = [first, second] operand bits and `u` the
 * 4 × 4 on them (first operand = most significant local bit); R is the 4 × 4 cross matrix with
 * the entries between different ctrl values left 0. Null (nothing touched) when U is not
 * two-block, a bit is 0, or `needed` asks for an entry the kernel does not sum.
 */
export function wasmTwoBlockStep(
  w: WasmBinding,
  lre: Float64Array,
  lim: Float64Array,
  pre: Float64Array,
  pim: Float64Array,
  bits: readonly number[],
  u: Float64Array,
  needed: number,
  updateLambda: boolean,
): Float64Array | null {
  if (bits.length !== 2 || bits[0] === 0 || bits[1] === 0) return null;
  const operand = classifyMatrix(u, 4).blockOperand;
  if (operand < 0) return null;
  // local index of (ctrl bit c, tgt bit t): 2c + t when ctrl is the first operand, else 2t + c
  const local = (c: number, t: number): number => (operand === 0 ? 2 * c + t : 2 * t + c);
  let summed = 0;
  for (let c = 0; c < 2; c++)
    for (let a = 0; a < 2; a++)
      for (let b = 0; b < 2; b++) summed |= 1 << (4 * local(c, a) + local(c, b));
  if ((needed & ~summed) !== 0) return null;
  const [A, B] = twoBlocks(u, operand);
  w.scratch.set(A.subarray(0, 8));
  w.scratch.set(B.subarray(0, 8), 8);
  const out = w.scratchAt + STEP_OUT;
  w.k.twoBlockStep(
    lre.byteOffset,
    lim.byteOffset,
    pre.byteOffset,
    pim.byteOffset,
    pre.length,
    bits[operand],
    bits[1 - operand],
    w.scratchAt,
    out,
    updateLambda ? 1 : 0,
  );
  const s = w.scratch.subarray(STEP_OUT / 8, STEP_OUT / 8 + 16);
  const r = new Float64Array(32);
  for (let c = 0; c < 2; c++)
    for (let a = 0; a < 2; a++)
      for (let b = 0; b < 2; b++) {
        const e = 4 * local(c, a) + local(c, b);
        const k = 8 * c + 4 * a + 2 * b;
        r[2 * e] = s[k];
        r[2 * e + 1] = s[k + 1];
      }
  return r;
}

/** Byte offset in the scratch slot of the two-block step's sums (after its 16 matrix numbers). */
const STEP_OUT = 256;

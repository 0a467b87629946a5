/**
 * Gate kernels on amplitudes bound to a kernel memory (runtime.ts). Same matrix convention
 * as statevector/kernels-general.ts; the lanes evaluate the JavaScript kernels' expressions in
 * their order, so results are bit-identical to them.
 */
import type { WasmBinding } from "./runtime";

/** Dense 1-qubit gate on index bit q (real kernel when every imaginary part is zero). */
export function wasm1q(
  w: WasmBinding,
  re: Float64Array,
  im: Float64Array,
  q: number,
  m: Float64Array,
  real: boolean,
): void {
  w.scratch.set(m.subarray(0, 8));
  if (real) w.k.real1q(re.byteOffset, im.byteOffset, re.length, q, w.scratchAt);
  else w.k.general1q(re.byteOffset, im.byteOffset, re.length, q, w.scratchAt);
}

/** Dense 2-qubit gate; `first`/`second` are the index bits of the operands. */
export function wasm2q(
  w: WasmBinding,
  re: Float64Array,
  im: Float64Array,
  first: number,
  second: number,
  m: Float64Array,
): void {
  w.scratch.set(m.subarray(0, 32));
  w.k.general2q(re.byteOffset, im.byteOffset, re.length, first, second, w.scratchAt);
}

/** Two-block 2-qubit gate |0⟩⟨0|_ctrl ⊗ A + |1⟩⟨1|_ctrl ⊗ B on index bits ctrl, tgt. */
export function wasmTwoBlock(
  w: WasmBinding,
  re: Float64Array,
  im: Float64Array,
  ctrl: number,
  tgt: number,
  A: Float64Array,
  B: Float64Array,
): void {
  w.scratch.set(A.subarray(0, 8));
  w.scratch.set(B.subarray(0, 8), 8);
  w.k.twoBlock(re.byteOffset, im.byteOffset, re.length, ctrl, tgt, w.scratchAt);
}

/**
 * A noisy 1-qubit gate on ρ (or a slice of it) bound to a kernel memory, qubit q ≥ 1
 * (density-matrix/noisy-gate-1q.ts): U (interleaved 2 × 2), then the channel's numbers.
 */
export function wasmNoisy1q(
  w: WasmBinding,
  re: Float64Array,
  im: Float64Array,
  n: number,
  q: number,
  m: Float64Array,
  real: boolean,
  channel: readonly [keep: number, mix: number, gamma: number, pop: number, coh: number],
): void {
  w.scratch.set(m.subarray(0, 8));
  w.scratch.set(channel, 8);
  w.k.noisy1q(re.byteOffset, im.byteOffset, re.length, n, q, w.scratchAt, real ? 1 : 0);
}

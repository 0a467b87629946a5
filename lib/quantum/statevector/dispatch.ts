/**
 * Chooses the kernel for one gate on raw split re/im amplitude arrays. Shared by the
 * statevector (bits = qubits) and the density matrix (bits = qubits + n for rows,
 * qubits for columns of the vectorised ρ). Matrix convention as in types.ts.
 */
import {
  applyGeneral1q,
  applyGeneral2q,
  applyGeneralK,
  applyReal1q,
  applyReal2q,
  applyTwoBlock,
  localOffsets,
} from "./kernels-general";
import {
  applyDiagonal1q,
  applyPermutationSubset,
  applyPhaseSubset,
  applySubset2x2,
  applySubsetGeneral,
  applySwapSubset,
} from "./kernels-special";
import {
  classifyMatrix,
  subMatrix,
  twoBlocks,
  ZERO_TOL,
  type MatrixShape,
} from "./matrix-classify";
import { wasm1q, wasm2q, wasmTwoBlock } from "../wasm/kernels";
import { wasmBinding } from "../wasm/runtime";

/** True when every imaginary part of the interleaved matrix is exactly zero. */
export function isRealMatrix(m: Float64Array): boolean {
  for (let i = 1; i < m.length; i += 2) if (m[i] !== 0) return false;
  return true;
}

/**
 * The dense path only (no structure detection): the reference the specialised kernels
 * are tested against. Amplitudes in a kernel memory go through the WebAssembly kernels
 * (1 and 2 qubits), every other array through the JavaScript ones.
 */
export function applyDense(
  re: Float64Array,
  im: Float64Array,
  bits: readonly number[],
  m: Float64Array,
): void {
  const k = bits.length;
  const w = k <= 2 ? wasmBinding(re, im) : undefined;
  if (w) {
    if (k === 1) wasm1q(w, re, im, bits[0], m, isRealMatrix(m));
    else wasm2q(w, re, im, bits[0], bits[1], m);
    return;
  }
  if (k === 1) {
    if (isRealMatrix(m)) applyReal1q(re, im, bits[0], m);
    else applyGeneral1q(re, im, bits[0], m);
  } else if (k === 2) {
    applyGeneral2q(re, im, bits[0], bits[1], m);
  } else {
    applyGeneralK(re, im, bits, m);
  }
}

/** ψ ← (U on index bits `bits`) ψ, in place, with the cheapest kernel for U's structure. */
export function applyToAmplitudes(
  re: Float64Array,
  im: Float64Array,
  bits: readonly number[],
  m: Float64Array,
): void {
  applyWithShape(re, im, bits, m, classifyMatrix(m, 1 << bits.length));
}

/** As applyToAmplitudes, with the matrix already classified. */
export function applyWithShape(
  re: Float64Array,
  im: Float64Array,
  bits: readonly number[],
  m: Float64Array,
  shape: MatrixShape,
): void {
  const k = bits.length;
  const d = 1 << k;
  const { active } = shape;
  if (active.length === 0) return; // identity (e.g. `id`, or a gate fused with its inverse)
  const offsets = localOffsets(bits);
  const mask = offsets[d - 1];
  const count = re.length >>> k;
  // In a kernel memory the SIMD dense 1-qubit kernel beats the scalar diagonal one on a
  // full 1-qubit diagonal (rz): npm run bench, ansatz row.
  const simd1q = k === 1 && active.length === 2 && wasmBinding(re, im) !== undefined;
  if (shape.diagonal) {
    if (simd1q) {
      applyDense(re, im, bits, m);
      return;
    }
    if (k === 1 && active[active.length - 1] === 1) {
      applyDiagonal1q(re, im, bits[0], m[0], m[1], m[6], m[7], active.length === 1);
      return;
    }
    const s = active.length;
    const offs = new Int32Array(s);
    const pr = new Float64Array(s);
    const pi = new Float64Array(s);
    for (let a = 0; a < s; a++) {
      offs[a] = offsets[active[a]];
      pr[a] = m[2 * (active[a] * d + active[a])];
      pi[a] = m[2 * (active[a] * d + active[a]) + 1];
    }
    applyPhaseSubset(re, im, mask, count, offs, pr, pi);
    return;
  }
  if (shape.permutation) {
    const s = active.length;
    const dst = new Int32Array(s);
    const src = new Int32Array(s);
    const pr = new Float64Array(s);
    const pi = new Float64Array(s);
    let unitPhases = true;
    for (let a = 0; a < s; a++) {
      const r = active[a];
      const c = shape.source[r];
      dst[a] = offsets[r];
      src[a] = offsets[c];
      pr[a] = m[2 * (r * d + c)];
      pi[a] = m[2 * (r * d + c) + 1];
      if (Math.abs(pr[a] - 1) > ZERO_TOL || Math.abs(pi[a]) > ZERO_TOL) unitPhases = false;
    }
    if (s === 2 && unitPhases) applySwapSubset(re, im, mask, count, dst[0], dst[1]);
    else applyPermutationSubset(re, im, mask, count, dst, src, pr, pi);
    return;
  }
  if (active.length === d) {
    const w = k === 2 ? wasmBinding(re, im) : undefined;
    if (shape.blockOperand >= 0) {
      const [A, B] = twoBlocks(m, shape.blockOperand);
      const ctrl = bits[shape.blockOperand];
      const tgt = bits[1 - shape.blockOperand];
      if (w) wasmTwoBlock(w, re, im, ctrl, tgt, A, B);
      else applyTwoBlock(re, im, ctrl, tgt, A, B);
      return;
    }
    if (k === 2 && shape.real) {
      // the dense wasm kernel gives the real kernel's results (zero imaginary parts add ±0)
      if (w) wasm2q(w, re, im, bits[0], bits[1], m);
      else applyReal2q(re, im, bits[0], bits[1], m);
      return;
    }
    applyDense(re, im, bits, m);
    return;
  }
  const u = subMatrix(m, d, active);
  if (active.length === 2) {
    applySubset2x2(re, im, mask, count, offsets[active[0]], offsets[active[1]], u);
    return;
  }
  applySubsetGeneral(
    re,
    im,
    mask,
    count,
    Int32Array.from(active, (a) => offsets[a]),
    u,
  );
}

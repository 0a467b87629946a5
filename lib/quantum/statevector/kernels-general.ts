/**
 * General (dense) in-place kernels on split re/im amplitude arrays of length 2^m.
 *
 * `bits` are the index bits the gate acts on, in operand order: the FIRST operand is the
 * most significant bit of the gate's local index (types.ts convention), i.e. local index
 * i = Σ_j b_j · 2^(k−1−j) where b_j is index bit `bits[j]`. The matrix is 2^k × 2^k,
 * row-major, interleaved (re, im). Each kernel computes ψ' = (U ⊗ I_rest) ψ.
 */
import { applySubsetGeneral } from "./kernels-special";

/** Offsets (as index bit masks) of the 2^k local basis states, in local-index order. */
export function localOffsets(bits: readonly number[]): Int32Array {
  const k = bits.length;
  const d = 1 << k;
  const offsets = new Int32Array(d);
  for (let i = 0; i < d; i++) {
    let off = 0;
    for (let j = 0; j < k; j++) if ((i >> (k - 1 - j)) & 1) off |= 1 << bits[j];
    offsets[i] = off;
  }
  return offsets;
}

/** General 1-qubit kernel on index bit `q` (2×2 matrix). Bit 0 has its own loop: pairs are adjacent. */
export function applyGeneral1q(re: Float64Array, im: Float64Array, q: number, m: Float64Array): void {
  const ar = m[0], ai = m[1], br = m[2], bi = m[3];
  const cr = m[4], ci = m[5], dr = m[6], di = m[7];
  const len = re.length;
  if (q === 0) {
    for (let i = 0; i < len; i += 2) {
      const x0 = re[i], y0 = im[i], x1 = re[i + 1], y1 = im[i + 1];
      re[i] = ar * x0 - ai * y0 + br * x1 - bi * y1;
      im[i] = ar * y0 + ai * x0 + br * y1 + bi * x1;
      re[i + 1] = cr * x0 - ci * y0 + dr * x1 - di * y1;
      im[i + 1] = cr * y0 + ci * x0 + dr * y1 + di * x1;
    }
    return;
  }
  const half = 1 << q;
  const step = half << 1;
  for (let blk = 0; blk < len; blk += step) {
    const end = blk + half;
    for (let i = blk; i < end; i++) {
      const j = i + half;
      const x0 = re[i], y0 = im[i], x1 = re[j], y1 = im[j];
      re[i] = ar * x0 - ai * y0 + br * x1 - bi * y1;
      im[i] = ar * y0 + ai * x0 + br * y1 + bi * x1;
      re[j] = cr * x0 - ci * y0 + dr * x1 - di * y1;
      im[j] = cr * y0 + ci * x0 + dr * y1 + di * x1;
    }
  }
}

/** General 1-qubit kernel for a REAL 2×2 matrix (e.g. ry, h): half the multiplications. */
export function applyReal1q(re: Float64Array, im: Float64Array, q: number, m: Float64Array): void {
  const a = m[0], b = m[2], c = m[4], d = m[6];
  const len = re.length;
  if (q === 0) {
    for (let i = 0; i < len; i += 2) {
      const x0 = re[i], y0 = im[i], x1 = re[i + 1], y1 = im[i + 1];
      re[i] = a * x0 + b * x1;
      im[i] = a * y0 + b * y1;
      re[i + 1] = c * x0 + d * x1;
      im[i + 1] = c * y0 + d * y1;
    }
    return;
  }
  const half = 1 << q;
  const step = half << 1;
  for (let blk = 0; blk < len; blk += step) {
    const end = blk + half;
    for (let i = blk; i < end; i++) {
      const j = i + half;
      const x0 = re[i], y0 = im[i], x1 = re[j], y1 = im[j];
      re[i] = a * x0 + b * x1;
      im[i] = a * y0 + b * y1;
      re[j] = c * x0 + d * x1;
      im[j] = c * y0 + d * y1;
    }
  }
}

/**
 * General 2-qubit kernel: `first`/`second` are the index bits of the first/second operand
 * (local index = 2·b_first + b_second). Four amplitudes per base index, 16 complex products.
 */
export function applyGeneral2q(
  re: Float64Array,
  im: Float64Array,
  first: number,
  second: number,
  m: Float64Array,
): void {
  const o1 = 1 << second;
  const o2 = 1 << first;
  const o3 = o1 | o2;
  const notMask = ~o3;
  const count = re.length >>> 2;
  for (let t = 0, b = 0; t < count; t++, b = ((b | o3) + 1) & notMask) {
    const i1 = b | o1, i2 = b | o2, i3 = b | o3;
    const x0 = re[b], y0 = im[b], x1 = re[i1], y1 = im[i1];
    const x2 = re[i2], y2 = im[i2], x3 = re[i3], y3 = im[i3];
    re[b] = m[0] * x0 - m[1] * y0 + m[2] * x1 - m[3] * y1 + m[4] * x2 - m[5] * y2 + m[6] * x3 - m[7] * y3;
    im[b] = m[0] * y0 + m[1] * x0 + m[2] * y1 + m[3] * x1 + m[4] * y2 + m[5] * x2 + m[6] * y3 + m[7] * x3;
    re[i1] = m[8] * x0 - m[9] * y0 + m[10] * x1 - m[11] * y1 + m[12] * x2 - m[13] * y2 + m[14] * x3 - m[15] * y3;
    im[i1] = m[8] * y0 + m[9] * x0 + m[10] * y1 + m[11] * x1 + m[12] * y2 + m[13] * x2 + m[14] * y3 + m[15] * x3;
    re[i2] = m[16] * x0 - m[17] * y0 + m[18] * x1 - m[19] * y1 + m[20] * x2 - m[21] * y2 + m[22] * x3 - m[23] * y3;
    im[i2] = m[16] * y0 + m[17] * x0 + m[18] * y1 + m[19] * x1 + m[20] * y2 + m[21] * x2 + m[22] * y3 + m[23] * x3;
    re[i3] = m[24] * x0 - m[25] * y0 + m[26] * x1 - m[27] * y1 + m[28] * x2 - m[29] * y2 + m[30] * x3 - m[31] * y3;
    im[i3] = m[24] * y0 + m[25] * x0 + m[26] * y1 + m[27] * x1 + m[28] * y2 + m[29] * x2 + m[30] * y3 + m[31] * x3;
  }
}

/** General k-qubit kernel (any k ≥ 1): gather 2^k amplitudes, multiply, scatter. */
export function applyGeneralK(re: Float64Array, im: Float64Array, bits: readonly number[], m: Float64Array): void {
  const offsets = localOffsets(bits);
  applySubsetGeneral(re, im, offsets[offsets.length - 1], re.length >>> bits.length, offsets, m);
}

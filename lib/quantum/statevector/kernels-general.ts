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

/**
 * General 1-qubit kernel on index bit `q` (2×2 matrix [[a, b], [c, d]]):
 * (ψ_i, ψ_j) ← (a ψ_i + b ψ_j, c ψ_i + d ψ_j) for every pair j = i | 2^q.
 * Bit 0 has its own loop (pairs are adjacent); loops are unrolled by two pairs for
 * instruction-level parallelism (the kernel is compute-bound in scalar JS).
 */
export function applyGeneral1q(
  re: Float64Array,
  im: Float64Array,
  q: number,
  m: Float64Array,
): void {
  const ar = m[0],
    ai = m[1],
    br = m[2],
    bi = m[3];
  const cr = m[4],
    ci = m[5],
    dr = m[6],
    di = m[7];
  const len = re.length;
  if (q === 0) {
    let i = 0;
    for (; i + 3 < len; i += 4) {
      const x0 = re[i],
        y0 = im[i],
        x1 = re[i + 1],
        y1 = im[i + 1];
      const u0 = re[i + 2],
        v0 = im[i + 2],
        u1 = re[i + 3],
        v1 = im[i + 3];
      re[i] = ar * x0 - ai * y0 + br * x1 - bi * y1;
      im[i] = ar * y0 + ai * x0 + br * y1 + bi * x1;
      re[i + 1] = cr * x0 - ci * y0 + dr * x1 - di * y1;
      im[i + 1] = cr * y0 + ci * x0 + dr * y1 + di * x1;
      re[i + 2] = ar * u0 - ai * v0 + br * u1 - bi * v1;
      im[i + 2] = ar * v0 + ai * u0 + br * v1 + bi * u1;
      re[i + 3] = cr * u0 - ci * v0 + dr * u1 - di * v1;
      im[i + 3] = cr * v0 + ci * u0 + dr * v1 + di * u1;
    }
    for (; i < len; i += 2) {
      const x0 = re[i],
        y0 = im[i],
        x1 = re[i + 1],
        y1 = im[i + 1];
      re[i] = ar * x0 - ai * y0 + br * x1 - bi * y1;
      im[i] = ar * y0 + ai * x0 + br * y1 + bi * x1;
      re[i + 1] = cr * x0 - ci * y0 + dr * x1 - di * y1;
      im[i + 1] = cr * y0 + ci * x0 + dr * y1 + di * x1;
    }
    return;
  }
  const half = 1 << q; // even for q ≥ 1
  const step = half << 1;
  // for q = 1 one flat loop (blocks of 4 amplitudes: pairs (i, i+2) and (i+1, i+3))
  const inner = q === 1 ? len : half;
  const outerStep = q === 1 ? len : step;
  const inc = q === 1 ? 4 : 2;
  for (let blk = 0; blk < len; blk += outerStep) {
    const end = blk + inner;
    for (let i = blk, j = blk + half; i < end; i += inc, j += inc) {
      const x0 = re[i],
        y0 = im[i],
        x1 = re[j],
        y1 = im[j];
      const u0 = re[i + 1],
        v0 = im[i + 1],
        u1 = re[j + 1],
        v1 = im[j + 1];
      re[i] = ar * x0 - ai * y0 + br * x1 - bi * y1;
      im[i] = ar * y0 + ai * x0 + br * y1 + bi * x1;
      re[j] = cr * x0 - ci * y0 + dr * x1 - di * y1;
      im[j] = cr * y0 + ci * x0 + dr * y1 + di * x1;
      re[i + 1] = ar * u0 - ai * v0 + br * u1 - bi * v1;
      im[i + 1] = ar * v0 + ai * u0 + br * v1 + bi * u1;
      re[j + 1] = cr * u0 - ci * v0 + dr * u1 - di * v1;
      im[j + 1] = cr * v0 + ci * u0 + dr * v1 + di * u1;
    }
  }
}

/** 1-qubit kernel for a REAL 2×2 matrix (e.g. ry, h): half the multiplications of the general one. */
export function applyReal1q(re: Float64Array, im: Float64Array, q: number, m: Float64Array): void {
  const a = m[0],
    b = m[2],
    c = m[4],
    d = m[6];
  const len = re.length;
  if (q === 0) {
    for (let i = 0; i < len; i += 2) {
      const x0 = re[i],
        y0 = im[i],
        x1 = re[i + 1],
        y1 = im[i + 1];
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
    for (let i = blk, j = blk + half; i < end; i += 2, j += 2) {
      const x0 = re[i],
        y0 = im[i],
        x1 = re[j],
        y1 = im[j];
      const u0 = re[i + 1],
        v0 = im[i + 1],
        u1 = re[j + 1],
        v1 = im[j + 1];
      re[i] = a * x0 + b * x1;
      im[i] = a * y0 + b * y1;
      re[j] = c * x0 + d * x1;
      im[j] = c * y0 + d * y1;
      re[i + 1] = a * u0 + b * u1;
      im[i + 1] = a * v0 + b * v1;
      re[j + 1] = c * u0 + d * u1;
      im[j + 1] = c * v0 + d * v1;
    }
  }
}

/**
 * Two-block 2-qubit kernel: U = |0⟩⟨0|_ctrl ⊗ A + |1⟩⟨1|_ctrl ⊗ B (block-diagonal in the
 * basis of index bit `ctrl`), with 2×2 blocks A, B acting on index bit `tgt`. This is the
 * shape of a cx fused with 1-qubit gates on its target: one pass at the cost of a 1q gate.
 */
export function applyTwoBlock(
  re: Float64Array,
  im: Float64Array,
  ctrl: number,
  tgt: number,
  A: Float64Array,
  B: Float64Array,
): void {
  const ar = A[0],
    ai = A[1],
    br = A[2],
    bi = A[3],
    cr = A[4],
    ci = A[5],
    dr = A[6],
    di = A[7];
  const er = B[0],
    ei = B[1],
    fr = B[2],
    fi = B[3],
    gr = B[4],
    gi = B[5],
    hr = B[6],
    hi = B[7];
  const oc = 1 << ctrl,
    ot = 1 << tgt,
    mask = oc | ot,
    notMask = ~mask;
  const count = re.length >>> 2;
  for (let t = 0, b = 0; t < count; t++, b = ((b | mask) + 1) & notMask) {
    const j = b | ot,
      k = b | oc,
      l = b | mask;
    const x0 = re[b],
      y0 = im[b],
      x1 = re[j],
      y1 = im[j];
    const u0 = re[k],
      v0 = im[k],
      u1 = re[l],
      v1 = im[l];
    re[b] = ar * x0 - ai * y0 + br * x1 - bi * y1;
    im[b] = ar * y0 + ai * x0 + br * y1 + bi * x1;
    re[j] = cr * x0 - ci * y0 + dr * x1 - di * y1;
    im[j] = cr * y0 + ci * x0 + dr * y1 + di * x1;
    re[k] = er * u0 - ei * v0 + fr * u1 - fi * v1;
    im[k] = er * v0 + ei * u0 + fr * v1 + fi * u1;
    re[l] = gr * u0 - gi * v0 + hr * u1 - hi * v1;
    im[l] = gr * v0 + gi * u0 + hr * v1 + hi * u1;
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
  const a0 = m[0],
    a1 = m[1],
    a2 = m[2],
    a3 = m[3],
    a4 = m[4],
    a5 = m[5],
    a6 = m[6],
    a7 = m[7];
  const b0 = m[8],
    b1 = m[9],
    b2 = m[10],
    b3 = m[11],
    b4 = m[12],
    b5 = m[13],
    b6 = m[14],
    b7 = m[15];
  const c0 = m[16],
    c1 = m[17],
    c2 = m[18],
    c3 = m[19],
    c4 = m[20],
    c5 = m[21],
    c6 = m[22],
    c7 = m[23];
  const d0 = m[24],
    d1 = m[25],
    d2 = m[26],
    d3 = m[27],
    d4 = m[28],
    d5 = m[29],
    d6 = m[30],
    d7 = m[31];
  for (let t = 0, b = 0; t < count; t++, b = ((b | o3) + 1) & notMask) {
    const i1 = b | o1,
      i2 = b | o2,
      i3 = b | o3;
    const x0 = re[b],
      y0 = im[b],
      x1 = re[i1],
      y1 = im[i1];
    const x2 = re[i2],
      y2 = im[i2],
      x3 = re[i3],
      y3 = im[i3];
    re[b] = a0 * x0 - a1 * y0 + a2 * x1 - a3 * y1 + a4 * x2 - a5 * y2 + a6 * x3 - a7 * y3;
    im[b] = a0 * y0 + a1 * x0 + a2 * y1 + a3 * x1 + a4 * y2 + a5 * x2 + a6 * y3 + a7 * x3;
    re[i1] = b0 * x0 - b1 * y0 + b2 * x1 - b3 * y1 + b4 * x2 - b5 * y2 + b6 * x3 - b7 * y3;
    im[i1] = b0 * y0 + b1 * x0 + b2 * y1 + b3 * x1 + b4 * y2 + b5 * x2 + b6 * y3 + b7 * x3;
    re[i2] = c0 * x0 - c1 * y0 + c2 * x1 - c3 * y1 + c4 * x2 - c5 * y2 + c6 * x3 - c7 * y3;
    im[i2] = c0 * y0 + c1 * x0 + c2 * y1 + c3 * x1 + c4 * y2 + c5 * x2 + c6 * y3 + c7 * x3;
    re[i3] = d0 * x0 - d1 * y0 + d2 * x1 - d3 * y1 + d4 * x2 - d5 * y2 + d6 * x3 - d7 * y3;
    im[i3] = d0 * y0 + d1 * x0 + d2 * y1 + d3 * x1 + d4 * y2 + d5 * x2 + d6 * y3 + d7 * x3;
  }
}

/** 2-qubit kernel for a REAL 4×4 matrix (e.g. ry layers fused with cx/cz): half the products. */
export function applyReal2q(
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
  const a0 = m[0],
    a1 = m[2],
    a2 = m[4],
    a3 = m[6];
  const b0 = m[8],
    b1 = m[10],
    b2 = m[12],
    b3 = m[14];
  const c0 = m[16],
    c1 = m[18],
    c2 = m[20],
    c3 = m[22];
  const d0 = m[24],
    d1 = m[26],
    d2 = m[28],
    d3 = m[30];
  for (let t = 0, b = 0; t < count; t++, b = ((b | o3) + 1) & notMask) {
    const i1 = b | o1,
      i2 = b | o2,
      i3 = b | o3;
    const x0 = re[b],
      y0 = im[b],
      x1 = re[i1],
      y1 = im[i1];
    const x2 = re[i2],
      y2 = im[i2],
      x3 = re[i3],
      y3 = im[i3];
    re[b] = a0 * x0 + a1 * x1 + a2 * x2 + a3 * x3;
    im[b] = a0 * y0 + a1 * y1 + a2 * y2 + a3 * y3;
    re[i1] = b0 * x0 + b1 * x1 + b2 * x2 + b3 * x3;
    im[i1] = b0 * y0 + b1 * y1 + b2 * y2 + b3 * y3;
    re[i2] = c0 * x0 + c1 * x1 + c2 * x2 + c3 * x3;
    im[i2] = c0 * y0 + c1 * y1 + c2 * y2 + c3 * y3;
    re[i3] = d0 * x0 + d1 * x1 + d2 * x2 + d3 * x3;
    im[i3] = d0 * y0 + d1 * y1 + d2 * y2 + d3 * y3;
  }
}

/** General k-qubit kernel (any k ≥ 1): gather 2^k amplitudes, multiply, scatter. */
export function applyGeneralK(
  re: Float64Array,
  im: Float64Array,
  bits: readonly number[],
  m: Float64Array,
): void {
  const offsets = localOffsets(bits);
  applySubsetGeneral(re, im, offsets[offsets.length - 1], re.length >>> bits.length, offsets, m);
}

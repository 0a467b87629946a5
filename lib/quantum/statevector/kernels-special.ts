/**
 * Specialised in-place kernels that touch only what a gate changes. Every kernel loops
 * over the base indices b whose target bits (set in `mask`) are all zero — enumerated with
 * the increment b ← ((b | mask) + 1) & ~mask — and works on the amplitudes b | offset.
 * `count` = 2^(m−k) base indices for an array of 2^m amplitudes and a k-bit mask.
 */

/** Diagonal 1-qubit gate diag(d0, d1) on bit q; when d0 = 1 only the bit=1 half is touched. */
export function applyDiagonal1q(
  re: Float64Array,
  im: Float64Array,
  q: number,
  d0r: number,
  d0i: number,
  d1r: number,
  d1i: number,
  skipZeroHalf: boolean,
): void {
  const len = re.length;
  const half = 1 << q;
  const step = half << 1;
  for (let blk = 0; blk < len; blk += step) {
    if (!skipZeroHalf) {
      for (let i = blk, end = blk + half; i < end; i++) {
        const x = re[i],
          y = im[i];
        re[i] = d0r * x - d0i * y;
        im[i] = d0r * y + d0i * x;
      }
    }
    for (let i = blk + half, end = blk + step; i < end; i++) {
      const x = re[i],
        y = im[i];
      re[i] = d1r * x - d1i * y;
      im[i] = d1r * y + d1i * x;
    }
  }
}

/** Multiplies amplitude b | offsets[a] by phase a (for every base b): diagonal gates. */
export function applyPhaseSubset(
  re: Float64Array,
  im: Float64Array,
  mask: number,
  count: number,
  offsets: Int32Array,
  phRe: Float64Array,
  phIm: Float64Array,
): void {
  const s = offsets.length;
  const notMask = ~mask;
  if (s === 1) {
    const o = offsets[0],
      pr = phRe[0],
      pi = phIm[0];
    for (let t = 0, b = 0; t < count; t++, b = ((b | mask) + 1) & notMask) {
      const i = b | o;
      const x = re[i],
        y = im[i];
      re[i] = pr * x - pi * y;
      im[i] = pr * y + pi * x;
    }
    return;
  }
  for (let t = 0, b = 0; t < count; t++, b = ((b | mask) + 1) & notMask) {
    for (let a = 0; a < s; a++) {
      const i = b | offsets[a];
      const x = re[i],
        y = im[i],
        pr = phRe[a],
        pi = phIm[a];
      re[i] = pr * x - pi * y;
      im[i] = pr * y + pi * x;
    }
  }
}

/** Exchanges amplitudes b | offA and b | offB (x, cx, ccx, swap: a 2-cycle with unit phases). */
export function applySwapSubset(
  re: Float64Array,
  im: Float64Array,
  mask: number,
  count: number,
  offA: number,
  offB: number,
): void {
  const notMask = ~mask;
  for (let t = 0, b = 0; t < count; t++, b = ((b | mask) + 1) & notMask) {
    const i = b | offA,
      j = b | offB;
    const x = re[i],
      y = im[i];
    re[i] = re[j];
    im[i] = im[j];
    re[j] = x;
    im[j] = y;
  }
}

/** Permutation with phases on the active set: ψ'[b|dst[a]] = phase[a] · ψ[b|src[a]]. */
export function applyPermutationSubset(
  re: Float64Array,
  im: Float64Array,
  mask: number,
  count: number,
  dst: Int32Array,
  src: Int32Array,
  phRe: Float64Array,
  phIm: Float64Array,
): void {
  const s = dst.length;
  const notMask = ~mask;
  const tr = new Float64Array(s);
  const ti = new Float64Array(s);
  for (let t = 0, b = 0; t < count; t++, b = ((b | mask) + 1) & notMask) {
    for (let a = 0; a < s; a++) {
      tr[a] = re[b | src[a]];
      ti[a] = im[b | src[a]];
    }
    for (let a = 0; a < s; a++) {
      const i = b | dst[a],
        x = tr[a],
        y = ti[a],
        pr = phRe[a],
        pi = phIm[a];
      re[i] = pr * x - pi * y;
      im[i] = pr * y + pi * x;
    }
  }
}

/** A 2×2 block u on the pair (b | offA, b | offB): controlled 1-qubit gates (control=1 subspace). */
export function applySubset2x2(
  re: Float64Array,
  im: Float64Array,
  mask: number,
  count: number,
  offA: number,
  offB: number,
  u: Float64Array,
): void {
  const ar = u[0],
    ai = u[1],
    br = u[2],
    bi = u[3];
  const cr = u[4],
    ci = u[5],
    dr = u[6],
    di = u[7];
  const notMask = ~mask;
  for (let t = 0, b = 0; t < count; t++, b = ((b | mask) + 1) & notMask) {
    const i = b | offA,
      j = b | offB;
    const x0 = re[i],
      y0 = im[i],
      x1 = re[j],
      y1 = im[j];
    re[i] = ar * x0 - ai * y0 + br * x1 - bi * y1;
    im[i] = ar * y0 + ai * x0 + br * y1 + bi * x1;
    re[j] = cr * x0 - ci * y0 + dr * x1 - di * y1;
    im[j] = cr * y0 + ci * x0 + dr * y1 + di * x1;
  }
}

/** A dense s×s block u on the amplitudes b | offsets[·] (general gate restricted to its active set). */
export function applySubsetGeneral(
  re: Float64Array,
  im: Float64Array,
  mask: number,
  count: number,
  offsets: Int32Array,
  u: Float64Array,
): void {
  const s = offsets.length;
  const notMask = ~mask;
  const tr = new Float64Array(s);
  const ti = new Float64Array(s);
  for (let t = 0, b = 0; t < count; t++, b = ((b | mask) + 1) & notMask) {
    for (let c = 0; c < s; c++) {
      tr[c] = re[b | offsets[c]];
      ti[c] = im[b | offsets[c]];
    }
    for (let r = 0; r < s; r++) {
      let sr = 0,
        si = 0;
      const row = 2 * r * s;
      for (let c = 0; c < s; c++) {
        const mr = u[row + 2 * c],
          mi = u[row + 2 * c + 1];
        sr += mr * tr[c] - mi * ti[c];
        si += mr * ti[c] + mi * tr[c];
      }
      re[b | offsets[r]] = sr;
      im[b | offsets[r]] = si;
    }
  }
}

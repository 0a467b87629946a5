/**
 * Re⟨λ| (D on `bits`) |φ⟩ for a 2^k × 2^k matrix D (types.ts convention, first operand =
 * most significant local bit) — one read-only pass over both vectors, the quantity the
 * adjoint method needs for every gate angle. Base indices b (all target bits zero) are
 * enumerated as in the specialised kernels: b ← ((b | mask) + 1) & ~mask.
 */
import { localOffsets } from "../statevector/kernels-general";

export function realInnerLocal(
  lre: Float64Array,
  lim: Float64Array,
  pre: Float64Array,
  pim: Float64Array,
  bits: readonly number[],
  m: Float64Array,
): number {
  if (bits.length === 1) return inner1q(lre, lim, pre, pim, bits[0], m);
  const offsets = localOffsets(bits);
  const s = offsets.length;
  const mask = offsets[s - 1];
  const notMask = ~mask;
  const count = pre.length >>> bits.length;
  const tr = new Float64Array(s);
  const ti = new Float64Array(s);
  let acc = 0;
  for (let t = 0, b = 0; t < count; t++, b = ((b | mask) + 1) & notMask) {
    for (let c = 0; c < s; c++) {
      tr[c] = pre[b | offsets[c]];
      ti[c] = pim[b | offsets[c]];
    }
    for (let r = 0; r < s; r++) {
      let sr = 0;
      let si = 0;
      const row = 2 * r * s;
      for (let c = 0; c < s; c++) {
        const mr = m[row + 2 * c];
        const mi = m[row + 2 * c + 1];
        sr += mr * tr[c] - mi * ti[c];
        si += mr * ti[c] + mi * tr[c];
      }
      // Re(conj(λ)·w) = λr·wr + λi·wi
      acc += lre[b | offsets[r]] * sr + lim[b | offsets[r]] * si;
    }
  }
  return acc;
}

function inner1q(
  lre: Float64Array,
  lim: Float64Array,
  pre: Float64Array,
  pim: Float64Array,
  q: number,
  m: Float64Array,
): number {
  const ar = m[0],
    ai = m[1],
    br = m[2],
    bi = m[3];
  const cr = m[4],
    ci = m[5],
    dr = m[6],
    di = m[7];
  const len = pre.length;
  const half = 1 << q;
  const step = half << 1;
  let acc = 0;
  for (let blk = 0; blk < len; blk += step) {
    for (let i = blk, j = blk + half, end = blk + half; i < end; i++, j++) {
      const x0 = pre[i],
        y0 = pim[i],
        x1 = pre[j],
        y1 = pim[j];
      const w0r = ar * x0 - ai * y0 + br * x1 - bi * y1;
      const w0i = ar * y0 + ai * x0 + br * y1 + bi * x1;
      const w1r = cr * x0 - ci * y0 + dr * x1 - di * y1;
      const w1i = cr * y0 + ci * x0 + dr * y1 + di * x1;
      acc += lre[i] * w0r + lim[i] * w0i + lre[j] * w1r + lim[j] * w1i;
    }
  }
  return acc;
}

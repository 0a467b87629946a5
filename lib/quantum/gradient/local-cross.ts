/**
 * The local cross matrix of two vectors on index bits `bits`:
 *   R[a][b] = Σ_r conj(λ[r ⊕ a]) · φ[r ⊕ b]
 * (r runs over the indices with every target bit zero; a, b are local indices in the
 * types.ts convention, first operand = most significant local bit). Then for any
 * 2^k × 2^k matrix M on those bits, ⟨λ|M|φ⟩ = Σ_{a,b} M[a][b] · R[a][b]: one read-only
 * pass over both vectors serves every angle of a fused block (adjoint.ts).
 * Output: 2^k × 2^k, row-major, interleaved (re, im). For two bits, `needed` selects the
 * entries to compute (bit 4a + b for R[a][b]; the others are left 0).
 */
import { localOffsets } from "../statevector/kernels-general";

export function crossLocal(
  lre: Float64Array,
  lim: Float64Array,
  pre: Float64Array,
  pim: Float64Array,
  bits: readonly number[],
  needed = 0xffff,
): Float64Array {
  if (bits.length === 1) return cross1q(lre, lim, pre, pim, bits[0]);
  if (bits.length === 2) return cross2q(lre, lim, pre, pim, bits[0], bits[1], needed);
  const offsets = localOffsets(bits);
  const s = offsets.length;
  const mask = offsets[s - 1];
  const notMask = ~mask;
  const count = pre.length >>> bits.length;
  const out = new Float64Array(2 * s * s);
  const lr = new Float64Array(s);
  const li = new Float64Array(s);
  const pr = new Float64Array(s);
  const pi = new Float64Array(s);
  for (let t = 0, b = 0; t < count; t++, b = ((b | mask) + 1) & notMask) {
    for (let c = 0; c < s; c++) {
      const o = b | offsets[c];
      lr[c] = lre[o];
      li[c] = lim[o];
      pr[c] = pre[o];
      pi[c] = pim[o];
    }
    for (let r = 0, w = 0; r < s; r++) {
      const xr = lr[r];
      const xi = li[r];
      for (let c = 0; c < s; c++, w += 2) {
        // conj(λ_r)·φ_c = (xr − i·xi)(pr + i·pi)
        out[w] += xr * pr[c] + xi * pi[c];
        out[w + 1] += xr * pi[c] - xi * pr[c];
      }
    }
  }
  return out;
}

function cross1q(
  lre: Float64Array,
  lim: Float64Array,
  pre: Float64Array,
  pim: Float64Array,
  q: number,
): Float64Array {
  const len = pre.length;
  const half = 1 << q;
  const step = half << 1;
  let r00 = 0,
    i00 = 0,
    r01 = 0,
    i01 = 0,
    r10 = 0,
    i10 = 0,
    r11 = 0,
    i11 = 0;
  for (let blk = 0; blk < len; blk += step) {
    for (let i = blk, j = blk + half, end = blk + half; i < end; i++, j++) {
      const a0 = lre[i],
        b0 = lim[i],
        a1 = lre[j],
        b1 = lim[j];
      const x0 = pre[i],
        y0 = pim[i],
        x1 = pre[j],
        y1 = pim[j];
      r00 += a0 * x0 + b0 * y0;
      i00 += a0 * y0 - b0 * x0;
      r01 += a0 * x1 + b0 * y1;
      i01 += a0 * y1 - b0 * x1;
      r10 += a1 * x0 + b1 * y0;
      i10 += a1 * y0 - b1 * x0;
      r11 += a1 * x1 + b1 * y1;
      i11 += a1 * y1 - b1 * x1;
    }
  }
  return Float64Array.of(r00, i00, r01, i01, r10, i10, r11, i11);
}

type Cross2q = (
  lre: Float64Array,
  lim: Float64Array,
  pre: Float64Array,
  pim: Float64Array,
  o1: number,
  o2: number,
  out: Float64Array,
) => void;

const cross2qCache = new Map<number, Cross2q>();

/**
 * Two bits: the entries selected by `needed` (bit 4a + b for R[a][b]) as sums held in
 * locals, generated per selection and cached (a loop over arrays costs 3× as much, and a
 * block's derivative matrices often touch only half of R, e.g. a cx fused with rotations
 * on its target). Only the selection's bit positions enter the generated source.
 */
function cross2qKernel(needed: number): Cross2q {
  const cached = cross2qCache.get(needed);
  if (cached) return cached;
  const used: [number, number][] = [];
  for (let a = 0; a < 4; a++)
    for (let b = 0; b < 4; b++) if ((needed >> (4 * a + b)) & 1) used.push([a, b]);
  const rows = new Set(used.map(([a]) => a));
  const cols = new Set(used.map(([, b]) => b));
  const lines: string[] = [];
  lines.push("const mask = o1 | o2, notMask = ~mask, count = pre.length >>> 2;");
  for (const [a, b] of used) lines.push(`let r${a}${b} = 0, i${a}${b} = 0;`);
  lines.push("for (let t = 0, b0 = 0; t < count; t++, b0 = ((b0 | mask) + 1) & notMask) {");
  lines.push("const b1 = b0 | o1, b2 = b0 | o2, b3 = b0 | mask;");
  for (const a of rows) lines.push(`const l${a} = lre[b${a}], m${a} = lim[b${a}];`);
  for (const b of cols) lines.push(`const x${b} = pre[b${b}], y${b} = pim[b${b}];`);
  for (const [a, b] of used) {
    lines.push(`r${a}${b} += l${a} * x${b} + m${a} * y${b};`);
    lines.push(`i${a}${b} += l${a} * y${b} - m${a} * x${b};`);
  }
  lines.push("}");
  for (const [a, b] of used)
    lines.push(`out[${2 * (4 * a + b)}] = r${a}${b}; out[${2 * (4 * a + b) + 1}] = i${a}${b};`);
  const kernel = new Function(
    "lre",
    "lim",
    "pre",
    "pim",
    "o1",
    "o2",
    "out",
    lines.join("\n"),
  ) as Cross2q;
  if (cross2qCache.size < 256) cross2qCache.set(needed, kernel);
  return kernel;
}

function cross2q(
  lre: Float64Array,
  lim: Float64Array,
  pre: Float64Array,
  pim: Float64Array,
  first: number,
  second: number,
  needed: number,
): Float64Array {
  const out = new Float64Array(32);
  if (needed === 0) return out;
  const kernel = cross2qKernel(needed);
  const o1 = 1 << second;
  const o2 = 1 << first;
  kernel(lre, lim, pre, pim, o1, o2, out);
  return out;
}

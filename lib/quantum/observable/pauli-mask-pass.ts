/**
 * One pass over a statevector for every Pauli term that shares a flip mask x.
 *
 * For P = i^k X^x Z^z (k = number of Y factors, mod 4) write f(b) = conj(ψ_{b⊕x}) ψ_b and
 * s_z(b) = (−1)^{|b & z|}. Then ⟨P⟩ = Re(i^k S) with S = Σ_b s_z(b) f(b).
 * - x = 0 (diagonal terms): f(b) = |ψ_b|², S real, ⟨Z^z⟩ = S.
 * - x ≠ 0: pair b with c = b ⊕ x over the half where bit h (the highest bit of x) is 0;
 *   f(c) = conj f(b) and s_z(c) = (−1)^k s_z(b), so S = 2 Σ_half s_z Re f (k even) or
 *   2i Σ_half s_z Im f (k odd), and ⟨P⟩ = 2A for k ∈ {0, 3}, −2A for k ∈ {1, 2}, where A
 *   is that half-sum.
 *
 * Index split b = hi·2^L + lo. One pass over the pairs computes f on each block of 2^L low
 * indices; the sign factors as s_z(b) = s_{zh}(hi)·s_{zl}(lo), so each term only accumulates
 * buf_t[lo] += s_{zh}(hi)·f(lo) (a short cache-resident loop), and at the end
 * A_t = Σ_lo s_{zl}(lo)·buf_t[lo] with s_{zl} from a parity table cached per low z pattern.
 * The state is read once per mask, however many terms share it; a single term (the usual
 * case for random sums) instead accumulates s_{zl}(lo)·f(lo) in registers, block by block.
 */
import { POPCOUNT16 } from "./bits";

export interface MaskTerm {
  /** Index of the term in the caller's output. */
  index: number;
  z: number;
  /** Number of Y factors mod 4. */
  k: number;
}

/** Low index bits of the block split (blocks of 2^10 doubles stay in L1). */
export const LOW_BITS = 10;

const parityOf = (v: number): number => (POPCOUNT16[v & 0xffff] + POPCOUNT16[v >>> 16]) & 1;

/** ±1 tables s[lo] = (−1)^{|lo & zl|} over 2^bits entries, cached per low z pattern. */
export class SignTables {
  private readonly cache = new Map<number, Float64Array>();
  constructor(readonly bits: number) {}
  get(zl: number): Float64Array {
    let t = this.cache.get(zl);
    if (!t) {
      t = new Float64Array(1 << this.bits);
      for (let lo = 0; lo < t.length; lo++) t[lo] = parityOf(lo & zl) ? -1 : 1;
      this.cache.set(zl, t);
    }
    return t;
  }
}

/** k = |x & z| mod 4 (the number of Y factors). */
export const yCount = (x: number, z: number): number =>
  (POPCOUNT16[x & z & 0xffff] + POPCOUNT16[(x & z) >>> 16]) & 3;

/**
 * Writes ⟨P_t⟩ into out[t.index] for every term t with flip mask x, reading ψ once.
 * `signs.bits` is the block size L (≤ n).
 */
export function maskPassOnState(
  re: Float64Array,
  im: Float64Array,
  x: number,
  terms: readonly MaskTerm[],
  signs: SignTables,
  out: Float64Array,
): void {
  const L = signs.bits;
  const size = 1 << L;
  const lowMask = size - 1;
  const hiCount = re.length >>> L;
  const xl = x & lowMask;
  const xh = x >>> L;
  const h = x === 0 ? -1 : 31 - Math.clz32(x);
  // Blocks to visit: when h ≥ L the hi with bit h−L clear (full low runs); otherwise every hi,
  // low runs of length 2^h taken from the lower half of each 2^(h+1) group (h = −1: all of lo).
  const hiSkip = h >= L ? h - L : -1;
  const run = h >= L || h < 0 ? size : 1 << h;
  const stride = h >= L || h < 0 ? size : run << 1;
  const needRe = terms.some((t) => (t.k & 1) === 0);
  const needIm = terms.some((t) => (t.k & 1) === 1);
  const g = terms.length;
  if (g === 1) {
    const t = terms[0];
    const sl = signs.get(t.z & lowMask);
    const zh = t.z >>> L;
    let acc = 0;
    for (let hi = 0; hi < hiCount; hi++) {
      if (hiSkip >= 0 && (hi >>> hiSkip) & 1) continue;
      const bOff = hi << L;
      const cOff = (hi ^ xh) << L;
      let part = 0;
      for (let r0 = 0; r0 < size; r0 += stride) {
        if (x === 0) part += diagDot(re, im, sl, bOff, r0, r0 + run);
        else if (needRe) part += realDot(re, im, sl, bOff, cOff, xl, r0, r0 + run);
        else part += imagDot(re, im, sl, bOff, cOff, xl, r0, r0 + run);
      }
      acc += parityOf(hi & zh) ? -part : part;
    }
    out[t.index] = x === 0 ? acc : t.k === 0 || t.k === 3 ? 2 * acc : -2 * acc;
    return;
  }
  const zh = Int32Array.from(terms, (t) => t.z >>> L);
  const bufs = terms.map(() => new Float64Array(size));
  const fr = new Float64Array(size);
  const fi = new Float64Array(size);
  for (let hi = 0; hi < hiCount; hi++) {
    if (hiSkip >= 0 && (hi >>> hiSkip) & 1) continue;
    const bOff = hi << L;
    const cOff = (hi ^ xh) << L;
    if (x === 0) {
      fr.fill(0);
      diagRuns(re, im, bOff, size, 1, fr);
    } else {
      // f is rebuilt per block (visited positions are the same in every block)
      if (needRe) {
        fr.fill(0);
        realRuns(re, im, bOff, cOff, xl, run, stride, size, 1, fr);
      }
      if (needIm) {
        fi.fill(0);
        imagRuns(re, im, bOff, cOff, xl, run, stride, size, 1, fi);
      }
    }
    for (let t = 0; t < g; t++) {
      const f = (terms[t].k & 1) === 0 ? fr : fi;
      const buf = bufs[t];
      if (parityOf(hi & zh[t])) for (let lo = 0; lo < size; lo++) buf[lo] -= f[lo];
      else for (let lo = 0; lo < size; lo++) buf[lo] += f[lo];
    }
  }
  for (let t = 0; t < g; t++) {
    const sl = signs.get(terms[t].z & lowMask);
    const buf = bufs[t];
    let a0 = 0,
      a1 = 0;
    for (let lo = 0; lo < size; lo += 2) {
      a0 += sl[lo] * buf[lo];
      a1 += sl[lo + 1] * buf[lo + 1];
    }
    const a = size === 1 ? sl[0] * buf[0] : a0 + a1;
    const k = terms[t].k;
    out[terms[t].index] = x === 0 ? a : k === 0 || k === 3 ? 2 * a : -2 * a;
  }
}

/**
 * Σ_lo sl[lo]·Re(conj(ψ_c) ψ_b) for lo in [from, to), c = cOff + (lo ⊕ xl): four independent
 * accumulators so the additions do not wait on each other (single-term masks).
 */
function realDot(
  re: Float64Array,
  im: Float64Array,
  sl: Float64Array,
  bOff: number,
  cOff: number,
  xl: number,
  from: number,
  to: number,
): number {
  let p0 = 0;
  let p1 = 0;
  let p2 = 0;
  let p3 = 0;
  let lo = from;
  for (; lo + 3 < to; lo += 4) {
    const b = bOff + lo;
    let c = cOff + (lo ^ xl);
    p0 += sl[lo] * (re[c] * re[b] + im[c] * im[b]);
    c = cOff + ((lo + 1) ^ xl);
    p1 += sl[lo + 1] * (re[c] * re[b + 1] + im[c] * im[b + 1]);
    c = cOff + ((lo + 2) ^ xl);
    p2 += sl[lo + 2] * (re[c] * re[b + 2] + im[c] * im[b + 2]);
    c = cOff + ((lo + 3) ^ xl);
    p3 += sl[lo + 3] * (re[c] * re[b + 3] + im[c] * im[b + 3]);
  }
  for (; lo < to; lo++) {
    const b = bOff + lo;
    const c = cOff + (lo ^ xl);
    p0 += sl[lo] * (re[c] * re[b] + im[c] * im[b]);
  }
  return p0 + p1 + p2 + p3;
}

/** The same for Im(conj(ψ_c) ψ_b) = re_c·im_b − im_c·re_b. */
function imagDot(
  re: Float64Array,
  im: Float64Array,
  sl: Float64Array,
  bOff: number,
  cOff: number,
  xl: number,
  from: number,
  to: number,
): number {
  let p0 = 0;
  let p1 = 0;
  let p2 = 0;
  let p3 = 0;
  let lo = from;
  for (; lo + 3 < to; lo += 4) {
    const b = bOff + lo;
    let c = cOff + (lo ^ xl);
    p0 += sl[lo] * (re[c] * im[b] - im[c] * re[b]);
    c = cOff + ((lo + 1) ^ xl);
    p1 += sl[lo + 1] * (re[c] * im[b + 1] - im[c] * re[b + 1]);
    c = cOff + ((lo + 2) ^ xl);
    p2 += sl[lo + 2] * (re[c] * im[b + 2] - im[c] * re[b + 2]);
    c = cOff + ((lo + 3) ^ xl);
    p3 += sl[lo + 3] * (re[c] * im[b + 3] - im[c] * re[b + 3]);
  }
  for (; lo < to; lo++) {
    const b = bOff + lo;
    const c = cOff + (lo ^ xl);
    p0 += sl[lo] * (re[c] * im[b] - im[c] * re[b]);
  }
  return p0 + p1 + p2 + p3;
}

/** Σ_lo sl[lo]·|ψ_b|² for lo in [from, to). */
function diagDot(
  re: Float64Array,
  im: Float64Array,
  sl: Float64Array,
  bOff: number,
  from: number,
  to: number,
): number {
  let p0 = 0;
  let p1 = 0;
  let lo = from;
  for (; lo + 1 < to; lo += 2) {
    const b = bOff + lo;
    p0 += sl[lo] * (re[b] * re[b] + im[b] * im[b]);
    p1 += sl[lo + 1] * (re[b + 1] * re[b + 1] + im[b + 1] * im[b + 1]);
  }
  if (lo < to) p0 += sl[lo] * (re[bOff + lo] * re[bOff + lo] + im[bOff + lo] * im[bOff + lo]);
  return p0 + p1;
}

/** buf[lo] += s·|ψ_b|² over one block (b = bOff + lo). */
function diagRuns(
  re: Float64Array,
  im: Float64Array,
  bOff: number,
  size: number,
  s: number,
  buf: Float64Array,
): void {
  for (let lo = 0; lo < size; lo++) {
    const b = bOff + lo;
    buf[lo] += s * (re[b] * re[b] + im[b] * im[b]);
  }
}

/**
 * buf[lo] += s·Re(conj(ψ_c) ψ_b) for the visited lo of one block (c = cOff + (lo ⊕ xl)):
 * runs [r0, r0 + run) every `stride`.
 */
function realRuns(
  re: Float64Array,
  im: Float64Array,
  bOff: number,
  cOff: number,
  xl: number,
  run: number,
  stride: number,
  size: number,
  s: number,
  buf: Float64Array,
): void {
  for (let r0 = 0; r0 < size; r0 += stride) realAdd(re, im, bOff, cOff, xl, r0, r0 + run, s, buf);
}

function realAdd(
  re: Float64Array,
  im: Float64Array,
  bOff: number,
  cOff: number,
  xl: number,
  from: number,
  to: number,
  s: number,
  buf: Float64Array,
): void {
  for (let lo = from; lo < to; lo++) {
    const b = bOff + lo;
    const c = cOff + (lo ^ xl);
    buf[lo] += s * (re[c] * re[b] + im[c] * im[b]);
  }
}

/** The same for Im(conj(ψ_c) ψ_b) = re_c·im_b − im_c·re_b. */
function imagRuns(
  re: Float64Array,
  im: Float64Array,
  bOff: number,
  cOff: number,
  xl: number,
  run: number,
  stride: number,
  size: number,
  s: number,
  buf: Float64Array,
): void {
  for (let r0 = 0; r0 < size; r0 += stride) imagAdd(re, im, bOff, cOff, xl, r0, r0 + run, s, buf);
}

function imagAdd(
  re: Float64Array,
  im: Float64Array,
  bOff: number,
  cOff: number,
  xl: number,
  from: number,
  to: number,
  s: number,
  buf: Float64Array,
): void {
  for (let lo = from; lo < to; lo++) {
    const b = bOff + lo;
    const c = cOff + (lo ^ xl);
    buf[lo] += s * (re[c] * im[b] - im[c] * re[b]);
  }
}

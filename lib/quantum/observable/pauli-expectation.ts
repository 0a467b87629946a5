/**
 * Exact expectation values of Pauli terms without forming 2^n × 2^n matrices.
 *
 * A Pauli word with masks (x, z) and k = popcount(x & z) Y factors is
 * P = i^k · X^x Z^z (per qubit Y = iXZ), so P|b⟩ = i^k (−1)^{|b & z|} |b ⊕ x⟩.
 * - Statevector: ⟨ψ|P|ψ⟩ = Σ_b conj(ψ_{b⊕x}) · i^k (−1)^{|b&z|} · ψ_b. Pairing b with
 *   b' = b ⊕ x (s_{b'} = (−1)^k s_b) gives, over the half b with bit h(x) = 0:
 *   k even: (−1)^{k/2} · 2 Σ s_b Re(conj(ψ_{b'}) ψ_b);  k odd: −(−1)^{(k−1)/2} · 2 Σ s_b Im(conj(ψ_{b'}) ψ_b).
 * - Density matrix: Tr(ρP) = Σ_b ρ_{b, b⊕x} · i^k (−1)^{|b&z|}; the same pairing with
 *   ρ_{b',b} = conj(ρ_{b,b'}) gives 2 Σ s_b Re ρ_{b,b'} (k even) or 2 Σ s_b Im ρ_{b,b'} (k odd).
 * - Diagonal terms (x = 0) come from the probabilities p_b: ⟨Z_z⟩ = Σ_b p_b (−1)^{|b&z|},
 *   all of them from one pass over p (few terms) or one Walsh–Hadamard transform (many).
 * Each off-diagonal term costs one pass over the amplitudes (pairs visited once when
 * possible) or over the band ρ_{b,b⊕x} of ρ. Results are per term, in the order of `sum.terms`.
 */
import type { DensityMatrix, PauliSum, StateVector } from "../types";
import { POPCOUNT16 } from "./bits";
import { walshHadamardInPlace } from "./walsh-hadamard";

/** Per-term ⟨P_i⟩ on a normalised statevector. */
export function pauliExpectationsOnState(state: StateVector, sum: PauliSum): Float64Array {
  const out = new Float64Array(sum.terms.length);
  const diag: number[] = [];
  const bits = Math.min(state.n, LOW_BITS);
  const signs = new SignTables(bits);
  sum.terms.forEach((t, i) => {
    if (t.xMask === 0) diag.push(i);
    else out[i] = offDiagonalOnState(state.re, state.im, t.xMask, t.zMask, signs, bits);
  });
  if (diag.length > 0) {
    const p = new Float64Array(state.re.length);
    for (let b = 0; b < p.length; b++) p[b] = state.re[b] * state.re[b] + state.im[b] * state.im[b];
    fillDiagonal(p, sum, diag, out);
  }
  return out;
}

/** Per-term Tr(ρ P_i) on a density matrix of unit trace. */
export function pauliExpectationsOnDensity(rho: DensityMatrix, sum: PauliSum): Float64Array {
  const out = new Float64Array(sum.terms.length);
  const d = 2 ** rho.n;
  const diag: number[] = [];
  sum.terms.forEach((t, i) => {
    if (t.xMask === 0) diag.push(i);
    else out[i] = offDiagonalOnDensity(rho, d, t.xMask, t.zMask);
  });
  if (diag.length > 0) {
    const p = new Float64Array(d);
    for (let b = 0; b < d; b++) p[b] = rho.re[b * d + b];
    fillDiagonal(p, sum, diag, out);
  }
  return out;
}

/** Σ_i c_i v_i. */
export function weightedTotal(sum: PauliSum, values: ArrayLike<number>): number {
  let s = 0;
  sum.terms.forEach((t, i) => (s += t.coefficient * values[i]));
  return s;
}

/**
 * ⟨Z_z⟩ for the listed diagonal terms from probabilities p. Few terms (≤ n): one pass
 * over p accumulating every term; more: one Walsh–Hadamard transform of a copy of p.
 */
export function fillDiagonal(p: Float64Array, sum: PauliSum, diag: number[], out: Float64Array): void {
  const n = Math.round(Math.log2(p.length));
  if (diag.length > Math.max(n, 1)) {
    const w = p.slice();
    walshHadamardInPlace(w);
    for (const i of diag) out[i] = w[sum.terms[i].zMask];
    return;
  }
  const masks = Int32Array.from(diag, (i) => sum.terms[i].zMask);
  const acc = new Float64Array(diag.length);
  for (let b = 0; b < p.length; b++) {
    const pb = p[b];
    if (pb === 0) continue;
    for (let t = 0; t < masks.length; t++) {
      const v = b & masks[t];
      acc[t] += (POPCOUNT16[v & 0xffff] + POPCOUNT16[v >>> 16]) & 1 ? -pb : pb;
    }
  }
  diag.forEach((i, t) => (out[i] = acc[t]));
}

/** Low index bits handled through a ±1 sign table (2^LOW_BITS entries per z pattern). */
const LOW_BITS = 10;

/** Sign tables s[lo] = (−1)^{|lo & zl|}, cached per low z pattern for one call. */
class SignTables {
  private readonly cache = new Map<number, Float64Array>();
  constructor(private readonly bits: number) {}
  get(zl: number): Float64Array {
    let t = this.cache.get(zl);
    if (!t) {
      t = new Float64Array(1 << this.bits);
      for (let lo = 0; lo < t.length; lo++) {
        const m = lo & zl;
        t[lo] = (POPCOUNT16[m & 0xffff] + POPCOUNT16[m >>> 16]) & 1 ? -1 : 1;
      }
      this.cache.set(zl, t);
    }
    return t;
  }
}

/**
 * Off-diagonal ⟨P⟩ on a statevector. Indices split as b = hi·2^L + lo (L = min(n, 10)):
 * s_b = s_hi · s_lo with s_lo from a table, so the inner loop is branch-free and reads the
 * amplitudes in runs. When x has a bit in the high part, only the hi with that bit clear are
 * visited (each pair b, b ⊕ x once, doubled); otherwise the full sum Σ_b is taken.
 * Re S and Im S with S = Σ_b s_b conj(ψ_{b⊕x}) ψ_b give ⟨P⟩ = Re(i^k S).
 */
function offDiagonalOnState(re: Float64Array, im: Float64Array, x: number, z: number, signs: SignTables, bits: number): number {
  const k = (POPCOUNT16[(x & z) & 0xffff] + POPCOUNT16[(x & z) >>> 16]) & 3;
  const lowSize = 1 << bits;
  const lowMask = lowSize - 1;
  const xl = x & lowMask;
  const xh = x >>> bits;
  const zh = z >>> bits;
  const sl = signs.get(z & lowMask);
  const hiCount = re.length >>> bits;
  const wantRe = (k & 1) === 0;
  const hb = xh === 0 ? -1 : 31 - Math.clz32(xh);
  let acc = 0;
  for (let hi = 0; hi < hiCount; hi++) {
    if (hb >= 0 && (hi >>> hb) & 1) continue;
    const bOff = hi << bits;
    const cOff = (hi ^ xh) << bits;
    const part = wantRe ? realRun(re, im, sl, bOff, cOff, xl, lowSize) : imagRun(re, im, sl, bOff, cOff, xl, lowSize);
    const m = hi & zh;
    acc += (POPCOUNT16[m & 0xffff] + POPCOUNT16[m >>> 16]) & 1 ? -part : part;
  }
  if (hb >= 0) acc *= 2; // pairs visited once
  // ⟨P⟩ = Re(i^k S): k=0 → Re S, 1 → −Im S, 2 → −Re S, 3 → Im S
  return k === 0 || k === 3 ? acc : -acc;
}

/**
 * Σ_lo s_lo · Re(conj(ψ_c) ψ_b) over one run (b = bOff + lo, c = cOff + (lo ⊕ xl)), with
 * four independent accumulators so the additions do not wait on each other.
 */
function realRun(re: Float64Array, im: Float64Array, sl: Float64Array, bOff: number, cOff: number, xl: number, size: number): number {
  let p0 = 0;
  let p1 = 0;
  let p2 = 0;
  let p3 = 0;
  let lo = 0;
  for (; lo + 3 < size; lo += 4) {
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
  for (; lo < size; lo++) {
    const b = bOff + lo;
    const c = cOff + (lo ^ xl);
    p0 += sl[lo] * (re[c] * re[b] + im[c] * im[b]);
  }
  return p0 + p1 + p2 + p3;
}

/** The same for Im(conj(ψ_c) ψ_b) = re_c·im_b − im_c·re_b. */
function imagRun(re: Float64Array, im: Float64Array, sl: Float64Array, bOff: number, cOff: number, xl: number, size: number): number {
  let p0 = 0;
  let p1 = 0;
  let p2 = 0;
  let p3 = 0;
  let lo = 0;
  for (; lo + 3 < size; lo += 4) {
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
  for (; lo < size; lo++) {
    const b = bOff + lo;
    const c = cOff + (lo ^ xl);
    p0 += sl[lo] * (re[c] * im[b] - im[c] * re[b]);
  }
  return p0 + p1 + p2 + p3;
}

function offDiagonalOnDensity(rho: DensityMatrix, d: number, x: number, z: number): number {
  const k = (POPCOUNT16[(x & z) & 0xffff] + POPCOUNT16[(x & z) >>> 16]) & 3;
  const h = 31 - Math.clz32(x);
  const low = (1 << h) - 1;
  const half = d >>> 1;
  const part = (k & 1) === 0 ? rho.re : rho.im;
  let acc = 0;
  for (let i = 0; i < half; i++) {
    const b = ((i >>> h) << (h + 1)) | (i & low);
    const v = part[b * d + (b ^ x)];
    const m = b & z;
    acc += (POPCOUNT16[m & 0xffff] + POPCOUNT16[m >>> 16]) & 1 ? -v : v;
  }
  // i^k · (ρ_{bb'} + (−1)^k conj ρ_{bb'}): k=0: 2Re, k=2: −2Re, k=1: i·2i·Im = −2Im, k=3: −i·2i·Im = 2Im.
  return k === 0 || k === 3 ? 2 * acc : -2 * acc;
}

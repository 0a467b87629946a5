/**
 * λ = A·ψ for the observable of a run, without forming a matrix for a Pauli sum:
 * a word with masks (x, z) and k = popcount(x & z) Y factors maps |b⟩ to
 * i^k (−1)^{|b & z|} |b ⊕ x⟩ (per qubit Y = iXZ), so each term is one pass over ψ.
 * Terms with the same flip mask share one pass. A matrix observable (n ≤ 8) is a dense
 * matrix-vector product.
 */
import { parity, popcount } from "../observable/bits";
import type { PreparedObservable } from "../sampling/sample-observable";
import type { StateVector } from "../types";
import { allocateAmplitudes } from "../statevector/state";
import { wasmLambdaTerm } from "../wasm/lambda";
import { wasmBinding } from "../wasm/runtime";

/**
 * With λ and ψ in one kernel memory, a flip mask shared by at most this many terms takes one
 * SIMD pass per term (wasm/lambda.ts) instead of the JavaScript pass per mask below (measured
 * at 16 qubits: ~25 µs per SIMD term pass, ~180 µs per JavaScript mask pass).
 */
const SIMD_TERMS_PER_MASK = 4;

export function applyObservable(obs: PreparedObservable, psi: StateVector): StateVector {
  // like the state: in a kernel memory when the engine uses them (the sweep's SIMD kernels)
  const { re, im } = allocateAmplitudes(psi.n);
  applyObservableInto(obs, psi, re, im);
  return { n: psi.n, re, im };
}

/** λ = A·ψ into zeroed arrays (re, im) of ψ's size, on the calling thread. */
export function applyObservableInto(
  obs: PreparedObservable,
  psi: StateVector,
  re: Float64Array,
  im: Float64Array,
): void {
  if (obs.kind === "matrix") {
    const { dim: d, re: hr, im: hi } = obs.matrix;
    for (let i = 0; i < d; i++) {
      let sr = 0;
      let si = 0;
      for (let j = 0; j < d; j++) {
        const a = hr[i * d + j];
        const b = hi[i * d + j];
        sr += a * psi.re[j] - b * psi.im[j];
        si += a * psi.im[j] + b * psi.re[j];
      }
      re[i] = sr;
      im[i] = si;
    }
    return;
  }
  pauliLambdaRange(obs.sum.terms, psi, re, im, 0, re.length);
}

/** A Pauli term as λ needs it: flip and phase masks, coefficient. */
export interface LambdaTerm {
  xMask: number;
  zMask: number;
  coefficient: number;
}

/**
 * λ[o] for the outputs o in [from, to) of a Pauli sum (λ zeroed there before): every output
 * only reads ψ, so engine threads fill disjoint ranges; each output accumulates the mask
 * groups in the same order whatever the range, so the result does not depend on the split
 * (ranges aligned to 8, as the threads' are: an unaligned range takes the JavaScript pass
 * for masks the SIMD pass would take, equal to 1e-12).
 */
export function pauliLambdaRange(
  sumTerms: readonly LambdaTerm[],
  psi: StateVector,
  re: Float64Array,
  im: Float64Array,
  from: number,
  to: number,
): void {
  // Terms with the same flip mask x share one pass: f(b) = Σ_t c_t·i^{k_t}·(−1)^{|b & z_t|}.
  const groups = new Map<number, { cr: number; ci: number; z: number; coefficient: number }[]>();
  for (const t of sumTerms) {
    const k = popcount(t.xMask & t.zMask) & 3;
    const cr = k === 0 ? t.coefficient : k === 2 ? -t.coefficient : 0;
    const ci = k === 1 ? t.coefficient : k === 3 ? -t.coefficient : 0;
    const list = groups.get(t.xMask) ?? [];
    list.push({ cr, ci, z: t.zMask, coefficient: t.coefficient });
    groups.set(t.xMask, list);
  }
  const bound = psi.n >= 3 && from % 8 === 0 && to % 8 === 0 ? wasmBinding(re, im) : undefined;
  const w = bound && bound === wasmBinding(psi.re, psi.im) ? bound : undefined;
  // f splits into terms on the low L bits (a table over b's low bits), terms on the high
  // bits (a table over b >> L; z = 0 counts as low) and the few terms with z on both sides (evaluated per
  // amplitude), so a group costs two lookups per amplitude whatever its size.
  const lowBits = Math.ceil(psi.n / 2);
  const loMask = (1 << lowBits) - 1;
  for (const [x, terms] of groups) {
    if (w && terms.length <= SIMD_TERMS_PER_MASK) {
      for (const t of terms) wasmLambdaTerm(w, { re, im }, psi, from, to, x, t.z, t.coefficient);
      continue;
    }
    const lo = termTable(
      terms.filter((t) => (t.z & ~loMask) === 0),
      lowBits,
      0,
    );
    const hi = termTable(
      terms.filter((t) => t.z !== 0 && (t.z & loMask) === 0),
      psi.n - lowBits,
      lowBits,
    );
    const across = terms.filter((t) => (t.z & loMask) !== 0 && (t.z & ~loMask) !== 0);
    const m = across.length;
    const zs = Int32Array.from(across, (t) => t.z);
    const crs = Float64Array.from(across, (t) => t.cr);
    const cis = Float64Array.from(across, (t) => t.ci);
    const pr = psi.re;
    const pi = psi.im;
    if (terms.every((t) => t.z === 0)) {
      // f is the same for every b (e.g. a lone X or Y word): no tables
      const fr = lo.re[0] + hi.re[0];
      const fi = lo.im[0] + hi.im[0];
      for (let o = from; o < to; o++) {
        const ar = pr[o ^ x];
        const ai = pi[o ^ x];
        re[o] += fr * ar - fi * ai;
        im[o] += fr * ai + fi * ar;
      }
      continue;
    }
    const loRe = lo.re;
    const loIm = lo.im;
    const hiRe = hi.re;
    const hiIm = hi.im;
    for (let o = from; o < to; o++) {
      const b = o ^ x;
      let fr = loRe[b & loMask] + hiRe[b >>> lowBits];
      let fi = loIm[b & loMask] + hiIm[b >>> lowBits];
      for (let t = 0; t < m; t++) {
        if (parity(b & zs[t])) {
          fr -= crs[t];
          fi -= cis[t];
        } else {
          fr += crs[t];
          fi += cis[t];
        }
      }
      const ar = pr[b];
      const ai = pi[b];
      re[o] += fr * ar - fi * ai;
      im[o] += fr * ai + fi * ar;
    }
  }
}

/** Σ_t c_t·(−1)^{|v & (z_t >> shift)|} for every v < 2^bits (split re/im). */
function termTable(
  terms: readonly { cr: number; ci: number; z: number }[],
  bits: number,
  shift: number,
): { re: Float64Array; im: Float64Array } {
  const size = 1 << bits;
  const re = new Float64Array(size);
  const im = new Float64Array(size);
  for (const t of terms) {
    const z = t.z >>> shift;
    for (let v = 0; v < size; v++) {
      if (parity(v & z)) {
        re[v] -= t.cr;
        im[v] -= t.ci;
      } else {
        re[v] += t.cr;
        im[v] += t.ci;
      }
    }
  }
  return { re, im };
}

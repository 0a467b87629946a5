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

export function applyObservable(obs: PreparedObservable, psi: StateVector): StateVector {
  const len = psi.re.length;
  const re = new Float64Array(len);
  const im = new Float64Array(len);
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
    return { n: psi.n, re, im };
  }
  // Terms with the same flip mask x share one pass: f(b) = Σ_t c_t·i^{k_t}·(−1)^{|b & z_t|}.
  const groups = new Map<number, { cr: number; ci: number; z: number }[]>();
  for (const t of obs.sum.terms) {
    const k = popcount(t.xMask & t.zMask) & 3;
    const cr = k === 0 ? t.coefficient : k === 2 ? -t.coefficient : 0;
    const ci = k === 1 ? t.coefficient : k === 3 ? -t.coefficient : 0;
    const list = groups.get(t.xMask) ?? [];
    list.push({ cr, ci, z: t.zMask });
    groups.set(t.xMask, list);
  }
  for (const [x, terms] of groups) {
    const m = terms.length;
    const zs = Int32Array.from(terms, (t) => t.z);
    const crs = Float64Array.from(terms, (t) => t.cr);
    const cis = Float64Array.from(terms, (t) => t.ci);
    for (let b = 0; b < len; b++) {
      let fr = 0;
      let fi = 0;
      for (let t = 0; t < m; t++) {
        if (parity(b & zs[t])) {
          fr -= crs[t];
          fi -= cis[t];
        } else {
          fr += crs[t];
          fi += cis[t];
        }
      }
      const ar = psi.re[b];
      const ai = psi.im[b];
      const o = b ^ x;
      re[o] += fr * ar - fi * ai;
      im[o] += fr * ai + fi * ar;
    }
  }
  return { n: psi.n, re, im };
}

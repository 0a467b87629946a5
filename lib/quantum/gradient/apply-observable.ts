/**
 * λ = A·ψ for the observable of a run, without forming a matrix for a Pauli sum:
 * a word with masks (x, z) and k = popcount(x & z) Y factors maps |b⟩ to
 * i^k (−1)^{|b & z|} |b ⊕ x⟩ (per qubit Y = iXZ), so each term is one pass over ψ.
 * A matrix observable (n ≤ 8) is a dense matrix-vector product.
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
  for (const t of obs.sum.terms) {
    const k = popcount(t.xMask & t.zMask) & 3;
    // i^k·c as (cr, ci).
    const cr = k === 0 ? t.coefficient : k === 2 ? -t.coefficient : 0;
    const ci = k === 1 ? t.coefficient : k === 3 ? -t.coefficient : 0;
    const x = t.xMask;
    const z = t.zMask;
    for (let b = 0; b < len; b++) {
      const s = parity(b & z) ? -1 : 1;
      const ar = psi.re[b] * s;
      const ai = psi.im[b] * s;
      const o = b ^ x;
      re[o] += cr * ar - ci * ai;
      im[o] += cr * ai + ci * ar;
    }
  }
  return { n: psi.n, re, im };
}

/**
 * Eigendecomposition of a Hermitian matrix H = A + iB with ml-matrix.
 *
 * Real H (B = 0): ml-matrix's symmetric solver directly.
 * Complex H: the real symmetric embedding M = [[A, −B], [B, A]] has H's spectrum
 * with every eigenvalue doubled: H v = λ v with v = x + iy gives M[x;y] = λ[x;y] and
 * M[−y;x] = λ[−y;x], and both map back to complex multiples of v. M's eigenvectors
 * are mapped to x + iy, grouped into clusters of equal eigenvalue (|Δλ| ≤ 1e-9·‖H‖),
 * and in each cluster of size 2m, m orthonormal complex vectors are chosen by
 * pivoted modified Gram–Schmidt (largest residual first). Eigenvalues are the
 * Rayleigh quotients v†Hv of the chosen vectors.
 */
import { EigenvalueDecomposition, Matrix } from "ml-matrix";
import type { HermitianMatrix } from "./matrix-observable";

export interface HermitianEigen {
  dim: number;
  /** Ascending eigenvalues. */
  values: Float64Array;
  /** Eigenvector k is row k: vecRe[k·dim + i] + i·vecIm[k·dim + i]. Orthonormal. */
  vecRe: Float64Array;
  vecIm: Float64Array;
}

export function hermitianEigen(h: HermitianMatrix): HermitianEigen {
  const d = h.dim;
  const isReal = h.im.every((v) => v === 0);
  return isReal ? realSymmetricEigen(h) : complexEigenByEmbedding(h, d);
}

function sortedEvd(m: Matrix): { values: number[]; vectors: Matrix; order: number[] } {
  const evd = new EigenvalueDecomposition(m, { assumeSymmetric: true });
  const values = evd.realEigenvalues;
  const order = values.map((_, i) => i).sort((a, b) => values[a] - values[b]);
  return { values, vectors: evd.eigenvectorMatrix, order };
}

function realSymmetricEigen(h: HermitianMatrix): HermitianEigen {
  const d = h.dim;
  const rows: number[][] = [];
  for (let i = 0; i < d; i++) rows.push(Array.from(h.re.subarray(i * d, (i + 1) * d)));
  const { values, vectors, order } = sortedEvd(new Matrix(rows));
  const out: HermitianEigen = {
    dim: d,
    values: new Float64Array(d),
    vecRe: new Float64Array(d * d),
    vecIm: new Float64Array(d * d),
  };
  order.forEach((col, k) => {
    out.values[k] = values[col];
    for (let i = 0; i < d; i++) out.vecRe[k * d + i] = vectors.get(i, col);
  });
  return out;
}

function complexEigenByEmbedding(h: HermitianMatrix, d: number): HermitianEigen {
  const m = new Matrix(2 * d, 2 * d);
  for (let i = 0; i < d; i++) {
    for (let j = 0; j < d; j++) {
      const a = h.re[i * d + j];
      const b = h.im[i * d + j];
      m.set(i, j, a);
      m.set(i + d, j + d, a);
      m.set(i, j + d, -b);
      m.set(i + d, j, b);
    }
  }
  const { values, vectors, order } = sortedEvd(m);
  const scale = Math.max(1, ...values.map(Math.abs));
  const tol = 1e-9 * scale;
  const out: HermitianEigen = {
    dim: d,
    values: new Float64Array(d),
    vecRe: new Float64Array(d * d),
    vecIm: new Float64Array(d * d),
  };
  let filled = 0;
  let start = 0;
  while (start < order.length) {
    let end = start + 1;
    while (
      end < order.length &&
      (values[order[end]] - values[order[end - 1]] <= tol || (end - start) % 2 === 1)
    )
      end++;
    const want = Math.min((end - start) >> 1, d - filled);
    const cands = order.slice(start, end).map((col) => {
      const re = new Float64Array(d);
      const im = new Float64Array(d);
      for (let i = 0; i < d; i++) {
        re[i] = vectors.get(i, col);
        im[i] = vectors.get(i + d, col);
      }
      return { re, im };
    });
    pivotedGramSchmidt(cands, want, d, (re, im) => {
      out.vecRe.set(re, filled * d);
      out.vecIm.set(im, filled * d);
      out.values[filled] = rayleigh(h, re, im);
      filled++;
    });
    start = end;
  }
  return out;
}

function pivotedGramSchmidt(
  cands: { re: Float64Array; im: Float64Array }[],
  want: number,
  d: number,
  accept: (re: Float64Array, im: Float64Array) => void,
): void {
  const alive = cands.map(() => true);
  for (let step = 0; step < want; step++) {
    let best = -1;
    let bestNorm = -1;
    cands.forEach((c, k) => {
      if (!alive[k]) return;
      let s = 0;
      for (let i = 0; i < d; i++) s += c.re[i] * c.re[i] + c.im[i] * c.im[i];
      if (s > bestNorm) [best, bestNorm] = [k, s];
    });
    if (best < 0) return;
    alive[best] = false;
    const q = cands[best];
    const inv = 1 / Math.sqrt(bestNorm);
    for (let i = 0; i < d; i++) {
      q.re[i] *= inv;
      q.im[i] *= inv;
    }
    accept(q.re, q.im);
    cands.forEach((c, k) => {
      if (!alive[k]) return;
      // c ← c − (q†c) q
      let pr = 0;
      let pi = 0;
      for (let i = 0; i < d; i++) {
        pr += q.re[i] * c.re[i] + q.im[i] * c.im[i];
        pi += q.re[i] * c.im[i] - q.im[i] * c.re[i];
      }
      for (let i = 0; i < d; i++) {
        c.re[i] -= pr * q.re[i] - pi * q.im[i];
        c.im[i] -= pr * q.im[i] + pi * q.re[i];
      }
    });
  }
}

/** Re(v† H v) for a unit vector v. */
function rayleigh(h: HermitianMatrix, re: Float64Array, im: Float64Array): number {
  const d = h.dim;
  let s = 0;
  for (let i = 0; i < d; i++) {
    let wr = 0;
    let wi = 0;
    for (let j = 0; j < d; j++) {
      const a = h.re[i * d + j];
      const b = h.im[i * d + j];
      wr += a * re[j] - b * im[j];
      wi += a * im[j] + b * re[j];
    }
    s += re[i] * wr + im[i] * wi;
  }
  return s;
}

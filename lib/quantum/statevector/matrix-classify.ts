/**
 * Structural classification of a gate matrix (types.ts convention, interleaved re/im),
 * so the dispatcher can pick a cheaper kernel:
 * - identity rows (row i = e_i) are never touched: only the "active" local indices are;
 *   for a controlled-U these are the control=1 subspace, for cx/ccx the two swapped states;
 * - diagonal: only phases (rz, p, cz, crz, rzz, …);
 * - permutation-type: one non-zero per row — for a unitary its modulus is 1 (x, y, cx, swap, ccx).
 * Entries with |re|, |im| ≤ ZERO_TOL count as zero (rounding noise of products of exact gates).
 */

export const ZERO_TOL = 1e-15;

export interface MatrixShape {
  /** Local indices whose row/column is not the identity's, ascending. */
  active: number[];
  diagonal: boolean;
  /** One non-zero per row: row i reads column `source[i]`. */
  permutation: boolean;
  /** For a permutation: source column of each row (length 2^k). */
  source: number[];
  /** True when every imaginary part is zero. */
  real: boolean;
}

function isZero(re: number, im: number): boolean {
  return Math.abs(re) <= ZERO_TOL && Math.abs(im) <= ZERO_TOL;
}

/** Classifies a 2^k × 2^k matrix (d = 2^k). */
export function classifyMatrix(m: Float64Array, d: number): MatrixShape {
  const active: number[] = [];
  const source: number[] = [];
  let diagonal = true;
  let permutation = true;
  let real = true;
  for (let r = 0; r < d; r++) {
    let nonZeros = 0;
    let src = -1;
    let identityRow = true;
    for (let c = 0; c < d; c++) {
      const re = m[2 * (r * d + c)];
      const im = m[2 * (r * d + c) + 1];
      if (im !== 0) real = false;
      const zero = isZero(re, im);
      if (!zero) {
        nonZeros++;
        src = c;
        if (c !== r) diagonal = false;
      }
      if (c === r) {
        if (Math.abs(re - 1) > ZERO_TOL || Math.abs(im) > ZERO_TOL) identityRow = false;
      } else if (!zero) identityRow = false;
    }
    if (nonZeros !== 1) permutation = false;
    source.push(src);
    if (!identityRow) active.push(r);
  }
  return { active, diagonal, permutation, source, real };
}

/** The square sub-matrix on the given local indices (rows and columns), interleaved. */
export function subMatrix(m: Float64Array, d: number, idx: readonly number[]): Float64Array {
  const s = idx.length;
  const out = new Float64Array(2 * s * s);
  for (let a = 0; a < s; a++) {
    for (let b = 0; b < s; b++) {
      out[2 * (a * s + b)] = m[2 * (idx[a] * d + idx[b])];
      out[2 * (a * s + b) + 1] = m[2 * (idx[a] * d + idx[b]) + 1];
    }
  }
  return out;
}

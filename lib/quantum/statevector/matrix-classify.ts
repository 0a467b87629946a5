/**
 * Structural classification of a gate matrix (types.ts convention, interleaved re/im),
 * so the dispatcher can pick a cheaper kernel:
 * - identity rows (row i = e_i) are never touched: only the "active" local indices are;
 *   for a controlled-U these are the control=1 subspace, for cx/ccx the two swapped states;
 * - diagonal: only phases (rz, p, cz, crz, rzz, …);
 * - permutation-type: one non-zero per row — for a unitary its modulus is 1 (x, y, cx, swap, ccx);
 * - two-block (2-qubit only): block-diagonal in one operand's basis, U = |0⟩⟨0| ⊗ A + |1⟩⟨1| ⊗ B
 *   (a cx fused with gates on its target), applied at the cost of a 1-qubit gate.
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
  /** 2-qubit block-diagonal form: which operand (0 = first, 1 = second) selects the block; −1: none. */
  blockOperand: number;
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
  return {
    active,
    diagonal,
    permutation,
    source,
    real,
    blockOperand: d === 4 ? twoBlockOperand(m) : -1,
  };
}

/** For a 4×4 matrix: 0 if block-diagonal in the first operand's basis, 1 if in the second's, else −1. */
function twoBlockOperand(m: Float64Array): number {
  for (const operand of [0, 1]) {
    const bit = operand === 0 ? 2 : 1; // local-index bit of that operand
    let ok = true;
    for (let r = 0; r < 4 && ok; r++)
      for (let c = 0; c < 4 && ok; c++)
        if ((r & bit) !== (c & bit) && !isZero(m[2 * (r * 4 + c)], m[2 * (r * 4 + c) + 1]))
          ok = false;
    if (ok) return operand;
  }
  return -1;
}

/** The two 2×2 blocks (selector operand = 0, then = 1) of a two-block 4×4 matrix. */
export function twoBlocks(m: Float64Array, operand: number): [Float64Array, Float64Array] {
  const idx =
    operand === 0
      ? [
          [0, 1],
          [2, 3],
        ]
      : [
          [0, 2],
          [1, 3],
        ];
  return [subMatrix(m, 4, idx[0]), subMatrix(m, 4, idx[1])];
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

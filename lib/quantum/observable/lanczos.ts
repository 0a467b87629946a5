/**
 * Extreme eigenvalues (min, max) of a Pauli sum by the Lanczos method, matrix-free
 * (C. Lanczos, J. Res. Natl. Bur. Stand. 45, 255 (1950)).
 *
 * Complex Hermitian Lanczos with full re-orthogonalisation (classical Gram–Schmidt
 * applied twice) — affordable for n ≤ 16. The start vector is pseudo-random with a fixed
 * seed (xoroshiro128+ from pure-rand, seed 20160211 unless given), so results are
 * reproducible. Every few steps the tridiagonal T_j is diagonalised (ml-matrix); a
 * Ritz value θ with Ritz vector y has residual ‖H u − θ u‖ = β_j |y_j|, and the run
 * stops when both extreme residuals are ≤ tol·max(1, Σ|c|) (tol = 1e-9), which bounds
 * the eigenvalue error by the same amount (and in practice by its square over the gap).
 * When the basis reaches its size cap, the run restarts from the normalised sum of the
 * two extreme Ritz vectors.
 */
import { EigenvalueDecomposition, Matrix } from "ml-matrix";
import { EngineError } from "../errors";
import { MAX_SPECTRUM_QUBITS } from "../estimate/limits";
import type { PauliSum } from "../types";
import { createRng, nextUniform, type Rng } from "../sampling/rng";
import { PauliOperator } from "./pauli-operator";

export const MAX_LANCZOS_QUBITS = MAX_SPECTRUM_QUBITS;

/**
 * Work of one matrix-vector product, in amplitude updates: 2^n per distinct flip pattern
 * (x-mask) — terms sharing an x-mask are applied together (pauli-operator.ts).
 */
export function lanczosStepCost(sum: PauliSum): number {
  const flips = new Set(sum.terms.filter((t) => t.coefficient !== 0).map((t) => t.xMask));
  return flips.size * 2 ** sum.numQubits;
}

/** Largest step cost for which `estimate` computes the spectrum (2^22 updates: seconds, not minutes). */
export const SPECTRUM_STEP_BUDGET = 2 ** 22;

export interface LanczosOptions {
  tol?: number;
  seed?: number;
  /** Upper bound on stored basis vectors (memory: 16·2^n bytes each). */
  maxBasis?: number;
  maxRestarts?: number;
  /** Called between iterations with a rough progress fraction; may be async (yield/abort). */
  tick?: (fraction: number) => void | Promise<void>;
}

export interface LanczosResult {
  min: number;
  max: number;
  iterations: number;
  converged: boolean;
  residualMin: number;
  residualMax: number;
}

export interface Ritz {
  theta: number[];
  /** Eigenvectors of T as columns (ascending θ). */
  y: Matrix;
}

export function tridiagonalEigen(alpha: number[], beta: number[]): Ritz {
  const m = alpha.length;
  const t = new Matrix(m, m);
  for (let i = 0; i < m; i++) {
    t.set(i, i, alpha[i]);
    if (i + 1 < m) {
      t.set(i, i + 1, beta[i]);
      t.set(i + 1, i, beta[i]);
    }
  }
  const evd = new EigenvalueDecomposition(t, { assumeSymmetric: true });
  const vals = evd.realEigenvalues;
  const order = vals.map((_, i) => i).sort((a, b) => vals[a] - vals[b]);
  const vecs = evd.eigenvectorMatrix;
  const y = new Matrix(m, m);
  order.forEach((col, k) => {
    for (let i = 0; i < m; i++) y.set(i, k, vecs.get(i, col));
  });
  return { theta: order.map((i) => vals[i]), y };
}

export function normalise(re: Float64Array, im: Float64Array): number {
  let s = 0;
  for (let i = 0; i < re.length; i++) s += re[i] * re[i] + im[i] * im[i];
  const nrm = Math.sqrt(s);
  if (nrm > 0) {
    for (let i = 0; i < re.length; i++) {
      re[i] /= nrm;
      im[i] /= nrm;
    }
  }
  return nrm;
}

/** A complex vector as two real arrays (state order). */
export interface ComplexVector {
  re: Float64Array;
  im: Float64Array;
}

/** w ← w − Σ_i (v_i† w) v_i over the stored basis, done twice for stability. */
export function reorthogonalise(
  basis: ComplexVector[],
  wRe: Float64Array,
  wIm: Float64Array,
): void {
  for (let pass = 0; pass < 2; pass++) {
    for (const v of basis) {
      let pr = 0;
      let pi = 0;
      for (let i = 0; i < wRe.length; i++) {
        pr += v.re[i] * wRe[i] + v.im[i] * wIm[i];
        pi += v.re[i] * wIm[i] - v.im[i] * wRe[i];
      }
      for (let i = 0; i < wRe.length; i++) {
        wRe[i] -= pr * v.re[i] - pi * v.im[i];
        wIm[i] -= pr * v.im[i] + pi * v.re[i];
      }
    }
  }
}

/** A start vector with real and imaginary parts uniform in [−½, ½) (not normalised). */
export function randomVector(rng: Rng, d: number): ComplexVector {
  const re = new Float64Array(d);
  const im = new Float64Array(d);
  for (let i = 0; i < d; i++) {
    re[i] = nextUniform(rng) - 0.5;
    im[i] = nextUniform(rng) - 0.5;
  }
  return { re, im };
}

/**
 * One Lanczos step from the basis vector v: w = H v, α = Re(v†w), w re-orthogonalised
 * against `against` (twice) and normalised; β = ‖w‖ before normalising.
 */
export function lanczosStep(
  op: PauliOperator,
  v: ComplexVector,
  against: ComplexVector[],
): { alpha: number; beta: number; w: ComplexVector } {
  const d = op.dim;
  const wRe = new Float64Array(d);
  const wIm = new Float64Array(d);
  op.apply(v.re, v.im, wRe, wIm);
  let alpha = 0;
  for (let i = 0; i < d; i++) alpha += v.re[i] * wRe[i] + v.im[i] * wIm[i];
  reorthogonalise(against, wRe, wIm);
  const beta = normalise(wRe, wIm);
  return { alpha, beta, w: { re: wRe, im: wIm } };
}

/** Σ_k weight(k)·v_k over the first `m` basis vectors (a Ritz vector; not normalised). */
export function combineBasis(
  basis: ComplexVector[],
  m: number,
  weight: (k: number) => number,
  d: number,
): ComplexVector {
  const re = new Float64Array(d);
  const im = new Float64Array(d);
  for (let k = 0; k < m; k++) {
    const w = weight(k);
    const v = basis[k];
    for (let i = 0; i < d; i++) {
      re[i] += w * v.re[i];
      im[i] += w * v.im[i];
    }
  }
  return { re, im };
}

/**
 * What every Lanczos run over a Pauli sum starts from: the sum's operator (refused above
 * MAX_LANCZOS_QUBITS), its dimension and the scale Σ|c| that tolerances are relative to.
 */
export function lanczosSetup(sum: PauliSum): { op: PauliOperator; d: number; scale: number } {
  const n = sum.numQubits;
  if (n > MAX_LANCZOS_QUBITS) {
    throw new EngineError(
      "too_large",
      `the exact spectrum is computed for at most ${MAX_LANCZOS_QUBITS} qubits (this observable has ${n})`,
    );
  }
  const op = new PauliOperator(sum);
  const scale = Math.max(
    1,
    sum.terms.reduce((s, t) => s + Math.abs(t.coefficient), 0),
  );
  return { op, d: op.dim, scale };
}

export async function lanczosExtremes(
  sum: PauliSum,
  opts: LanczosOptions = {},
): Promise<LanczosResult> {
  const { op, d, scale } = lanczosSetup(sum);
  const tol = (opts.tol ?? 1e-9) * scale;
  const memCap = Math.max(8, Math.floor((256 * 1024 * 1024) / (16 * d)));
  const maxBasis = Math.min(d, opts.maxBasis ?? 160, memCap);
  const maxRestarts = opts.maxRestarts ?? 30;
  const rng = createRng(opts.seed ?? 20160211);
  let start = randomVector(rng, d);
  normalise(start.re, start.im);
  let iterations = 0;
  let best: LanczosResult | null = null;
  for (let restart = 0; restart <= maxRestarts; restart++) {
    const basis: ComplexVector[] = [start];
    const alpha: number[] = [];
    const beta: number[] = [];
    let ritz: Ritz | null = null;
    let invariant = false;
    for (let j = 0; j < maxBasis; j++) {
      const { alpha: a, beta: b, w } = lanczosStep(op, basis[j], basis);
      iterations++;
      alpha.push(a);
      invariant = b <= 1e-12 * scale;
      const last = j + 1 === maxBasis || invariant;
      if (last || j % 4 === 3) {
        ritz = tridiagonalEigen(alpha, beta);
        const m = alpha.length;
        const rMin = invariant ? 0 : Math.abs(b * ritz.y.get(m - 1, 0));
        const rMax = invariant ? 0 : Math.abs(b * ritz.y.get(m - 1, m - 1));
        best = {
          min: ritz.theta[0],
          max: ritz.theta[m - 1],
          iterations,
          converged: false,
          residualMin: rMin,
          residualMax: rMax,
        };
        if (rMin <= tol && rMax <= tol) return { ...best, converged: true };
      }
      if (last) break;
      beta.push(b);
      basis.push(w);
      await opts.tick?.(Math.min(0.99, (restart * maxBasis + j) / ((maxRestarts + 1) * maxBasis)));
    }
    if (!ritz) break;
    // restart from u_min + u_max (both Ritz vectors in the current basis)
    const m = alpha.length;
    const y = ritz.y;
    const next = combineBasis(basis, m, (k) => y.get(k, 0) + y.get(k, m - 1), d);
    if (normalise(next.re, next.im) === 0) break;
    start = next;
  }
  return (
    best ?? {
      min: 0,
      max: 0,
      iterations,
      converged: false,
      residualMin: Infinity,
      residualMax: Infinity,
    }
  );
}

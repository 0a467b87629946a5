/**
 * The lowest eigenvalues of a Pauli sum with their multiplicity, and an orthonormal basis
 * of its lowest eigenspace (ground space), matrix-free, by Lanczos with deflation.
 *
 * Each level is the lowest Ritz pair of a Lanczos run (full re-orthogonalisation, restarts
 * from the lowest Ritz vector; lanczos.ts) on the operator restricted to the orthogonal
 * complement of the vectors already found: the start vector and every Krylov vector are
 * orthogonalised against them. A single Krylov space holds only one vector per eigenspace,
 * so deflation is what reveals multiplicity. Runs continue until `count` values are known
 * and the last one lies above the ground level (λ > λ₀ + levelTol), or the whole space is
 * spanned; when the ground level holds `maxGround` vectors or more, the ground space is
 * reported as unknown (`ground: null`) rather than truncated.
 */
import { createRng } from "../sampling/rng";
import type { PauliSum } from "../types";
import type { HermitianEigen } from "./hermitian-eigen";
import {
  combineBasis,
  lanczosSetup,
  lanczosStep,
  normalise,
  randomVector,
  reorthogonalise,
  tridiagonalEigen,
  type ComplexVector,
  type Ritz,
} from "./lanczos";
import { PauliOperator } from "./pauli-operator";

export type { ComplexVector };

export interface LowestLevels {
  /** The `count` lowest eigenvalues with multiplicity, ascending (fewer if the dimension is smaller). */
  lowest: number[];
  /** Orthonormal basis of the lowest eigenspace; null when its dimension reached `maxGround`. */
  ground: ComplexVector[] | null;
  /** Eigenvalues within this distance of λ₀ belong to the ground level. */
  levelTol: number;
  converged: boolean;
}

export interface LowestLevelsOptions {
  count?: number;
  maxGround?: number;
  /** Residual tolerance relative to max(1, Σ|c|) (default 1e-10). */
  tol?: number;
  seed?: number;
  maxBasis?: number;
  maxRestarts?: number;
  tick?: (fraction: number) => void | Promise<void>;
}

/** Relative tolerance for "the same level": |λ − λ₀| ≤ LEVEL_TOL·max(1, scale). */
export const LEVEL_TOL = 1e-8;

interface Pair {
  theta: number;
  vec: ComplexVector;
  converged: boolean;
}

async function lowestPair(
  op: PauliOperator,
  found: ComplexVector[],
  start: ComplexVector,
  cfg: { tol: number; scale: number; maxBasis: number; maxRestarts: number },
  tick: (f: number) => Promise<void>,
): Promise<Pair | null> {
  const d = op.dim;
  let startRe = start.re;
  let startIm = start.im;
  reorthogonalise(found, startRe, startIm); // deflation: project out the found vectors
  if (normalise(startRe, startIm) <= 1e-12) return null;
  let best: Pair | null = null;
  for (let restart = 0; restart <= cfg.maxRestarts; restart++) {
    const basis: ComplexVector[] = [{ re: startRe, im: startIm }];
    const alpha: number[] = [];
    const beta: number[] = [];
    let ritz: Ritz | null = null;
    for (let j = 0; j < cfg.maxBasis; j++) {
      // Against the found vectors and the basis together, twice: when the space is nearly
      // exhausted w is tiny, and separate passes would let rounding reintroduce found directions.
      const against = found.length ? [...found, ...basis] : basis;
      const { alpha: a, beta: b, w } = lanczosStep(op, basis[j], against);
      alpha.push(a);
      const invariant = b <= 1e-12 * cfg.scale;
      const last = j + 1 === cfg.maxBasis || invariant || found.length + basis.length >= d;
      if (last || j % 4 === 3) {
        ritz = tridiagonalEigen(alpha, beta);
        const m = alpha.length;
        const res = invariant ? 0 : Math.abs(b * ritz.y.get(m - 1, 0));
        best = {
          theta: ritz.theta[0],
          vec: combine(basis, ritz, d),
          converged: res <= cfg.tol || found.length + m >= d,
        };
        if (best.converged) return best;
      }
      if (last) break;
      beta.push(b);
      basis.push(w);
      await tick((restart * cfg.maxBasis + j) / ((cfg.maxRestarts + 1) * cfg.maxBasis));
    }
    if (!best) break;
    startRe = Float64Array.from(best.vec.re);
    startIm = Float64Array.from(best.vec.im);
  }
  return best;
}

/** The lowest Ritz vector Σ_k y_k0 v_k, normalised. */
function combine(basis: ComplexVector[], ritz: Ritz, d: number): ComplexVector {
  const y = ritz.y;
  const v = combineBasis(basis, Math.min(basis.length, y.rows), (k) => y.get(k, 0), d);
  normalise(v.re, v.im);
  return v;
}

export async function lowestLevels(
  sum: PauliSum,
  opts: LowestLevelsOptions = {},
): Promise<LowestLevels> {
  const { op, d, scale } = lanczosSetup(sum);
  const count = Math.min(opts.count ?? 4, d);
  const maxGround = opts.maxGround ?? 16;
  const memCap = Math.max(8, Math.floor((256 * 1024 * 1024) / (16 * d)) - maxGround);
  const cfg = {
    tol: (opts.tol ?? 1e-10) * scale,
    scale,
    maxBasis: Math.min(d, opts.maxBasis ?? 160, memCap),
    maxRestarts: opts.maxRestarts ?? 30,
  };
  const levelTol = LEVEL_TOL * scale;
  const rng = createRng(opts.seed ?? 20160211);
  const found: ComplexVector[] = [];
  const values: number[] = [];
  let converged = true;
  const runs = Math.max(count, 1);
  for (;;) {
    const k = found.length;
    const groundOpen = k > 0 && values[k - 1] <= values[0] + levelTol;
    if (k >= d || (k >= count && !groundOpen) || (groundOpen && k >= maxGround && k >= count))
      break;
    const pair = await lowestPair(op, found, randomVector(rng, d), cfg, (f) =>
      Promise.resolve(opts.tick?.(Math.min(0.99, (Math.min(k, runs - 1) + f) / runs))),
    );
    if (!pair) break;
    converged &&= pair.converged;
    // Re-orthogonalise the new vector against the found ones (it is already, up to rounding).
    reorthogonalise(found, pair.vec.re, pair.vec.im);
    normalise(pair.vec.re, pair.vec.im);
    found.push(pair.vec);
    values.push(pair.theta);
  }
  const order = values.map((_, i) => i).sort((a, b) => values[a] - values[b]);
  const sorted = order.map((i) => values[i]);
  const lambda0 = sorted[0];
  const groundIdx = order.filter((i) => values[i] <= lambda0 + levelTol);
  const last = sorted[sorted.length - 1];
  const complete = found.length >= d || last > lambda0 + levelTol;
  return {
    lowest: sorted.slice(0, count),
    ground: complete ? groundIdx.map((i) => found[i]) : null,
    levelTol,
    converged,
  };
}

/** ⟨ψ|P₀|ψ⟩ = Σ_k |⟨g_k|ψ⟩|² for an orthonormal ground basis g_k (state order). */
export function groundWeightOnState(ground: ComplexVector[], state: ComplexVector): number {
  let w = 0;
  for (const g of ground) {
    let pr = 0;
    let pi = 0;
    for (let i = 0; i < g.re.length; i++) {
      pr += g.re[i] * state.re[i] + g.im[i] * state.im[i];
      pi += g.re[i] * state.im[i] - g.im[i] * state.re[i];
    }
    w += pr * pr + pi * pi;
  }
  return w;
}

/** Tr(P₀ρ) = Σ_k ⟨g_k|ρ|g_k⟩ (real part; ρ row-major, state order). */
export function groundWeightOnDensity(ground: ComplexVector[], rho: ComplexVector): number {
  let w = 0;
  const d = ground[0]?.re.length ?? 0;
  for (const g of ground) {
    for (let i = 0; i < d; i++) {
      // (ρ g)_i
      let vr = 0;
      let vi = 0;
      const row = i * d;
      for (let j = 0; j < d; j++) {
        const a = rho.re[row + j];
        const b = rho.im[row + j];
        vr += a * g.re[j] - b * g.im[j];
        vi += a * g.im[j] + b * g.re[j];
      }
      w += g.re[i] * vr + g.im[i] * vi;
    }
  }
  return w;
}

/** The same summary from a dense eigendecomposition (matrix observables): eigenvectors are exact. */
export function levelsOfEigen(eigen: HermitianEigen, count = 4): LowestLevels {
  const v = eigen.values;
  const d = eigen.dim;
  const scale = Math.max(1, Math.abs(v[0]), Math.abs(v[d - 1]));
  const levelTol = LEVEL_TOL * scale;
  const ground: ComplexVector[] = [];
  for (let k = 0; k < d && v[k] <= v[0] + levelTol; k++) {
    ground.push({
      re: eigen.vecRe.subarray(k * d, (k + 1) * d),
      im: eigen.vecIm.subarray(k * d, (k + 1) * d),
    });
  }
  return {
    lowest: Array.from(v.subarray(0, Math.min(count, d))),
    ground,
    levelTol,
    converged: true,
  };
}

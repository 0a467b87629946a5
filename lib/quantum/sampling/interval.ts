/**
 * Interval estimates for expectation values from shots — one method for every sampled
 * figure (totals, mitigated totals, per-term values, convergence points, sweep points,
 * shift-rule gradients).
 *
 * Method ("Bayes–Laplace Dirichlet posterior per setting, t limits, MOVER sum"):
 * 1. Per measurement setting g (N_g shots, per-shot values x ∈ [lo_g, hi_g]) the outcome
 *    law gets a Dirichlet-process prior whose base measure puts one pseudo-shot on each end
 *    of the value range, lo_g and hi_g (T. S. Ferguson, Ann. Statist. 1, 209 (1973)). The
 *    posterior of the setting mean μ_g is then the Dirichlet mean functional over the N_g
 *    observed values plus the two pseudo-shots, whose first two moments are exact:
 *      α₀ = N_g + 2,  m_g = (Σx + lo + hi)/α₀,  Var μ_g = ((Σx² + lo² + hi²)/α₀ − m_g²)/(α₀ + 1).
 *    For one ±1 outcome this is the Beta(k + 1, N − k + 1) posterior of the uniform
 *    (Bayes–Laplace) prior; unlike the plug-in variance it never vanishes when every shot
 *    gave the same outcome (an eigenstate, or a term near convergence): it is then
 *    ≈ (range/N)², the honest size of what N identical shots cannot exclude.
 * 2. Per setting, a 95 % interval [l_g, u_g] = m_g ± t_{0.975, N_g+1}·√Var μ_g (a Student t quantile:
 *    heavy tails for few shots, 1.96 for many), clipped to [lo_g, hi_g]. For one ±1 outcome this
 *    keeps the exact coverage ≥ 91.6 % for every N = 10 … 400 and every ⟨Z⟩ (≥ 93 % from N = 50;
 *    mean ≈ 95–97 %; binomial sums), where the plug-in (Wald) interval collapses near ⟨Z⟩ = ±1.
 * 3. Settings are independent; the sum c + Σ w_g μ_g gets the MOVER ("square-and-add") limits
 *    L = x̄ − √Σ(w_g(x̄_g − l_g))², U = x̄ + √Σ(w_g(u_g − x̄_g))² around the sample estimate x̄
 *    (R. G. Newcombe, Stat. Med. 17, 873 (1998); G. Y. Zou & A. Donner, Stat. Med. 27, 1693
 *    (2008); l and u swap for w_g < 0). Unlike a normal interval around the summed posterior
 *    means, the pseudo-shots' pull towards each range's middle does not accumulate over many
 *    (nearly) deterministic settings. The interval is clipped to the range the true value
 *    can take.
 * Reported: `mean` = the sample mean (unbiased; with one setting the plain average of the
 * shots), `stdErr` = the posterior standard deviation √Var (close to the plug-in standard
 * error once both outcomes are well represented, never 0 from a finite number of shots),
 * `ci95` as above. Cost O(settings); only (N, Σx, Σx²) per setting are needed.
 */
import { Z95 } from "./normal";
import { studentQuantileTwoSided } from "./student-t";

/** One setting's contribution: w · (mean of its per-shot values). */
export interface SettingMoments {
  /** Shots of the setting (≥ 1 to contribute). */
  shots: number;
  /** Σ x over the shots. */
  sum: number;
  /** Σ x² over the shots. */
  sumSq: number;
  /** Smallest and largest per-shot value the setting can produce (the pseudo-shots). */
  lo: number;
  hi: number;
  /** Multiplier of this setting's mean in the combination (default 1). */
  weight?: number;
}

export interface IntervalEstimate {
  /** c + Σ_g w_g · (Σx/N)_g: the sample estimate. */
  mean: number;
  /** Posterior standard deviation of the combination. */
  stdErr: number;
  /** 95 % interval (see module doc); contains `mean`. */
  ci95: [number, number];
}

export interface LinearCombinationOptions {
  /** Constant added to the combination (e.g. the identity term's coefficient). */
  offset?: number;
  /** Values the true combination can take, e.g. [c_I − Σ|c_i|, c_I + Σ|c_i|]; clips the interval. */
  range?: [number, number];
}

/** Half-width multiplier for two-sided 95 %. */
const ALPHA = 0.05;

/** Posterior mean and variance of one setting's mean (see module doc, step 1). */
export function settingPosterior(
  s: Pick<SettingMoments, "shots" | "sum" | "sumSq" | "lo" | "hi">,
): { mean: number; variance: number } {
  const a0 = s.shots + 2;
  const mean = (s.sum + s.lo + s.hi) / a0;
  const second = (s.sumSq + s.lo * s.lo + s.hi * s.hi) / a0;
  return { mean, variance: Math.max(0, second - mean * mean) / (a0 + 1) };
}

/**
 * Estimate, posterior standard error and 95 % interval of c + Σ_g w_g·μ_g from independent
 * settings' shot statistics (module doc). Settings with 0 shots are refused (a RangeError):
 * nothing can be said about their mean.
 *
 * Example (one ±1 term, 100 shots all +1, range [−1, 1]):
 *   estimateLinearCombination([{ shots: 100, sum: 100, sumSq: 100, lo: -1, hi: 1 }], { range: [-1, 1] })
 *   → { mean: 1, stdErr ≈ 0.0193, ci95 ≈ [0.942, 1] }
 */
export function estimateLinearCombination(
  settings: SettingMoments[],
  options: LinearCombinationOptions = {},
): IntervalEstimate {
  let mean = options.offset ?? 0;
  let variance = 0;
  let below = 0; // Σ (distance from the estimate down to the setting's lower limit)²
  let above = 0;
  for (const s of settings) {
    if (!(s.shots >= 1))
      throw new RangeError("every setting in an estimate needs at least one shot");
    const w = s.weight ?? 1;
    if (w === 0) continue;
    const p = settingPosterior(s);
    const sd = Math.sqrt(p.variance);
    const t = tQuantile95(s.shots + 1);
    const xbar = s.sum / s.shots;
    const lower = Math.max(Math.min(s.lo, s.hi), p.mean - t * sd);
    const upper = Math.min(Math.max(s.lo, s.hi), p.mean + t * sd);
    const down = Math.max(0, xbar - lower);
    const up = Math.max(0, upper - xbar);
    mean += w * xbar;
    variance += w * w * p.variance;
    if (w > 0) {
      below += (w * down) ** 2;
      above += (w * up) ** 2;
    } else {
      below += (w * up) ** 2;
      above += (w * down) ** 2;
    }
  }
  let lo = mean - Math.sqrt(below);
  let hi = mean + Math.sqrt(above);
  if (options.range) {
    lo = Math.max(lo, Math.min(options.range[0], mean));
    hi = Math.min(hi, Math.max(options.range[1], mean));
  }
  return { mean, stdErr: Math.sqrt(variance), ci95: [lo, hi] };
}

const T_CACHE = new Map<number, number>();

/** t_{0.975, ν}: memoised; A&S 26.7.5 series in 1/ν (error < 1e-10) for ν ≥ 200. */
export function tQuantile95(df: number): number {
  if (df >= 200) {
    const x = Z95;
    const x2 = x * x;
    const g1 = (x * (x2 + 1)) / 4;
    const g2 = (x * (5 * x2 * x2 + 16 * x2 + 3)) / 96;
    const g3 = (x * (3 * x2 ** 3 + 19 * x2 * x2 + 17 * x2 - 15)) / 384;
    const g4 = (x * (79 * x2 ** 4 + 776 * x2 ** 3 + 1482 * x2 * x2 - 1920 * x2 - 945)) / 92160;
    return x + g1 / df + g2 / df ** 2 + g3 / df ** 3 + g4 / df ** 4;
  }
  let q = T_CACHE.get(df);
  if (q === undefined) {
    q = studentQuantileTwoSided(ALPHA, df);
    T_CACHE.set(df, q);
  }
  return q;
}

/**
 * A z-like distance of `reference` from an estimate, consistent with its (possibly
 * asymmetric) interval: (mean − reference) divided by the half-width on the reference's
 * side over Z95, so |z| ≤ Z95 exactly when the reference lies inside `ci95`. Falls back
 * to `stdErr` when that side has zero width; null when both are zero.
 */
export function intervalZ(
  e: { mean: number; stdErr: number; ci95?: [number, number] | null },
  reference: number,
): number | null {
  const side = e.ci95 ? (reference < e.mean ? e.mean - e.ci95[0] : e.ci95[1] - e.mean) / Z95 : 0;
  const scale = side > 0 ? side : e.stdErr;
  if (!(scale > 0) || !Number.isFinite(scale)) return null;
  return (e.mean - reference) / scale;
}

/** One sentence naming the method, for the run page and the API documentation. */
export const INTERVAL_METHOD_SENTENCE =
  "Error bars are 95 % Bayesian intervals: each measurement setting's outcomes get a Dirichlet posterior with one pseudo-shot at each end of its value range (the uniform Bayes–Laplace prior for a ±1 outcome), its limits use a Student t quantile, and settings are combined by square-and-add (MOVER), so the bar never collapses to zero when every shot agrees.";

/** Shots per setting below which no interval is an honest precision (the run page says so). */
export const FEW_SHOTS_PER_SETTING = 5;

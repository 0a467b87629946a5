/**
 * Interval estimates for expectation values from shots — one method for every sampled
 * figure (totals, mitigated totals, per-term values, convergence points, sweep points,
 * shift-rule gradients).
 *
 * Method ("Bayes–Laplace Dirichlet posterior per setting, Welch–Satterthwaite t interval"):
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
 * 2. Settings are independent, so posterior means and variances add (weights w_g enter as
 *    w_g·m_g and w_g²·Var μ_g). The 95 % interval is m ± t_{0.975,ν}·√Var around the posterior
 *    mean, with ν from the Welch–Satterthwaite formula ν = (Σ v_g)² / Σ (v_g²/ν_g), ν_g = N_g + 1
 *    (F. E. Satterthwaite, Biometrics Bull. 2, 110 (1946); B. L. Welch, Biometrika 34, 28
 *    (1947)): few shots give heavy t tails, many shots the normal 1.96. The interval is
 *    widened to contain the sample mean and clipped to the range the true value can take.
 *
 * Reported: `mean` = the sample mean (unbiased; with one setting the plain average of the
 * shots), `stdErr` = the posterior standard deviation √Var (close to the plug-in standard
 * error once both outcomes are well represented, never 0 from a finite number of shots),
 * `ci95` as above, `df` = ν. Cost O(settings); only (N, Σx, Σx²) per setting are needed.
 */
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
  /** Welch–Satterthwaite degrees of freedom of the t quantile (Infinity when exact). */
  df: number;
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
 *   → { mean: 1, stdErr ≈ 0.0193, ci95 ≈ [0.942, 1], df: 101 }
 */
export function estimateLinearCombination(
  settings: SettingMoments[],
  options: LinearCombinationOptions = {},
): IntervalEstimate {
  let mean = options.offset ?? 0;
  let post = mean;
  let variance = 0;
  let dfDenominator = 0;
  for (const s of settings) {
    if (!(s.shots >= 1))
      throw new RangeError("every setting in an estimate needs at least one shot");
    const w = s.weight ?? 1;
    if (w === 0) continue;
    const p = settingPosterior(s);
    const v = w * w * p.variance;
    mean += (w * s.sum) / s.shots;
    post += w * p.mean;
    variance += v;
    dfDenominator += (v * v) / (s.shots + 1);
  }
  const stdErr = Math.sqrt(variance);
  const df = variance > 0 ? (variance * variance) / dfDenominator : Number.POSITIVE_INFINITY;
  const half = variance > 0 ? studentQuantileTwoSided(ALPHA, df) * stdErr : 0;
  let lo = Math.min(post - half, mean);
  let hi = Math.max(post + half, mean);
  if (options.range) {
    lo = Math.max(lo, Math.min(options.range[0], mean));
    hi = Math.min(hi, Math.max(options.range[1], mean));
  }
  return { mean, stdErr, ci95: [lo, hi], df };
}

/** One sentence naming the method, for the run page and the API documentation. */
export const INTERVAL_METHOD_SENTENCE =
  "Error bars are 95 % Bayesian intervals: each measurement setting's outcomes get a Dirichlet posterior with one pseudo-shot at each end of its value range (the uniform Bayes–Laplace prior for a ±1 outcome), and the settings are combined with a Welch–Satterthwaite t quantile, so the bar never collapses to zero when every shot agrees.";

/** Shots per setting below which no interval is an honest precision (the run page says so). */
export const FEW_SHOTS_PER_SETTING = 5;

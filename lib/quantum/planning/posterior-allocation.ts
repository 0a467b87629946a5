/**
 * Shot split and shot plan for the reported (posterior) standard error, interval.ts.
 *
 * With N shots a setting of single-shot mean μ and variance σ², value range [lo, hi],
 * has an expected posterior variance of about V(N) = (Nσ² + D)/((N + 2)(N + 3)) with
 * D = (lo − μ)² + (hi − μ)² (the two pseudo-shots), i.e. ≈ σ²/N + D/N². The plug-in rule
 * N_g ∝ σ_g (McClean et al. 2016) would give a deterministic setting (σ = 0) a single
 * shot and leave its posterior variance at ~D/9; minimising Σ_g (σ_g²/N_g + D_g/N_g²)
 * under Σ N_g = N instead (Lagrange: σ_g²/N_g² + 2D_g/N_g³ = λ for every g) gives every
 * setting the shots its honest error bar needs. λ is found by bisection (Σ N_g(λ) is
 * decreasing), each N_g(λ) by Newton's method on the cubic λN³ − σ²N − 2D = 0 from an
 * upper bound (monotone convergence). Without any pseudo-shot term (D = 0) this is the
 * plug-in split N_g ∝ σ_g.
 */
import type { SettingPlan } from "./shot-plan";

export interface SettingLoad {
  /** Exact single-shot variance σ². */
  variance: number;
  /** D = (lo − μ)² + (hi − μ)². */
  pseudo: number;
}

/** The positive root of λN³ − σ²N − 2D = 0 (0 when σ² = D = 0). */
function shotsAt(lambda: number, l: SettingLoad): number {
  if (l.variance <= 0 && l.pseudo <= 0) return 0;
  let n = Math.sqrt(l.variance / lambda) + Math.cbrt((2 * l.pseudo) / lambda);
  for (let i = 0; i < 100; i++) {
    const f = lambda * n * n * n - l.variance * n - 2 * l.pseudo;
    const df = 3 * lambda * n * n - l.variance;
    const step = f / df;
    n -= step;
    if (!(Math.abs(step) > 1e-12 * n)) break;
  }
  return n;
}

/** Continuous optimal shots per setting for `total` shots (Σ = total). */
export function posteriorWeights(total: number, loads: SettingLoad[]): number[] {
  if (loads.every((l) => l.variance <= 0 && l.pseudo <= 0)) return loads.map(() => 1);
  let lo = -200;
  let hi = 200; // log λ bracket
  for (let i = 0; i < 200; i++) {
    const mid = 0.5 * (lo + hi);
    const s = loads.reduce((a, l) => a + shotsAt(Math.exp(mid), l), 0);
    if (s > total) lo = mid;
    else hi = mid;
  }
  return loads.map((l) => shotsAt(Math.exp(0.5 * (lo + hi)), l));
}

/** Expected posterior variance of a setting after N shots (module doc). */
export function expectedPosteriorVariance(n: number, l: SettingLoad): number {
  return (n * l.variance + l.pseudo) / ((n + 2) * (n + 3));
}

/**
 * Fewest shots (split as above, each N_g rounded up, at least 1) whose expected posterior
 * standard error Σ_g V_g(N_g) is at most ε².
 */
export function posteriorPlan(epsilon: number, loads: SettingLoad[]): SettingPlan {
  const target = epsilon * epsilon;
  const variance = (ns: number[]): number =>
    ns.reduce((a, n, g) => a + expectedPosteriorVariance(n, loads[g]), 0);
  const split = (lambda: number): number[] =>
    loads.map((l) => Math.max(1, Math.ceil(shotsAt(lambda, l) - 1e-9)));
  let lo = -200;
  let hi = 200; // log λ: small λ → many shots
  for (let i = 0; i < 200; i++) {
    const mid = 0.5 * (lo + hi);
    if (variance(split(Math.exp(mid))) <= target) lo = mid;
    else hi = mid;
  }
  const perSetting = split(Math.exp(lo));
  return { perSetting, totalShots: perSetting.reduce((a, b) => a + b, 0) };
}

/**
 * Shot statistics (common practice; J. R. McClean et al., New J. Phys. 18, 023023 (2016)).
 *
 * Setting g with N_g shots of value O_g(b) = Σ_{i∈g} c_i v_i(b): sample mean ō_g and
 * plug-in variance s_g² = (1/N_g) Σ O_g² − ō_g², which equals Σ_{i,j∈g} c_i c_j Ĉov(v_i, v_j)
 * (the sample covariances of the terms on the shared shots). The total estimate is
 * c_I + Σ_g ō_g with variance Σ_g s_g² / N_g; the 95 % interval is mean ± 1.959964·stdErr
 * (normal approximation). For one ±1 term the standard error is √((1 − m²)/N).
 */
import type { SettingSample } from "./draw-setting";

/** Two-sided 95 % standard-normal quantile Φ⁻¹(0.975). */
export const Z95 = 1.959964;

export interface Estimate {
  mean: number;
  stdErr: number;
  ci95: [number, number];
}

export function withInterval(mean: number, stdErr: number): Estimate {
  return { mean, stdErr, ci95: [mean - Z95 * stdErr, mean + Z95 * stdErr] };
}

/** Plug-in mean and variance of the per-shot values from (Σx, Σx², N). */
export function meanVariance(sum: number, sumSq: number, n: number): { mean: number; variance: number } {
  if (n <= 0) return { mean: 0, variance: 0 };
  const mean = sum / n;
  return { mean, variance: Math.max(0, sumSq / n - mean * mean) };
}

/** Total raw (or mitigated) estimate over settings, plus the constant identity part. */
export function combineSettings(offset: number, samples: SettingSample[], mitigated: boolean): Estimate {
  let mean = offset;
  let variance = 0;
  for (const s of samples) {
    const mv = mitigated ? meanVariance(s.mitSum, s.mitSumSq, s.shots) : meanVariance(s.sum, s.sumSq, s.shots);
    mean += mv.mean;
    variance += mv.variance / s.shots;
  }
  return withInterval(mean, Math.sqrt(variance));
}

export interface ConvergencePoint {
  shots: number;
  mean: number;
  stdErr: number;
}

/**
 * Checkpoint prefixes: K ≤ maxPoints log-spaced fractions f from ≈ 10/N to 1; setting
 * g contributes its first max(1, round(f·N_g)) shots, so every point is a valid
 * estimate from a prefix of every setting. Totals are strictly increasing.
 */
export function planCheckpoints(perSetting: number[], maxPoints = 40): number[][] {
  const total = perSetting.reduce((a, b) => a + b, 0);
  const prefixes: number[][] = perSetting.map(() => []);
  if (total === 0) return prefixes;
  const fMin = Math.min(1, Math.max(10, perSetting.length) / total);
  const k = fMin >= 1 ? 1 : maxPoints;
  let lastTotal = 0;
  for (let j = 0; j < k; j++) {
    const f = k === 1 ? 1 : fMin * (1 / fMin) ** (j / (k - 1));
    const sizes = perSetting.map((n) => (j === k - 1 ? n : Math.min(n, Math.max(1, Math.round(f * n)))));
    const t = sizes.reduce((a, b) => a + b, 0);
    if (t <= lastTotal) continue;
    lastTotal = t;
    sizes.forEach((s, g) => prefixes[g].push(s));
  }
  return prefixes;
}

/** Running estimate and standard error at each checkpoint (raw values). */
export function convergenceSeries(offset: number, samples: SettingSample[]): ConvergencePoint[] {
  if (samples.length === 0) return [];
  const points = samples[0].checkpoints.length;
  const out: ConvergencePoint[] = [];
  for (let j = 0; j < points; j++) {
    let mean = offset;
    let variance = 0;
    let shots = 0;
    for (const s of samples) {
      const c = s.checkpoints[j];
      const mv = meanVariance(c.sum, c.sumSq, c.shots);
      mean += mv.mean;
      variance += mv.variance / c.shots;
      shots += c.shots;
    }
    out.push({ shots, mean, stdErr: Math.sqrt(variance) });
  }
  return out;
}

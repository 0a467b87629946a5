/**
 * Shot statistics of a whole observable: the total over measurement settings, raw or
 * readout-mitigated, and its running value at checkpoint prefixes.
 *
 * Setting g with N_g shots of value O_g(b) = Σ_{i∈g} c_i v_i(b) contributes its power sums
 * (N_g, Σ O_g, Σ O_g²) and its value range; interval.ts turns them into the estimate c_I + Σ_g ō_g,
 * a posterior standard error that includes the covariances of the terms on the shared shots
 * (Σ O_g² carries them; J. R. McClean et al., New J. Phys. 18, 023023 (2016)) and a 95 %
 * interval that stays honest when a setting's outcomes are (nearly) deterministic.
 */
import type { SettingSample } from "./draw-setting";
import { estimateLinearCombination, type IntervalEstimate, type SettingMoments } from "./interval";

export type Estimate = IntervalEstimate;

/** Per-shot value ranges of one setting, raw and (when mitigating) mitigated. */
export interface SettingRanges {
  raw: [number, number];
  mitigated: [number, number] | null;
}

function momentsOf(
  shots: number,
  sum: number,
  sumSq: number,
  range: [number, number],
): SettingMoments {
  return { shots, sum, sumSq, lo: range[0], hi: range[1] };
}

/**
 * Total raw (or mitigated) estimate over settings plus the constant identity part.
 * `physical` is the range the exact total can take (clips the interval).
 */
export function combineSettings(
  offset: number,
  samples: SettingSample[],
  ranges: SettingRanges[],
  mitigated: boolean,
  physical: [number, number],
): Estimate {
  const moments = samples.map((s, g) =>
    mitigated
      ? momentsOf(s.shots, s.mitSum, s.mitSumSq, ranges[g].mitigated!)
      : momentsOf(s.shots, s.sum, s.sumSq, ranges[g].raw),
  );
  return estimateLinearCombination(moments, { offset, range: physical });
}

export interface ConvergencePoint {
  shots: number;
  mean: number;
  stdErr: number;
  ci95: [number, number];
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
    const sizes = perSetting.map((n) =>
      j === k - 1 ? n : Math.min(n, Math.max(1, Math.round(f * n))),
    );
    const t = sizes.reduce((a, b) => a + b, 0);
    if (t <= lastTotal) continue;
    lastTotal = t;
    sizes.forEach((s, g) => prefixes[g].push(s));
  }
  return prefixes;
}

/** Running estimate, standard error and interval at each checkpoint (raw values). */
export function convergenceSeries(
  offset: number,
  samples: SettingSample[],
  ranges: SettingRanges[],
  physical: [number, number],
): ConvergencePoint[] {
  if (samples.length === 0) return [];
  const points = samples[0].checkpoints.length;
  const out: ConvergencePoint[] = [];
  for (let j = 0; j < points; j++) {
    let shots = 0;
    const moments = samples.map((s, g) => {
      const c = s.checkpoints[j];
      shots += c.shots;
      return momentsOf(c.shots, c.sum, c.sumSq, ranges[g].raw);
    });
    const e = estimateLinearCombination(moments, { offset, range: physical });
    out.push({ shots, mean: e.mean, stdErr: e.stdErr, ci95: e.ci95 });
  }
  return out;
}

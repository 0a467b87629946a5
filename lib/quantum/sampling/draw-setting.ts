/**
 * Draws the shots of one measurement setting and accumulates what the statistics need.
 *
 * The outcome law is the setting's distribution (rotated state, readout included —
 * readout.ts); shots are drawn with an alias table in O(2^n + shots). Per shot the
 * setting value O(b) (and its mitigated value) is added to running sums; at the
 * prefix sizes in `checkpoints` the sums are recorded for the convergence chart.
 * Values are memoised per outcome (a dense table when 2^n is small next to the shot
 * count, else a Map), so a setting costs O(shots + distinct outcomes · terms).
 */
import { AliasTable } from "./alias-table";
import type { Rng } from "./rng";
import type { SettingModel } from "./setting-model";

export interface SettingSample {
  shots: number;
  sum: number;
  sumSq: number;
  mitSum: number;
  mitSumSq: number;
  /** Raw/mitigated (sum, sumSq) at each checkpoint prefix. */
  checkpoints: { shots: number; sum: number; sumSq: number; mitSum: number; mitSumSq: number }[];
  /** Distinct outcomes in ascending index order with their counts. */
  outcomes: Int32Array;
  counts: Float64Array;
  /** Per-term Σ v_i, Σ v̂_i, Σ v̂_i² over the shots (term order of the setting). */
  termSums: Float64Array;
  termMitSums: Float64Array | null;
  termMitSumSq: Float64Array | null;
}

const CHUNK = 1 << 15;

type Lookup = (b: number) => number;

function memoise(fn: Lookup, dim: number, shots: number): Lookup {
  if (dim <= 1 << 22 && dim <= 8 * shots) {
    const table = new Float64Array(dim).fill(Number.NaN);
    return (b) => {
      let v = table[b];
      if (v !== v) v = table[b] = fn(b);
      return v;
    };
  }
  const map = new Map<number, number>();
  return (b) => {
    let v = map.get(b);
    if (v === undefined) map.set(b, (v = fn(b)));
    return v;
  };
}

export interface DrawSettingInput {
  distribution: Float64Array;
  shots: number;
  rng: Rng;
  model: SettingModel;
  /** Ascending prefix sizes (each ≤ shots) at which to record running sums. */
  checkpoints: number[];
  /** Called between chunks with the fraction of this setting's shots done. */
  tick?: (fraction: number) => void | Promise<void>;
}

export async function drawSetting(input: DrawSettingInput): Promise<SettingSample> {
  const { distribution, shots, rng, model, checkpoints } = input;
  const dim = distribution.length;
  const alias = new AliasTable(distribution);
  const value = memoise((b) => model.value(b), dim, shots);
  const mitFn = model.mitigated;
  const mitigated = mitFn ? memoise(mitFn, dim, shots) : null;
  const dense = dim <= 1 << 24 && dim <= 4 * shots;
  const hist = dense ? new Float64Array(dim) : null;
  const map = dense ? null : new Map<number, number>();
  let sum = 0;
  let sumSq = 0;
  let mitSum = 0;
  let mitSumSq = 0;
  const recorded: SettingSample["checkpoints"] = [];
  let next = 0;
  for (let start = 0; start < shots; start += CHUNK) {
    const end = Math.min(shots, start + CHUNK);
    for (let s = start; s < end; s++) {
      const b = alias.draw(rng);
      if (hist) hist[b]++;
      else map!.set(b, (map!.get(b) ?? 0) + 1);
      const v = value(b);
      sum += v;
      sumSq += v * v;
      if (mitigated) {
        const m = mitigated(b);
        mitSum += m;
        mitSumSq += m * m;
      }
      while (next < checkpoints.length && checkpoints[next] === s + 1) {
        recorded.push({ shots: s + 1, sum, sumSq, mitSum, mitSumSq });
        next++;
      }
    }
    if (input.tick) await input.tick(end / shots);
  }
  let outcomes: Int32Array;
  let counts: Float64Array;
  if (hist) {
    let distinct = 0;
    for (let b = 0; b < dim; b++) if (hist[b] > 0) distinct++;
    outcomes = new Int32Array(distinct);
    counts = new Float64Array(distinct);
    for (let b = 0, j = 0; b < dim; b++) {
      if (hist[b] > 0) {
        outcomes[j] = b;
        counts[j++] = hist[b];
      }
    }
  } else {
    const keys = [...map!.keys()].sort((a, b) => a - b);
    outcomes = Int32Array.from(keys);
    counts = Float64Array.from(keys, (k) => map!.get(k)!);
  }
  const termSums = new Float64Array(model.termCount);
  const termMitSums = mitFn ? new Float64Array(model.termCount) : null;
  const termMitSumSq = mitFn ? new Float64Array(model.termCount) : null;
  for (let j = 0; j < outcomes.length; j++) model.accumulateTerms(outcomes[j], counts[j], termSums, termMitSums, termMitSumSq);
  return { shots, sum, sumSq, mitSum, mitSumSq, checkpoints: recorded, outcomes, counts, termSums, termMitSums, termMitSumSq };
}

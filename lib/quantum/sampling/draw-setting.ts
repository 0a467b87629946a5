/**
 * Draws the shots of one measurement setting and accumulates what the statistics need.
 *
 * The outcome law is the setting's distribution (rotated state, readout included —
 * readout.ts). Shots are drawn in chunks of ≤ 2^20 with multinomial.ts: sorted outcomes
 * (histogram and per-outcome values computed run by run, sequentially); each shot is dealt
 * into the interval between consecutive `checkpoints` it would occupy in a uniformly random
 * order, and the interval sums give the running sums at every checkpoint (for the
 * convergence chart). Chunks are independent, so the whole sequence is i.i.d. Values are memoised per outcome (a dense
 * table when 2^n is small next to the shot count, else a Map). Cost O(2^n + shots +
 * distinct outcomes · terms), memory O(2^n + chunk).
 */
import { IntervalAssigner, cumulative, drawSortedOutcomes } from "./multinomial";
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

const CHUNK = 1 << 20;

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
  const cdf = cumulative(distribution);
  const value = memoise((b) => model.value(b), dim, shots);
  const mitFn = model.mitigated;
  const mitigated = mitFn ? memoise(mitFn, dim, shots) : null;
  const dense = dim <= 1 << 24 && dim <= 4 * shots;
  const hist = dense ? new Float64Array(dim) : null;
  const map = dense ? null : new Map<number, number>();
  const size = Math.min(CHUNK, shots);
  const outcomes = new Int32Array(size);
  const scratch = new Float64Array(size);
  let sum = 0;
  let sumSq = 0;
  let mitSum = 0;
  let mitSumSq = 0;
  const recorded: SettingSample["checkpoints"] = [];
  let next = 0;
  for (let start = 0; start < shots; start += CHUNK) {
    const m = Math.min(CHUNK, shots - start);
    drawSortedOutcomes(cdf, m, rng, outcomes, scratch);
    // interval boundaries inside this chunk: checkpoints in (start, start + m), then the end
    const bounds: number[] = [];
    for (let k = next; k < checkpoints.length && checkpoints[k] < start + m; k++) {
      const pos = checkpoints[k] - start;
      if (pos > 0 && pos !== bounds[bounds.length - 1]) bounds.push(pos);
    }
    bounds.push(m);
    const sizes = bounds.map((b, j) => b - (j === 0 ? 0 : bounds[j - 1]));
    const deal = new IntervalAssigner(sizes, rng);
    const iv = new Float64Array(4 * sizes.length); // per interval: Σv, Σv², Σv̂, Σv̂²
    for (let i = 0; i < m;) {
      const b = outcomes[i];
      let j = i + 1;
      while (j < m && outcomes[j] === b) j++;
      const run = j - i;
      if (hist) hist[b] += run;
      else map!.set(b, (map!.get(b) ?? 0) + run);
      const v = value(b);
      const w = mitigated ? mitigated(b) : 0;
      if (sizes.length === 1) {
        iv[0] += run * v;
        iv[1] += run * v * v;
        iv[2] += run * w;
        iv[3] += run * w * w;
      } else {
        for (let r = 0; r < run; r++) {
          const k = 4 * deal.next();
          iv[k] += v;
          iv[k + 1] += v * v;
          iv[k + 2] += w;
          iv[k + 3] += w * w;
        }
      }
      i = j;
    }
    for (let j = 0; j < sizes.length; j++) {
      sum += iv[4 * j];
      sumSq += iv[4 * j + 1];
      mitSum += iv[4 * j + 2];
      mitSumSq += iv[4 * j + 3];
      const pos = start + bounds[j];
      while (next < checkpoints.length && checkpoints[next] === pos) {
        recorded.push({ shots: pos, sum, sumSq, mitSum, mitSumSq });
        next++;
      }
    }
    if (input.tick) await input.tick((start + m) / shots);
  }
  let distinctOutcomes: Int32Array;
  let counts: Float64Array;
  if (hist) {
    let distinct = 0;
    for (let b = 0; b < dim; b++) if (hist[b] > 0) distinct++;
    distinctOutcomes = new Int32Array(distinct);
    counts = new Float64Array(distinct);
    for (let b = 0, j = 0; b < dim; b++) {
      if (hist[b] > 0) {
        distinctOutcomes[j] = b;
        counts[j++] = hist[b];
      }
    }
  } else {
    const keys = [...map!.keys()].sort((a, b) => a - b);
    distinctOutcomes = Int32Array.from(keys);
    counts = Float64Array.from(keys, (k) => map!.get(k)!);
  }
  const termSums = new Float64Array(model.termCount);
  const termMitSums = mitFn ? new Float64Array(model.termCount) : null;
  const termMitSumSq = mitFn ? new Float64Array(model.termCount) : null;
  for (let j = 0; j < distinctOutcomes.length; j++)
    model.accumulateTerms(distinctOutcomes[j], counts[j], termSums, termMitSums, termMitSumSq);
  return {
    shots,
    sum,
    sumSq,
    mitSum,
    mitSumSq,
    checkpoints: recorded,
    outcomes: distinctOutcomes,
    counts,
    termSums,
    termMitSums,
    termMitSumSq,
  };
}

/**
 * Drawing shots in O(2^n + shots) with sequential memory access.
 *
 * 1. Sorted uniforms by exponential spacings (L. Devroye, Non-Uniform Random Variate
 *    Generation, 1986, ch. V.3): with E_1 … E_{m+1} i.i.d. Exp(1) and S_k = E_1 + … + E_k,
 *    (S_1/S_{m+1}, …, S_m/S_{m+1}) are the order statistics of m i.i.d. U(0,1).
 * 2. Inversion against the cumulative distribution, walking forward (galloping search
 *    when outcomes are many and shots few), gives the m outcomes in ascending order —
 *    a multinomial sample, each outcome b with probability p_b.
 * 3. The running estimate needs the shots in a uniformly random order only at checkpoint
 *    prefixes: `IntervalAssigner` deals the sorted shots into the intervals between
 *    checkpoints exactly as a random permutation would, without storing or shuffling them.
 * Compared with an alias table or a shuffle this avoids a cache miss per shot on large states.
 */
import { nextUniform, type Rng } from "./rng";

/** Cumulative sums of non-negative weights (negatives from round-off count as 0). */
export function cumulative(weights: Float64Array): Float64Array {
  const cdf = new Float64Array(weights.length);
  let s = 0;
  for (let i = 0; i < weights.length; i++) {
    s += weights[i] > 0 ? weights[i] : 0;
    cdf[i] = s;
  }
  if (!(s > 0)) throw new RangeError("cannot sample: the probabilities sum to zero");
  return cdf;
}

/**
 * Fills out[0..m) with m outcomes drawn from the law whose cumulative sums are `cdf`,
 * in ascending order. `spacing` is scratch space of length ≥ m.
 */
export function drawSortedOutcomes(
  cdf: Float64Array,
  m: number,
  rng: Rng,
  out: Int32Array,
  spacing: Float64Array,
): void {
  const k = cdf.length;
  const total = cdf[k - 1];
  let s = 0;
  for (let i = 0; i < m; i++) {
    s -= Math.log(1 - nextUniform(rng));
    spacing[i] = s;
  }
  s -= Math.log(1 - nextUniform(rng));
  const scale = total / s;
  let last = k - 1;
  while (last > 0 && cdf[last] === cdf[last - 1]) last--;
  let j = 0;
  for (let i = 0; i < m; i++) {
    const u = spacing[i] * scale;
    if (!(cdf[j] > u)) {
      // gallop: find the first index with cdf > u beyond j
      let lo = j;
      let step = 1;
      while (lo + step < k && !(cdf[lo + step] > u)) {
        lo += step;
        step *= 2;
      }
      let hi = Math.min(k - 1, lo + step);
      while (hi - lo > 1) {
        const mid = (lo + hi) >>> 1;
        if (cdf[mid] > u) hi = mid;
        else lo = mid;
      }
      j = cdf[hi] > u ? hi : last;
    }
    out[i] = j > last ? last : j;
  }
}

/**
 * Assigns shots, visited in any fixed order, to the consecutive position intervals of a
 * uniformly random shot order: interval j holds positions [B_j, B_{j+1}). Each shot goes to
 * interval j with probability (free places in j) / (free places left) — sequential sampling
 * without replacement, so every interval receives the multiset a random permutation would put
 * there. Scanning from the last (largest, for log-spaced boundaries) interval keeps the
 * expected search short.
 */
export class IntervalAssigner {
  private readonly free: Float64Array;
  private left: number;

  constructor(
    sizes: number[],
    private readonly rng: Rng,
  ) {
    this.free = Float64Array.from(sizes);
    this.left = sizes.reduce((a, b) => a + b, 0);
  }

  next(): number {
    const last = this.free.length - 1;
    if (last === 0) return 0;
    let t = Math.floor(nextUniform(this.rng) * this.left);
    let j = last;
    while (j > 0 && t >= this.free[j]) {
      t -= this.free[j];
      j--;
    }
    this.free[j]--;
    this.left--;
    return j;
  }
}

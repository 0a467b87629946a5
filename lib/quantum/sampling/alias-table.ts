/**
 * Walker's alias method in Vose's numerically stable form (A. J. Walker, ACM TOMS 3,
 * 253 (1977); M. D. Vose, IEEE TSE 17, 972 (1991)): O(K) set-up, O(1) per draw, one
 * 53-bit uniform per draw (column j = ⌊uK⌋, then the fractional part decides between j
 * and its alias). Shots come out in draw order, so running estimates are meaningful.
 */
import { nextUniform, type Rng } from "./rng";

export class AliasTable {
  readonly size: number;
  private readonly prob: Float64Array;
  private readonly alias: Int32Array;

  /** `weights` need not be normalised; negatives (round-off) count as 0. */
  constructor(weights: Float64Array) {
    const k = weights.length;
    this.size = k;
    this.prob = new Float64Array(k);
    this.alias = new Int32Array(k);
    let total = 0;
    for (let i = 0; i < k; i++) total += weights[i] > 0 ? weights[i] : 0;
    if (!(total > 0)) throw new RangeError("AliasTable: the weights sum to zero");
    const scaled = this.prob;
    const small = new Int32Array(k);
    const large = new Int32Array(k);
    let ns = 0;
    let nl = 0;
    for (let i = 0; i < k; i++) {
      scaled[i] = ((weights[i] > 0 ? weights[i] : 0) * k) / total;
      if (scaled[i] < 1) small[ns++] = i;
      else large[nl++] = i;
    }
    for (let i = 0; i < k; i++) this.alias[i] = i;
    while (ns > 0 && nl > 0) {
      const s = small[--ns];
      const l = large[--nl];
      this.alias[s] = l;
      scaled[l] = scaled[l] + scaled[s] - 1;
      if (scaled[l] < 1) small[ns++] = l;
      else large[nl++] = l;
    }
    // Left-overs are 1 up to round-off.
    while (nl > 0) scaled[large[--nl]] = 1;
    while (ns > 0) scaled[small[--ns]] = 1;
  }

  draw(rng: Rng): number {
    const u = nextUniform(rng) * this.size;
    const j = Math.floor(u);
    return u - j < this.prob[j] ? j : this.alias[j];
  }
}

/**
 * Relative cost of applying one gate matrix, in units of one dense 1-qubit pass over the
 * state (the kernels are compute-bound in scalar JS, so cost ≈ flops per amplitude ×
 * fraction of amplitudes touched). Used by fusion to decide whether merging pays off.
 * Weights are measured on this engine's kernels (npm run bench), rounded.
 */
import { classifyMatrix } from "./matrix-classify";

export const COST = {
  dense1q: 1,
  real1q: 0.8,
  twoBlock: 1,
  dense2q: 1.7,
  real2q: 1,
  /** per touched fraction */
  diagonal: 0.7,
  swap: 0.6,
  permutation: 0.8,
  subset2x2: 1,
} as const;

export function gateCost(m: Float64Array, k: number): number {
  const d = 1 << k;
  const shape = classifyMatrix(m, d);
  const s = shape.active.length;
  if (s === 0) return 0;
  const frac = s / d;
  if (shape.diagonal) return COST.diagonal * frac;
  if (shape.permutation) return (s === 2 ? COST.swap : COST.permutation) * frac;
  if (s < d && s === 2) return COST.subset2x2 * frac;
  if (k === 1) return shape.real ? COST.real1q : COST.dense1q;
  if (k === 2 && s === d)
    return shape.blockOperand >= 0 ? COST.twoBlock : shape.real ? COST.real2q : COST.dense2q;
  // dense s×s block on the touched fraction: s complex products per amplitude (a 1q pass does 2)
  return COST.dense2q * (s / 4) * frac;
}

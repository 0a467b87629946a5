/**
 * Exact single-shot variance of one measurement setting from its outcome law p
 * (rotated state, readout included): Var_g = Σ_b p_b O_g(b)² − (Σ_b p_b O_g(b))².
 *
 * For a Pauli setting this equals Σ_{i,j∈g} c_i c_j (⟨P_i P_j⟩ − ⟨P_i⟩⟨P_j⟩) (McClean et
 * al. 2016). Two evaluations, the cheaper one is used:
 * - direct: one pass over p evaluating O_g(b) — O(2^n · |g|);
 * - Walsh–Hadamard: W = WHT(p) gives every parity mean W[s] = E[(−1)^{|b&s|}], so
 *   E[O] = Σ_i c_i W[s_i] and E[O²] = Σ_{i,j} c_i c_j W[s_i ⊕ s_j] — O(n·2^n + |g|²).
 */
import { walshHadamardInPlace } from "../observable/walsh-hadamard";
import type { SettingModel } from "../sampling/setting-model";
import type { PauliSum } from "../types";

export function varianceFromLaw(p: Float64Array, value: (b: number) => number): number {
  return momentsFromLaw(p, value).variance;
}

/** Exact single-shot mean and variance of a setting from its outcome law. */
export function momentsFromLaw(
  p: Float64Array,
  value: (b: number) => number,
): { mean: number; variance: number } {
  let m1 = 0;
  let m2 = 0;
  for (let b = 0; b < p.length; b++) {
    const pb = p[b];
    if (pb === 0) continue;
    const v = value(b);
    m1 += pb * v;
    m2 += pb * v * v;
  }
  return { mean: m1, variance: Math.max(0, m2 - m1 * m1) };
}

export function pauliSettingVariance(
  p: Float64Array,
  sum: PauliSum,
  termIndices: number[],
  model: SettingModel,
): number {
  return pauliSettingMoments(p, sum, termIndices, model).variance;
}

/** Exact single-shot mean and variance of a Pauli setting (the cheaper evaluation, module doc). */
export function pauliSettingMoments(
  p: Float64Array,
  sum: PauliSum,
  termIndices: number[],
  model: SettingModel,
): { mean: number; variance: number } {
  const k = termIndices.length;
  const n = Math.round(Math.log2(p.length));
  if (k <= n + 1 || k * k > p.length * k) return momentsFromLaw(p, (b) => model.value(b));
  const w = p.slice();
  walshHadamardInPlace(w);
  const c = termIndices.map((i) => sum.terms[i].coefficient);
  const s = termIndices.map((i) => sum.terms[i].xMask | sum.terms[i].zMask);
  let m1 = 0;
  let m2 = 0;
  for (let i = 0; i < k; i++) {
    m1 += c[i] * w[s[i]];
    for (let j = 0; j < k; j++) m2 += c[i] * c[j] * w[s[i] ^ s[j]];
  }
  return { mean: m1, variance: Math.max(0, m2 - m1 * m1) };
}

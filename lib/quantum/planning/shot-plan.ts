/**
 * Shot planning without drawing shots (J. R. McClean et al., New J. Phys. 18, 023023
 * (2016); D. Wecker et al., Phys. Rev. A 92, 042303 (2015)).
 *
 * With settings g of single-shot variance Var_g, N_g shots give Var = Σ_g Var_g / N_g.
 * For a target standard error ε the optimal split N_g ∝ √Var_g needs
 * N = (Σ_g √Var_g)² / ε² shots ("state-aware"; each N_g rounded up, at least 1).
 * Without the state, Var_g ≤ (Σ_{i∈g} |c_i|)², so N ≤ (Σ_i |c_i|)² / ε² ("worst case";
 * the identity term is constant and excluded). For a matrix observable the worst case
 * uses Var ≤ ‖H‖² ≤ (max_i Σ_j |H_ij|)² (Gershgorin row-sum bound).
 */

import { EngineError } from "../errors";
import { MAX_SHOTS } from "../estimate/limits";
import type { SettingLoad } from "./posterior-allocation";
import { formatCount } from "../../format/numbers";

export interface SettingPlan {
  /** Per-setting shots, in setting order. */
  perSetting: number[];
  totalShots: number;
}

export interface ShotPlan {
  targetPrecision: number;
  settings: number;
  /** Guaranteed for any state: (Σ|c_i|)²/ε², split ∝ Σ_{i∈g}|c_i|. */
  worstCase: SettingPlan;
  /** From the exact variances of the state, when known. */
  stateAware: SettingPlan | null;
}

/** N_g = ⌈w_g · W / ε²⌉ (≥ 1) for weights w_g = standard deviations (or their bounds), W = Σ w. */
export function planFromStdDevs(stdDevs: number[], epsilon: number): SettingPlan {
  const total = stdDevs.reduce((a, b) => a + b, 0);
  const eps2 = epsilon * epsilon;
  // ε² underflows to 0 for ε ≲ 1e-162: divide by ε twice instead (a zero variance still needs 1 shot)
  const need = (w: number) =>
    w === 0 ? 0 : eps2 > 0 ? (w * total) / eps2 : (w / epsilon) * (total / epsilon);
  const perSetting = stdDevs.map((w) => Math.max(1, Math.ceil(need(w) - 1e-9)));
  return { perSetting, totalShots: perSetting.reduce((a, b) => a + b, 0) };
}

export function planShots(input: {
  targetPrecision: number;
  stdDevBounds: number[];
  stdDevs?: number[] | null;
}): ShotPlan {
  const eps = input.targetPrecision;
  if (!(eps > 0) || !Number.isFinite(eps))
    throw new RangeError("targetPrecision must be a positive finite number");
  return {
    targetPrecision: eps,
    settings: input.stdDevBounds.length,
    worstCase: planFromStdDevs(input.stdDevBounds, eps),
    stateAware: input.stdDevs ? planFromStdDevs(input.stdDevs, eps) : null,
  };
}

/**
 * Splits `total` shots over settings: one each first, the rest ∝ weights by largest
 * remainder (even split when all weights are 0). Needs total ≥ number of settings.
 */
export function allocateShots(total: number, weights: number[]): number[] {
  const g = weights.length;
  if (g === 0) return [];
  if (total < g) throw new RangeError(`need at least ${g} shots for ${g} settings`);
  const wsum = weights.reduce((a, b) => a + Math.max(0, b), 0);
  const w = wsum > 0 ? weights.map((x) => Math.max(0, x) / wsum) : weights.map(() => 1 / g);
  const rest = total - g;
  const exact = w.map((x) => x * rest);
  const out = exact.map((x) => 1 + Math.floor(x));
  let left = total - out.reduce((a, b) => a + b, 0);
  const order = exact
    .map((x, i) => i)
    .sort((a, b) => exact[b] - Math.floor(exact[b]) - (exact[a] - Math.floor(exact[a])) || a - b);
  for (let k = 0; left > 0; k = (k + 1) % g, left--) out[order[k]]++;
  return out;
}

/** A count as text: exact with thousands separators below 10^15, else "about 2.5×10^599". */
function countText(log10: number, exact: number): string {
  if (Number.isFinite(exact) && exact < 1e15) return formatCount(Math.ceil(exact));
  const exponent = Math.floor(log10);
  return `about ${(10 ** (log10 - exponent)).toFixed(1)}×10^${exponent}`;
}

/**
 * Shots the worst-case plan needs, as text, even when the count overflows a double
 * (ε = 1e-300): N = (Σ_g w_g)²/ε² taken in log space.
 */
export function shotsNeededText(stdDevs: number[], epsilon: number): string {
  const w = stdDevs.reduce((a, b) => a + b, 0);
  if (w === 0) return String(stdDevs.length);
  return countText(2 * Math.log10(w) - 2 * Math.log10(epsilon), (w / epsilon) * (w / epsilon));
}

/**
 * Shots a state-aware (posterior) plan needs, as text: the plan's own total when it is a
 * finite count, else in log space Σσ²-part + pseudo-shot part,
 * N ≈ (Σ_g σ_g)²/ε² + (Σ_g D_g^{1/3})^{3/2}/ε (each part the optimum of its own term of
 * Σ_g (σ_g²/N_g + D_g/N_g²) ≤ ε², posterior-allocation.ts).
 */
export function shotsNeededForLoads(
  loads: SettingLoad[],
  epsilon: number,
  planned: number,
): string {
  if (Number.isFinite(planned) && planned < 1e15) return countText(Math.log10(planned), planned);
  const s1 = loads.reduce((a, l) => a + Math.sqrt(l.variance), 0);
  const s2 = loads.reduce((a, l) => a + Math.cbrt(l.pseudo), 0);
  const log1 = s1 > 0 ? 2 * Math.log10(s1) - 2 * Math.log10(epsilon) : -Infinity;
  const log2 = s2 > 0 ? 1.5 * Math.log10(s2) - Math.log10(epsilon) : -Infinity;
  const hi = Math.max(log1, log2);
  const log10 = hi + Math.log10(1 + 10 ** (Math.min(log1, log2) - hi));
  return countText(log10, 10 ** log10);
}

/**
 * The refusal of a target precision no plan can reach within MAX_SHOTS (422 at
 * submission): names the shots it would need (`needed`, from the functions above) and
 * what the plan was made from.
 */
export function unreachablePrecision(
  epsilon: number,
  needed: string,
  basis: "state" | "worst_case" = "state",
): EngineError {
  const how =
    basis === "state"
      ? "from the state's exact variances"
      : "from worst-case variance bounds (the state was too large to simulate for the plan)";
  const message =
    `a standard error of ${epsilon} needs ${needed} shots (${how}), ` +
    `more than the limit of ${formatCount(MAX_SHOTS)} per run; loosen targetPrecision or give shots`;
  return new EngineError("infeasible", message, [{ path: ["targetPrecision"], message }]);
}

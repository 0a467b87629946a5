/**
 * The shot plan of a preview for `targetPrecision`, state-aware when the state is cheap
 * enough to simulate.
 *
 * Work is counted in amplitude updates, not in time, so the choice is deterministic
 * (the same request always gets the same plan on any machine): per point, simulating
 * costs ≈ gates·2ⁿ (statevector) or 2·gates·4ⁿ (density matrix: UρU† touches every entry
 * twice), the settings' outcome laws ≈ settings·(n+1)·2ⁿ (a rotated copy per setting) or
 * settings·4ⁿ, and a matrix observable's eigendecomposition d³ once. Within
 * `workBudget`, every point is simulated and planned exactly as the run will plan it
 * (same laws, readout and mitigation, same rounding: `buildSpecs`, `settingLoad` and
 * `targetPlan` of sampling/sample-observable.ts), so the planned shots are the shots the run draws.
 * Beyond the budget the plan is the worst-case bound (valid for any state).
 */
import { simulateDensityMatrix } from "../density-matrix/simulate";
import { hermitianEigen } from "../observable/hermitian-eigen";
import {
  planShots,
  shotsNeededText,
  unreachablePrecision,
  type ShotPlan,
} from "../planning/shot-plan";
import {
  buildSpecs,
  settingLoad,
  targetPlan,
  type PreparedObservable,
  type PreparedState,
} from "../sampling/sample-observable";
import { simulateStatevector } from "../statevector/simulate";
import type { Circuit } from "../types";
import { MAX_SHOTS } from "./limits";
import type { ObservableShape } from "./prepare-observable";
import type { NormalisedRequest } from "./validate-request";

/** Default work budget of a preview's state-aware plan: 2^25 amplitude updates (≈ 0.5 s on a 2-vCPU VM; measured 1.6 s for 10^8). */
export const DEFAULT_PREVIEW_WORK_BUDGET = 2 ** 25;
/** Previews run on the web process's preview threads: never with engine threads of their own. */
const ONE_THREAD = { threads: 1 };

export interface PreviewOptions {
  /** Amplitude updates the preview may spend simulating states for the plan (0: never simulate). */
  workBudget?: number;
}

export interface PreviewPlan {
  source: "state_aware" | "worst_case";
  /** The first point's plan (worst case, and state-aware when computed). */
  plan: ShotPlan;
  /** Planned shots of every point. */
  pointShots: number[];
  /** Estimated work of the state-aware plan, and the budget it was measured against. */
  work: { estimated: number; budget: number };
}

export function stateWork(
  n: number,
  method: NormalisedRequest["method"],
  gates: number,
  settings: number,
  points: number,
  matrix: boolean,
): number {
  const dim = 2 ** n;
  const perPoint =
    method === "statevector"
      ? Math.max(1, gates) * dim + settings * (n + 1) * dim
      : 2 * Math.max(1, gates) * dim * dim + settings * dim * dim;
  return points * perPoint + (matrix ? dim ** 3 : 0);
}

export function planPreviewShots(
  req: NormalisedRequest & { targetPrecision: number },
  circuits: (k: number) => Circuit,
  points: number,
  obs: ObservableShape,
  bounds: number[],
  gates: number,
  options: PreviewOptions,
): PreviewPlan {
  const n = obs.kind === "pauli" ? obs.sum.numQubits : obs.matrix.n;
  const settings = bounds.length;
  const budget = options.workBudget ?? DEFAULT_PREVIEW_WORK_BUDGET;
  const estimated = stateWork(n, req.method, gates, settings, points, obs.kind === "matrix");
  const eps = req.targetPrecision;
  const work = { estimated, budget };
  if (estimated > budget) {
    const plan = planShots({ targetPrecision: eps, stdDevBounds: bounds, stdDevs: null });
    if (!(plan.worstCase.totalShots <= MAX_SHOTS))
      throw unreachablePrecision(eps, shotsNeededText(bounds, eps), "worst_case");
    return {
      source: "worst_case",
      plan,
      pointShots: new Array<number>(points).fill(plan.worstCase.totalShots),
      work,
    };
  }
  const prepared: PreparedObservable =
    obs.kind === "matrix" ? { ...obs, eigen: hermitianEigen(obs.matrix) } : obs;
  const pointShots: number[] = [];
  let first: ShotPlan | null = null;
  for (let k = 0; k < points; k++) {
    const circuit = circuits(k);
    const state: PreparedState =
      req.method === "statevector"
        ? { kind: "statevector", state: simulateStatevector(circuit, ONE_THREAD) }
        : { kind: "density_matrix", rho: simulateDensityMatrix(circuit, req.noise, ONE_THREAD) };
    const specs = buildSpecs(state, prepared, { readout: req.readout, mitigate: req.mitigate });
    const plan = targetPlan(
      eps,
      specs,
      specs.map((spec) => settingLoad(spec, spec.law(), prepared)),
    );
    first ??= plan;
    pointShots.push(plan.stateAware!.totalShots);
  }
  return { source: "state_aware", plan: first!, pointShots, work };
}

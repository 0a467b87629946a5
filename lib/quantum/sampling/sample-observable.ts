/**
 * Sampled estimate of ⟨A⟩ with shots (`sampled` in the result: mean, stdErr, ci95).
 *
 * Per measurement setting (a qubit-wise commuting Pauli group, or the eigenbasis of a
 * matrix observable): the outcome law is computed on a rotated COPY of the statevector
 * (or as the diagonal of UρU†, density-diagonal.ts) with readout error folded in (readout.ts); shots are split over settings to minimise the reported (posterior) variance (posterior-allocation.ts; ≈ ∝ √Var_g, exact
 * single-shot variances, "optimal") or evenly, or chosen by a target standard error
 * (shot-plan.ts); each setting draws from its own jumped PRNG stream (rng.ts); the
 * statistics (statistics.ts, interval.ts) give the estimate, posterior standard error, 95 % interval, per-term
 * means and intervals, a convergence series and, when asked, the readout-mitigated values.
 */
import { EngineError } from "../errors";
import { MAX_SHOTS } from "../estimate/limits";
import { indexToBitstring } from "../observable/bits";
import type { MeasurementSetting } from "../observable/grouping";
import type { HermitianEigen } from "../observable/hermitian-eigen";
import type { HermitianMatrix } from "../observable/matrix-observable";
import { momentsFromLaw, pauliSettingMoments } from "../planning/exact-variance";
import {
  posteriorPlan,
  posteriorWeights,
  type SettingLoad,
} from "../planning/posterior-allocation";
import {
  allocateShots,
  planShots,
  shotsNeededForLoads,
  unreachablePrecision,
  type ShotPlan,
} from "../planning/shot-plan";
import type { DensityMatrix, PauliSum, StateVector } from "../types";
import { rotateStateCopy, stateProbabilities } from "./basis-rotation";
import { rotatedDensityDiagonal } from "./density-diagonal";
import { drawSetting, type SettingSample } from "./draw-setting";
import { eigenbasisLawOfDensity, eigenbasisLawOfState } from "./eigenbasis";
import { convolveReadout, mitigationFactors, type Readout } from "./readout";
import { StreamFactory } from "./rng";
import { eigenbasisSettingModel, pauliSettingModel, type SettingModel } from "./setting-model";
import { estimateLinearCombination } from "./interval";
import {
  combineSettings,
  convergenceSeries,
  planCheckpoints,
  type ConvergencePoint,
  type Estimate,
  type SettingRanges,
} from "./statistics";
import { plural } from "../../format/plural";

export type PreparedState =
  { kind: "statevector"; state: StateVector } | { kind: "density_matrix"; rho: DensityMatrix };

export type PreparedObservable =
  | { kind: "pauli"; sum: PauliSum; settings: MeasurementSetting[] }
  | { kind: "matrix"; matrix: HermitianMatrix; eigen: HermitianEigen };

/** Histograms with more distinct outcomes than this are not returned (only their size). */
export const MAX_COUNT_KEYS = 4096;
const LAW_CACHE_BYTES = 256 * 1024 * 1024;

export interface SamplingOptions {
  /** Total shots, or null when `targetPrecision` decides. */
  shots: number | null;
  targetPrecision: number | null;
  split: "optimal" | "even";
  readout: Readout;
  mitigate: boolean;
  seed: number;
  tick?: (fraction: number) => void | Promise<void>;
}

export interface TermSample {
  sampledMean: number;
  stdErr: number;
  ci95: [number, number];
  mitigatedMean?: number;
  mitigatedStdErr?: number;
  mitigatedCi95?: [number, number];
}

export interface GroupSample {
  bases: string;
  terms: number[];
  shots: number;
  counts?: Record<string, number>;
  distinctOutcomes: number;
  /** Exact single-shot variance of the setting (readout included), when computed. */
  variance?: number;
  /** Matrix observables: the eigenvalue of each outcome index (ascending). */
  eigenvalues?: number[];
}

export interface SamplingOutcome {
  sampled: Estimate & { shots: number; settings: number; convergence: ConvergencePoint[] };
  mitigated: Estimate | null;
  /** Aligned with the Pauli sum's terms (empty for a matrix observable). */
  terms: TermSample[];
  groups: GroupSample[];
  /** The plan used when `targetPrecision` chose the shots. */
  plan: ShotPlan | null;
}

export interface Spec {
  bases: string;
  termIndices: number[];
  model: SettingModel;
  stdDevBound: number;
  law: () => Float64Array;
}

function lawOf(prepared: PreparedState, bases: string, readout: Readout): Float64Array {
  const p =
    prepared.kind === "statevector"
      ? stateProbabilities(rotateStateCopy(prepared.state, bases))
      : rotatedDensityDiagonal(prepared.rho, bases);
  convolveReadout(p, readout);
  return p;
}

/** One spec per measurement setting: its outcome law (lazy), value model and worst-case bound. */
export function buildSpecs(
  prepared: PreparedState,
  obs: PreparedObservable,
  opts: Pick<SamplingOptions, "readout" | "mitigate">,
): Spec[] {
  const mitigation = opts.mitigate ? mitigationFactors(opts.readout) : null;
  if (obs.kind === "matrix") {
    const model = eigenbasisSettingModel(obs.eigen.values, mitigation);
    const bound = gershgorinBound(obs.matrix);
    const law = (): Float64Array => {
      const p =
        prepared.kind === "statevector"
          ? eigenbasisLawOfState(prepared.state, obs.eigen)
          : eigenbasisLawOfDensity(prepared.rho, obs.eigen);
      const n = Math.round(Math.log2(p.length));
      convolveReadout(p, opts.readout, (b) => n - 1 - b);
      return p;
    };
    return [{ bases: "eigenbasis", termIndices: [], model, stdDevBound: bound, law }];
  }
  return obs.settings.map((s) => ({
    bases: s.bases,
    termIndices: s.terms,
    model: pauliSettingModel(obs.sum, s.terms, mitigation),
    stdDevBound: s.terms.reduce((a, i) => a + Math.abs(obs.sum.terms[i].coefficient), 0),
    law: () => lawOf(prepared, s.bases, opts.readout),
  }));
}

/** Exact single-shot variance and pseudo-shot load of a setting from its outcome law (readout included). */
export function settingLoad(spec: Spec, p: Float64Array, obs: PreparedObservable): SettingLoad {
  const m =
    obs.kind === "pauli"
      ? pauliSettingMoments(p, obs.sum, spec.termIndices, spec.model)
      : momentsFromLaw(p, (b) => spec.model.value(b));
  const [lo, hi] = spec.model.range;
  return { variance: m.variance, pseudo: (lo - m.mean) ** 2 + (hi - m.mean) ** 2 };
}

/**
 * The plan for a target standard error: worst case from the bounds, state-aware for the
 * reported (posterior) standard error from the loads; refused ("infeasible") beyond
 * MAX_SHOTS. The preview (estimate/preview-plan.ts) plans with this same function.
 */
export function targetPlan(epsilon: number, specs: Spec[], loads: SettingLoad[]): ShotPlan {
  const plan = {
    ...planShots({ targetPrecision: epsilon, stdDevBounds: specs.map((s) => s.stdDevBound) }),
    stateAware: posteriorPlan(epsilon, loads),
  };
  const total = plan.stateAware.totalShots;
  if (!(total <= MAX_SHOTS))
    throw unreachablePrecision(epsilon, shotsNeededForLoads(loads, epsilon, total), "state");
  return plan;
}

/** ‖H‖ ≤ max_i Σ_j |H_ij| (Gershgorin), a bound on the single-shot standard deviation. */
export function gershgorinBound(h: HermitianMatrix): number {
  let best = 0;
  for (let i = 0; i < h.dim; i++) {
    let s = 0;
    for (let j = 0; j < h.dim; j++) s += Math.hypot(h.re[i * h.dim + j], h.im[i * h.dim + j]);
    best = Math.max(best, s);
  }
  return best;
}

function shotsError(message: string, field: "shots" | "targetPrecision"): never {
  throw new EngineError(field === "shots" ? "invalid_request" : "too_large", message, [
    { path: [field], message },
  ]);
}

export async function sampleObservable(
  prepared: PreparedState,
  obs: PreparedObservable,
  opts: SamplingOptions,
): Promise<SamplingOutcome> {
  const specs = buildSpecs(prepared, obs, opts);
  const g = specs.length;
  const offset =
    obs.kind === "pauli"
      ? obs.sum.terms.reduce((a, t) => a + (t.xMask === 0 && t.zMask === 0 ? t.coefficient : 0), 0)
      : 0;
  const dim = obs.kind === "pauli" ? 2 ** obs.sum.numQubits : obs.eigen.dim;
  const cache = dim * 8 * g <= LAW_CACHE_BYTES ? new Map<number, Float64Array>() : null;
  const needVariance = opts.targetPrecision !== null || opts.split === "optimal";
  const variances: number[] | null = needVariance ? [] : null;
  const loads: SettingLoad[] = [];
  const step = async (f: number): Promise<void> => {
    await opts.tick?.(f);
  };
  if (variances) {
    for (let k = 0; k < g; k++) {
      const spec = specs[k];
      const p = spec.law();
      cache?.set(k, p);
      const load = settingLoad(spec, p, obs);
      variances.push(load.variance);
      loads.push(load);
      await step((0.2 * (k + 1)) / g);
    }
  }
  let plan: ShotPlan | null = null;
  let perSetting: number[];
  if (opts.targetPrecision !== null) {
    // worst case as before; state-aware for the reported (posterior) standard error
    plan = targetPlan(opts.targetPrecision, specs, loads);
    perSetting = plan.stateAware!.perSetting;
  } else {
    const total = opts.shots ?? 0;
    if (total < g)
      shotsError(
        `at least one shot per measurement setting is needed: ${plural(g, "setting needs", "settings need")} shots ≥ ${g}`,
        "shots",
      );
    perSetting = allocateShots(
      total,
      variances && opts.split === "optimal" ? posteriorWeights(total, loads) : specs.map(() => 1),
    );
  }
  const totalShots = perSetting.reduce((a, b) => a + b, 0);
  const prefixes = planCheckpoints(perSetting);
  const streams = new StreamFactory(opts.seed);
  const samples: SettingSample[] = [];
  let done = 0;
  for (let k = 0; k < g; k++) {
    const spec = specs[k];
    const p = cache?.get(k) ?? spec.law();
    cache?.delete(k);
    const before = done;
    samples.push(
      await drawSetting({
        distribution: p,
        shots: perSetting[k],
        rng: streams.next(),
        model: spec.model,
        checkpoints: prefixes[k],
        tick: (f) => step(0.2 + (0.8 * (before + f * perSetting[k])) / Math.max(1, totalShots)),
      }),
    );
    done += perSetting[k];
  }
  const ranges: SettingRanges[] = specs.map((s) => ({
    raw: s.model.range,
    mitigated: s.model.mitigatedRange,
  }));
  const physical = physicalRange(obs, offset);
  const raw = combineSettings(offset, samples, ranges, false, physical);
  const mitigated = opts.mitigate ? combineSettings(offset, samples, ranges, true, physical) : null;
  return {
    sampled: {
      ...raw,
      shots: totalShots,
      settings: g,
      convergence: convergenceSeries(offset, samples, ranges, physical),
    },
    mitigated,
    terms: obs.kind === "pauli" ? termSamples(obs.sum, specs, samples, opts.mitigate) : [],
    groups: specs.map((spec, k) => groupSample(spec, samples[k], dim, variances?.[k], obs)),
    plan,
  };
}

/** Values the exact ⟨A⟩ can take: c_I ± Σ|c_i| for a Pauli sum, [λ_min, λ_max] for a matrix. */
function physicalRange(obs: PreparedObservable, offset: number): [number, number] {
  if (obs.kind === "matrix") {
    const v = obs.eigen.values;
    return [v[0], v[v.length - 1]];
  }
  const spread = obs.sum.terms.reduce(
    (a, t) => a + (t.xMask === 0 && t.zMask === 0 ? 0 : Math.abs(t.coefficient)),
    0,
  );
  return [offset - spread, offset + spread];
}

const PAULI_RANGE: [number, number] = [-1, 1];

function termSamples(
  sum: PauliSum,
  specs: Spec[],
  samples: SettingSample[],
  mitigate: boolean,
): TermSample[] {
  const exactOne: [number, number] = [1, 1];
  const identity: TermSample = {
    sampledMean: 1,
    stdErr: 0,
    ci95: exactOne,
    ...(mitigate ? { mitigatedMean: 1, mitigatedStdErr: 0, mitigatedCi95: exactOne } : {}),
  };
  const out: TermSample[] = sum.terms.map(() => identity);
  specs.forEach((spec, k) => {
    const s = samples[k];
    spec.termIndices.forEach((i, j) => {
      // ±1 outcomes (Σv² = N): the term's own Dirichlet posterior (interval.ts)
      const e = estimateLinearCombination(
        [{ shots: s.shots, sum: s.termSums[j], sumSq: s.shots, lo: -1, hi: 1 }],
        { range: PAULI_RANGE },
      );
      const entry: TermSample = { sampledMean: e.mean, stdErr: e.stdErr, ci95: e.ci95 };
      if (mitigate && s.termMitSums && s.termMitSumSq) {
        const [lo, hi] = spec.model.termMitigatedRange[j];
        const m = estimateLinearCombination(
          [{ shots: s.shots, sum: s.termMitSums[j], sumSq: s.termMitSumSq[j], lo, hi }],
          { range: PAULI_RANGE },
        );
        entry.mitigatedMean = m.mean;
        entry.mitigatedStdErr = m.stdErr;
        entry.mitigatedCi95 = m.ci95;
      }
      out[i] = entry;
    });
  });
  return out;
}

function groupSample(
  spec: Spec,
  s: SettingSample,
  dim: number,
  variance: number | undefined,
  obs: PreparedObservable,
): GroupSample {
  const n = Math.round(Math.log2(dim));
  const group: GroupSample = {
    bases: spec.bases,
    terms: spec.termIndices,
    shots: s.shots,
    distinctOutcomes: s.outcomes.length,
  };
  if (s.outcomes.length <= MAX_COUNT_KEYS) {
    const counts: Record<string, number> = {};
    // Pauli settings: the measured bitstring, qubit 0 first. Eigenbasis: outcome k (the k-th
    // eigenvalue, ascending) written as n binary digits, most significant first — the same
    // reading as the matrix's row index (qubit 0 the leftmost digit).
    const key =
      obs.kind === "matrix"
        ? (k: number) => k.toString(2).padStart(n, "0")
        : (k: number) => indexToBitstring(k, n);
    for (let j = 0; j < s.outcomes.length; j++) counts[key(s.outcomes[j])] = s.counts[j];
    group.counts = counts;
  }
  if (variance !== undefined) group.variance = variance;
  if (obs.kind === "matrix") group.eigenvalues = Array.from(obs.eigen.values);
  return group;
}

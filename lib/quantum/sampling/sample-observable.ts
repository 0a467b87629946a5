/**
 * Sampled estimate of ⟨A⟩ with shots (`sampled` in the result: mean, stdErr, ci95).
 *
 * Per measurement setting (a qubit-wise commuting Pauli group, or the eigenbasis of a
 * matrix observable): the outcome law is computed on a rotated COPY of the statevector
 * (or as the diagonal of UρU†, density-diagonal.ts) with readout error folded in (readout.ts); shots are split over settings ∝ √Var_g (exact
 * single-shot variances, "optimal") or evenly, or chosen by a target standard error
 * (shot-plan.ts); each setting draws from its own jumped PRNG stream (rng.ts); the
 * statistics (statistics.ts) give the estimate, standard error, 95 % interval, per-term
 * means, a convergence series and, when asked, the readout-mitigated values.
 */
import { EngineError } from "../errors";
import { MAX_SHOTS } from "../estimate/limits";
import { indexToBitstring } from "../observable/bits";
import type { MeasurementSetting } from "../observable/grouping";
import type { HermitianEigen } from "../observable/hermitian-eigen";
import type { HermitianMatrix } from "../observable/matrix-observable";
import { pauliSettingVariance, varianceFromLaw } from "../planning/exact-variance";
import { allocateShots, planShots, type ShotPlan } from "../planning/shot-plan";
import type { DensityMatrix, PauliSum, StateVector } from "../types";
import { rotateStateCopy, stateProbabilities } from "./basis-rotation";
import { rotatedDensityDiagonal } from "./density-diagonal";
import { drawSetting, type SettingSample } from "./draw-setting";
import { eigenbasisLawOfDensity, eigenbasisLawOfState } from "./eigenbasis";
import { convolveReadout, mitigationFactors, type Readout } from "./readout";
import { StreamFactory } from "./rng";
import { eigenbasisSettingModel, pauliSettingModel, type SettingModel } from "./setting-model";
import { combineSettings, convergenceSeries, meanVariance, planCheckpoints, withInterval, type ConvergencePoint, type Estimate } from "./statistics";

export type PreparedState = { kind: "statevector"; state: StateVector } | { kind: "density_matrix"; rho: DensityMatrix };

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
  mitigatedMean?: number;
  mitigatedStdErr?: number;
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

interface Spec {
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

function buildSpecs(prepared: PreparedState, obs: PreparedObservable, opts: SamplingOptions): Spec[] {
  const mitigation = opts.mitigate ? mitigationFactors(opts.readout) : null;
  if (obs.kind === "matrix") {
    const model = eigenbasisSettingModel(obs.eigen.values, mitigation);
    const bound = gershgorinBound(obs.matrix);
    const law = (): Float64Array => {
      const p = prepared.kind === "statevector" ? eigenbasisLawOfState(prepared.state, obs.eigen) : eigenbasisLawOfDensity(prepared.rho, obs.eigen);
      convolveReadout(p, opts.readout);
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
  throw new EngineError(field === "shots" ? "invalid_request" : "too_large", message, [{ path: [field], message }]);
}

export async function sampleObservable(prepared: PreparedState, obs: PreparedObservable, opts: SamplingOptions): Promise<SamplingOutcome> {
  const specs = buildSpecs(prepared, obs, opts);
  const g = specs.length;
  const offset = obs.kind === "pauli" ? obs.sum.terms.reduce((a, t) => a + (t.xMask === 0 && t.zMask === 0 ? t.coefficient : 0), 0) : 0;
  const dim = obs.kind === "pauli" ? 2 ** obs.sum.numQubits : obs.eigen.dim;
  const cache = dim * 8 * g <= LAW_CACHE_BYTES ? new Map<number, Float64Array>() : null;
  const needVariance = opts.targetPrecision !== null || opts.split === "optimal";
  const variances: number[] | null = needVariance ? [] : null;
  const step = async (f: number): Promise<void> => {
    await opts.tick?.(f);
  };
  if (variances) {
    for (let k = 0; k < g; k++) {
      const spec = specs[k];
      const p = spec.law();
      cache?.set(k, p);
      variances.push(
        obs.kind === "pauli" ? pauliSettingVariance(p, obs.sum, spec.termIndices, spec.model) : varianceFromLaw(p, (b) => spec.model.value(b)),
      );
      await step((0.2 * (k + 1)) / g);
    }
  }
  let plan: ShotPlan | null = null;
  let perSetting: number[];
  if (opts.targetPrecision !== null) {
    plan = planShots({ targetPrecision: opts.targetPrecision, stdDevBounds: specs.map((s) => s.stdDevBound), stdDevs: variances!.map(Math.sqrt) });
    perSetting = plan.stateAware!.perSetting;
    const total = plan.stateAware!.totalShots;
    if (total > MAX_SHOTS) {
      shotsError(`reaching a standard error of ${opts.targetPrecision} needs ${total} shots, more than the limit of ${MAX_SHOTS}; loosen targetPrecision`, "targetPrecision");
    }
  } else {
    const total = opts.shots ?? 0;
    if (total < g) shotsError(`at least one shot per measurement setting is needed: ${g} settings need shots ≥ ${g}`, "shots");
    perSetting = allocateShots(total, variances && opts.split === "optimal" ? variances.map(Math.sqrt) : specs.map(() => 1));
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
  const raw = combineSettings(offset, samples, false);
  const mitigated = opts.mitigate ? combineSettings(offset, samples, true) : null;
  return {
    sampled: { ...raw, shots: totalShots, settings: g, convergence: convergenceSeries(offset, samples) },
    mitigated,
    terms: obs.kind === "pauli" ? termSamples(obs.sum, specs, samples, opts.mitigate) : [],
    groups: specs.map((spec, k) => groupSample(spec, samples[k], dim, variances?.[k], obs)),
    plan,
  };
}

function termSamples(sum: PauliSum, specs: Spec[], samples: SettingSample[], mitigate: boolean): TermSample[] {
  const out: TermSample[] = sum.terms.map((t) =>
    t.xMask === 0 && t.zMask === 0 ? { sampledMean: 1, stdErr: 0, ...(mitigate ? { mitigatedMean: 1, mitigatedStdErr: 0 } : {}) } : { sampledMean: 0, stdErr: 0 },
  );
  specs.forEach((spec, k) => {
    const s = samples[k];
    spec.termIndices.forEach((i, j) => {
      const m = s.termSums[j] / s.shots;
      // ±1 outcomes: plug-in standard error √((1 − m²)/N)
      const entry: TermSample = { sampledMean: m, stdErr: Math.sqrt(Math.max(0, 1 - m * m) / s.shots) };
      if (mitigate && s.termMitSums && s.termMitSumSq) {
        const mv = meanVariance(s.termMitSums[j], s.termMitSumSq[j], s.shots);
        const e = withInterval(mv.mean, Math.sqrt(mv.variance / s.shots));
        entry.mitigatedMean = e.mean;
        entry.mitigatedStdErr = e.stdErr;
      }
      out[i] = entry;
    });
  });
  return out;
}

function groupSample(spec: Spec, s: SettingSample, dim: number, variance: number | undefined, obs: PreparedObservable): GroupSample {
  const n = Math.round(Math.log2(dim));
  const group: GroupSample = { bases: spec.bases, terms: spec.termIndices, shots: s.shots, distinctOutcomes: s.outcomes.length };
  if (s.outcomes.length <= MAX_COUNT_KEYS) {
    const counts: Record<string, number> = {};
    for (let j = 0; j < s.outcomes.length; j++) counts[indexToBitstring(s.outcomes[j], n)] = s.counts[j];
    group.counts = counts;
  }
  if (variance !== undefined) group.variance = variance;
  if (obs.kind === "matrix") group.eigenvalues = Array.from(obs.eigen.values);
  return group;
}

/**
 * `estimate(request, { onProgress, signal })` — the engine contract (request = the body of
 * POST /api/v1/runs without `name`; result as in `estimateResultSchema`).
 *
 * Order: validate (zod) → parse the circuit and the observable (sizes checked before any
 * state is allocated) → for each parameter point (one, or the sweep grid): bind, simulate,
 * exact values, sampling. The spectrum (Lanczos for Pauli sums with n ≤ 16 whose matrix-vector
 * product stays within SPECTRUM_STEP_BUDGET, eigenvalues of a matrix observable) comes
 * before the points: its ground-space basis gives each point's ground weight ⟨ψ|P₀|ψ⟩.
 * With a sweep the top level describes the point of lowest exact value and `sweep.points`
 * lists every point. The seed is the request's or a fresh one, returned.
 */
import { parseProgram } from "../circuit";
import { validateNoiseModel } from "../noise/validate";
import { EngineError } from "../errors";
import { SPECTRUM_STEP_BUDGET, lanczosExtremes, lanczosStepCost } from "../observable/lanczos";
import { levelsOfEigen, lowestLevels, type LowestLevels } from "../observable/lowest-levels";
import { pauliDecomposition } from "../observable/pauli-decomposition";
import { sparseLabel } from "../observable/pauli-word";
import { chooseSeed } from "../sampling/rng";
import type { PreparedObservable } from "../sampling/sample-observable";
import type { EstimateResult } from "../schemas";
import type { ProgressFn } from "../types";
import { evaluatePoint, type PointResult } from "./evaluate-point";
import { MAX_DENSITY_MATRIX_QUBITS, MAX_SPECTRUM_QUBITS, MAX_STATEVECTOR_QUBITS } from "./limits";
import { prepareObservable } from "./prepare-observable";
import { Progress } from "./progress";
import { assertDifferentiable } from "../gradient";
import { parameterPoints, pointSeed, type SweepGrid } from "./sweep-grid";
import { validateRequest, type NormalisedRequest } from "./validate-request";

export interface EstimateOptions {
  onProgress?: ProgressFn;
  signal?: AbortSignal;
}

/** Rejects circuits beyond the method's qubit ceiling before anything is allocated. */
export function checkQubitLimit(n: number, method: NormalisedRequest["method"]): void {
  const max = method === "statevector" ? MAX_STATEVECTOR_QUBITS : MAX_DENSITY_MATRIX_QUBITS;
  if (n > max) {
    const kind = method === "statevector" ? "statevector" : "density-matrix";
    const message = `the circuit has ${n} qubits; the ${kind} method handles at most ${max}`;
    throw new EngineError("too_large", message, [{ path: ["circuit", "source"], message }]);
  }
  if (n < 1) {
    const message = "the circuit declares no qubits";
    throw new EngineError("invalid_request", message, [{ path: ["circuit", "source"], message }]);
  }
}

export async function estimate(
  request: unknown,
  options: EstimateOptions = {},
): Promise<EstimateResult> {
  const root = Progress.root(options.onProgress, options.signal);
  root.span(0, 0.02, "parse").report(0, true);
  const t0 = performance.now();
  const req = validateRequest(request);
  const program = parseProgram(req.raw.circuit.format, req.raw.circuit.source);
  const n = program.numQubits;
  validateNoiseModel(req.noise, n); // per-qubit readout keys must name qubits of this circuit
  checkQubitLimit(n, req.method);
  const grid = parameterPoints(req.parameters, req.sweep, req.points, program.inputs);
  if (req.gradient) assertDifferentiable(program);
  const circuits = grid.points.length === 1 ? [program.bind(grid.points[0])] : null;
  const obs = prepareObservable(req.raw.observable, n);
  const seed = req.raw.seed ?? chooseSeed();
  const parseMs = performance.now() - t0;

  const wantSpectrum =
    obs.kind === "matrix" ||
    (n <= MAX_SPECTRUM_QUBITS && lanczosStepCost(obs.sum) <= SPECTRUM_STEP_BUDGET);
  const spectrumShare = obs.kind === "pauli" && wantSpectrum ? 0.25 : 0;
  const t1 = performance.now();
  const spectrum = wantSpectrum
    ? await spectrumOf(obs, root.span(0.02, 0.02 + spectrumShare, "spectrum"))
    : undefined;
  const spectrumMs = performance.now() - t1;
  const work = root.span(0.02 + spectrumShare, 1);
  const results: PointResult[] = [];
  // With several points the top level describes the point of lowest exact value (ties: the
  // earliest), named in `sweep.topLevel`; only that point keeps its terms and histograms.
  let best: { index: number; full: PointResult } | null = null;
  for (let k = 0; k < grid.points.length; k++) {
    const circuit = circuits ? circuits[0] : program.bind(grid.points[k]);
    const span = work.span(k / grid.points.length, (k + 1) / grid.points.length, "simulate");
    const differentiate = req.gradient ? { program, params: grid.points[k] } : null;
    const ground = spectrum?.levels.ground ?? null;
    const r = await evaluatePoint(
      circuit,
      obs,
      req,
      pointSeed(seed, k),
      span,
      differentiate,
      ground,
    );
    if (best === null || r.exact < best.full.exact) best = { index: k, full: r };
    // Every point keeps only its summary (a 10,000-point grid must stay small).
    results.push({
      ...r,
      termValues: null,
      sampling: r.sampling && { ...r.sampling, terms: [], groups: [] },
    });
  }

  root.span(0, 1, "done").report(1, true);
  return assemble(req, obs, n, seed, grid, results, best!, spectrum, {
    parseMs,
    simulateMs: results.reduce((a, r) => a + r.simulateMs, 0),
    sampleMs: results.reduce((a, r) => a + r.sampleMs, 0),
    spectrumMs,
  });
}

interface SpectrumParts {
  min: number;
  max: number;
  levels: LowestLevels;
}

async function spectrumOf(obs: PreparedObservable, progress: Progress): Promise<SpectrumParts> {
  if (obs.kind === "matrix") {
    const v = obs.eigen.values;
    return { min: v[0], max: v[v.length - 1], levels: levelsOfEigen(obs.eigen) };
  }
  progress.report(0);
  const extremes = progress.span(0, 0.3);
  const r = await lanczosExtremes(obs.sum, { tick: (f) => extremes.tick(f) });
  const lower = progress.span(0.3, 1);
  const levels = await lowestLevels(obs.sum, { tick: (f) => lower.tick(f) });
  return { min: r.min, max: r.max, levels };
}

/** The stored spectrum: extremes, the lowest levels and the top-level point's ground weight. */
function spectrumResult(
  parts: SpectrumParts,
  weight: number | null,
): NonNullable<EstimateResult["spectrum"]> {
  const { lowest, ground } = parts.levels;
  return {
    min: parts.min,
    max: parts.max,
    lowest,
    ...(ground ? { groundDegeneracy: ground.length } : {}),
    ...(ground && weight !== null ? { groundWeight: Math.min(1, Math.max(0, weight)) } : {}),
  };
}

function assemble(
  req: NormalisedRequest,
  obs: PreparedObservable,
  n: number,
  seed: number,
  grid: SweepGrid,
  results: PointResult[],
  best: { index: number; full: PointResult },
  spectrum: SpectrumParts | undefined,
  timings: EstimateResult["timings"],
): EstimateResult {
  const main = best.full;
  const s = main.sampling;
  const groupOf = new Map<number, number>();
  if (obs.kind === "pauli")
    obs.settings.forEach((g, k) => g.terms.forEach((i) => groupOf.set(i, k)));
  const terms: EstimateResult["terms"] =
    obs.kind === "pauli"
      ? obs.sum.terms.map((t, i) => ({
          pauli: t.word,
          label: sparseLabel(t.xMask, t.zMask),
          coefficient: t.coefficient,
          exact: main.termValues![i],
          ...(s ? s.terms[i] : {}),
          group: groupOf.get(i) ?? null,
        }))
      : [];
  const groups: EstimateResult["groups"] = s
    ? s.groups
    : obs.kind === "pauli"
      ? obs.settings.map((g) => ({ bases: g.bases, terms: g.terms, shots: 0 }))
      : [{ bases: "eigenbasis", terms: [], shots: 0, eigenvalues: Array.from(obs.eigen.values) }];
  const result: EstimateResult = {
    qubits: n,
    method: req.method,
    seed,
    ideal: { value: main.ideal },
    exact: { value: main.exact },
    sampled: s ? s.sampled : null,
    terms,
    groups,
    timings,
  };
  if (s?.mitigated) result.mitigated = s.mitigated;
  if (spectrum) result.spectrum = spectrumResult(spectrum, main.groundWeight);
  if (s?.plan) result.shotPlan = s.plan;
  const decomposition = obs.kind === "matrix" ? pauliDecomposition(obs.matrix) : null;
  if (decomposition) result.pauliDecomposition = decomposition;
  if (main.gradient) {
    result.gradient = main.gradient;
    result.gradientShots = main.gradientShots;
  }
  if (grid.kind !== "single") {
    result.sweep = {
      kind: grid.kind,
      topLevel: { index: best.index, rule: "lowest_exact" },
      parameters: grid.names,
      points: results.map((r, k) => ({
        params: grid.points[k],
        ideal: r.ideal,
        exact: r.exact,
        sampled: r.sampling
          ? {
              mean: r.sampling.sampled.mean,
              stdErr: r.sampling.sampled.stdErr,
              ci95: r.sampling.sampled.ci95,
              shots: r.sampling.sampled.shots,
            }
          : null,
        ...(r.gradient ? { gradient: r.gradient, gradientShots: r.gradientShots } : {}),
      })),
    };
  }
  return result;
}

/**
 * `previewRequest(request, { workBudget })` — the synchronous preview computed at
 * submission (POST /api/v1/runs, POST /api/v1/runs/preview): validation, qubit count, gate
 * counts and depth, the measurement settings and the shot plan. For `targetPrecision`
 * the plan is state-aware when simulating every point fits `workBudget` amplitude
 * updates (preview-plan.ts: then the planned shots are exactly what the run draws), and
 * otherwise the worst-case bound — Σ_{i∈g}|c_i| per Pauli setting, the Gershgorin
 * row-sum bound for a matrix; `varianceSource` says which. A precision no plan reaches
 * within MAX_SHOTS is refused ("infeasible"). The same errors as `estimate` are thrown
 * for the same bad input. Callers run it off the request thread (it may simulate).
 */
import { circuitStats, parseProgram, type ParsedProgram } from "../circuit";
import { validateNoiseModel } from "../noise/validate";
import { pauliDecomposition } from "../observable/pauli-decomposition";
import { allocateShots } from "../planning/shot-plan";
import { gershgorinBound } from "../sampling/sample-observable";
import type { PreviewResult } from "../schemas";
import { assertNoMidCircuitMeasurement } from "../statevector/simulate";
import { EngineError } from "../errors";
import { checkQubitLimit } from "./estimate";
import { planPreviewShots, type PreviewOptions } from "./preview-plan";
import { parseObservableForCircuit } from "./prepare-observable";
import { assertDifferentiable, plannedShiftedCircuits } from "../gradient";
import { compiledOf } from "../circuit/program";
import { parameterPoints } from "./sweep-grid";
import { validateRequest } from "./validate-request";
import { formatCount, formatExponential } from "../../format/numbers";
import { plural } from "../../format/plural";

/** `program`: the request's circuit already parsed by the caller (it is then not parsed again). */
export function previewRequest(
  request: unknown,
  options: PreviewOptions & { program?: ParsedProgram } = {},
): PreviewResult {
  const req = validateRequest(request);
  const program = options.program ?? parseProgram(req.raw.circuit.format, req.raw.circuit.source);
  const n = program.numQubits;
  validateNoiseModel(req.noise, n); // per-qubit readout keys must name qubits of this circuit
  checkQubitLimit(n, req.method);
  const grid = parameterPoints(req.parameters, req.sweep, req.points, program.inputs);
  const circuit = program.bind(grid.points[0]);
  if (grid.kind === "points") bindEveryPoint(program, grid.points);
  if (req.gradient) assertDifferentiable(program);
  if (req.method === "statevector") assertNoMidCircuitMeasurement(circuit);
  const stats = circuitStats(circuit);
  const obs = parseObservableForCircuit(req.raw.observable, n);
  const groups =
    obs.kind === "pauli"
      ? obs.settings.map((g) => ({ bases: g.bases, terms: g.terms }))
      : [{ bases: "eigenbasis", terms: [] as number[] }];
  const bounds =
    obs.kind === "pauli"
      ? obs.settings.map((g) =>
          g.terms.reduce((a, i) => a + Math.abs(obs.sum.terms[i].coefficient), 0),
        )
      : [gershgorinBound(obs.matrix)];
  const notes: string[] = [];
  let shotPlan: PreviewResult["shotPlan"] = null;
  let shots = req.shots;
  let perSetting: number[] | null = null;
  let varianceSource: PreviewResult["varianceSource"] = "worst_case";
  let totalShots = shots * grid.points.length;
  let planWork: PreviewResult["planWork"] = null;
  if (req.targetPrecision !== null) {
    const circuits = (k: number) => (k === 0 ? circuit : program.bind(grid.points[k]));
    const planned = planPreviewShots(
      { ...req, targetPrecision: req.targetPrecision },
      circuits,
      grid.points.length,
      obs,
      bounds,
      stats.totalGates,
      options,
    );
    shotPlan = planned.plan;
    varianceSource = planned.source;
    planWork = planned.work;
    shots = Math.max(...planned.pointShots);
    totalShots = planned.pointShots.reduce((a, b) => a + b, 0);
    perSetting = (planned.plan.stateAware ?? planned.plan.worstCase).perSetting;
    notes.push(
      planned.source === "state_aware"
        ? "The shot plan uses the state's exact variances ((Σ_g √Var_g)²/ε², McClean et al. 2016): these are the shots the run will draw."
        : `The shot plan uses worst-case variance bounds ((Σ|c_i|)²/ε², McClean et al. 2016): simulating the state for an exact plan would take about ${formatExponential(planned.work.estimated, 1)} amplitude updates, over the preview's budget of ${formatExponential(planned.work.budget, 1)}. The run plans from the state's exact variances and usually draws fewer shots; quota is reserved for the bound and billed for the shots drawn.`,
    );
  } else if (shots > 0) {
    if (shots < groups.length) {
      const message = `at least one shot per measurement setting is needed: ${groups.length} settings need shots ≥ ${groups.length}`;
      throw new EngineError("invalid_request", message, [{ path: ["shots"], message }]);
    }
    perSetting = allocateShots(shots, req.split === "even" ? bounds.map(() => 1) : bounds);
    if (req.split === "optimal" && groups.length > 1) {
      notes.push(
        "The per-setting split shown uses worst-case bounds; the run splits ∝ √Var_g from the state's exact variances.",
      );
    }
  }
  if (obs.kind === "pauli" && obs.sum.terms.length === 1 && groups.length === 0)
    notes.push("The observable is a multiple of the identity: no measurement is needed.");
  let gradient: PreviewResult["gradient"] = null;
  if (req.gradient) {
    const sampled = shots > 0 || req.targetPrecision !== null;
    const shiftedCircuits = sampled ? plannedShiftedCircuits(program, grid.points[0]) : 0;
    gradient = {
      inputs: program.inputs.map((i) => i.name),
      shiftedCircuits,
      shotsPerPoint: shiftedCircuits * shots,
    };
    if (sampled && shiftedCircuits > 0) {
      notes.push(
        req.targetPrecision !== null
          ? `The sampled gradient runs ${plural(shiftedCircuits, "parameter-shifted circuit")} per point, each planning its own shots for the target from its own state (about ${formatCount(shots)} each are reserved); their shots are counted and billed.`
          : `The sampled gradient runs ${plural(shiftedCircuits, "parameter-shifted circuit")} per point with ${plural(shots, "shot")} each (parameter-shift rules); their shots are counted and billed.`,
      );
    }
  }
  const decomposition = obs.kind === "matrix" ? pauliDecomposition(obs.matrix) : null;
  return {
    qubits: n,
    method: req.method,
    gateCounts: stats.gateCounts,
    totalGates: stats.totalGates,
    twoQubitGates: stats.twoQubitGates,
    depth: stats.depth,
    observable: {
      format: obs.kind,
      terms: obs.kind === "pauli" ? obs.sum.terms.length : 0,
      settings: groups.length,
    },
    groups,
    stateBytes: req.method === "statevector" ? 16 * 2 ** n : 16 * 4 ** n,
    sweepPoints: grid.points.length,
    shots,
    gradient,
    totalShots: totalShots + (gradient?.shotsPerPoint ?? 0) * grid.points.length,
    shotPlan,
    shotsPerSetting: perSetting,
    ...(decomposition ? { pauliDecomposition: decomposition } : {}),
    varianceSource,
    planWork,
    notes,
  };
}

/** Binding work budget of the submission check (points × input-dependent gates). */
const BIND_CHECK_BUDGET = 20_000_000;

/**
 * Binds every listed point, so an angle that is not finite at some point (e.g. log of a
 * negative input) is refused at submission with that point's path, not mid-run.
 */
function bindEveryPoint(
  program: ReturnType<typeof parseProgram>,
  points: Record<string, number>[],
): void {
  const slots = Math.max(1, compiledOf(program).slots.length);
  if (slots * points.length > BIND_CHECK_BUDGET) return;
  points.forEach((p, k) => {
    try {
      program.bind(p);
    } catch (e) {
      if (!(e instanceof EngineError)) throw e;
      const message = `points[${k}]: ${e.message}`;
      throw new EngineError(e.code, message, [{ path: ["points", k], message }, ...e.issues]);
    }
  });
}

/**
 * One parameter point of a run: simulate the bound circuit, take the exact values and,
 * with shots, the sampled estimate.
 *
 * - statevector: |ψ⟩ by simulateStatevector; ideal = exact = ⟨ψ|A|ψ⟩.
 * - density_matrix: ρ by simulateDensityMatrix under the noise model; exact = Tr(ρA);
 *   ideal = exact without state noise, else a noiseless statevector run (or a noiseless
 *   density-matrix run when the circuit measures mid-way or resets).
 * Sampling draws from the state of the chosen method (readout error included).
 * With `gradient`, the derivatives with respect to the inputs come last (gradient/).
 */
import { simulateDensityMatrix } from "../density-matrix/simulate";
import { hasStateNoise } from "../noise/validate";
import {
  matrixExpectationOnDensity,
  matrixExpectationOnState,
} from "../observable/matrix-expectation";
import {
  pauliExpectationsOnDensity,
  pauliExpectationsOnState,
  weightedTotal,
} from "../observable/pauli-expectation";
import {
  sampleObservable,
  type PreparedObservable,
  type PreparedState,
  type SamplingOutcome,
} from "../sampling/sample-observable";
import type { ParsedProgram } from "../circuit";
import { gradientAtPoint, type GradientResult } from "../gradient";
import { reserveLambda } from "../gradient/adjoint";
import {
  groundWeightOnDensity,
  groundWeightOnState,
  type ComplexVector,
} from "../observable/lowest-levels";
import { simulateStatevector } from "../statevector/simulate";
import type { Circuit } from "../types";
import type { Progress } from "./progress";
import type { NormalisedRequest } from "./validate-request";

export interface PointResult {
  ideal: number;
  exact: number;
  /** Per-term exact ⟨P_i⟩ under the noise model (Pauli observables). */
  termValues: Float64Array | null;
  sampling: SamplingOutcome | null;
  gradient: GradientResult | null;
  /** Shots of the parameter-shifted circuits. */
  gradientShots: number;
  /** ⟨ψ|P₀|ψ⟩ (Tr(P₀ρ) under noise) when the ground space is known. */
  groundWeight: number | null;
  simulateMs: number;
  sampleMs: number;
}

function valuesOf(
  state: PreparedState,
  obs: PreparedObservable,
): { value: number; terms: Float64Array | null } {
  if (obs.kind === "matrix") {
    const value =
      state.kind === "statevector"
        ? matrixExpectationOnState(state.state, obs.matrix)
        : matrixExpectationOnDensity(state.rho, obs.matrix);
    return { value, terms: null };
  }
  const terms =
    state.kind === "statevector"
      ? pauliExpectationsOnState(state.state, obs.sum)
      : pauliExpectationsOnDensity(state.rho, obs.sum);
  return { value: weightedTotal(obs.sum, terms), terms };
}

export async function evaluatePoint(
  circuit: Circuit,
  obs: PreparedObservable,
  req: NormalisedRequest,
  seed: number,
  progress: Progress,
  differentiate: { program: ParsedProgram; params: Record<string, number> } | null = null,
  ground: ComplexVector[] | null = null,
): Promise<PointResult> {
  const t0 = performance.now();
  const sim = progress.span(0, 0.5, "simulate");
  sim.report(0);
  const simOpts = { onProgress: sim.syncReporter(), signal: progress.signal };
  let state: PreparedState;
  let ideal: number | null = null;
  if (req.method === "statevector") {
    // with a gradient to follow, the state's memory also holds λ (adjoint.ts: one SIMD pass
    // reads both for every block's cross matrix)
    const companion = differentiate !== null && reserveLambda(circuit.numQubits);
    state = { kind: "statevector", state: simulateStatevector(circuit, { ...simOpts, companion }) };
  } else {
    const noisy = hasStateNoise(req.noise);
    state = { kind: "density_matrix", rho: simulateDensityMatrix(circuit, req.noise, simOpts) };
    if (noisy) {
      await sim.tick(0.8);
      const pure = !circuit.hasMidCircuitMeasurement && !circuit.hasReset;
      const idealState: PreparedState = pure
        ? { kind: "statevector", state: simulateStatevector(circuit, { signal: progress.signal }) }
        : {
            kind: "density_matrix",
            rho: simulateDensityMatrix(circuit, undefined, { signal: progress.signal }),
          };
      ideal = valuesOf(idealState, obs).value;
    }
  }
  const exact = valuesOf(state, obs);
  const groundWeight = ground
    ? state.kind === "statevector"
      ? groundWeightOnState(ground, state.state)
      : groundWeightOnDensity(ground, state.rho)
    : null;
  const simulateMs = performance.now() - t0;
  await sim.tick(1);
  const wantShots = req.shots > 0 || req.targetPrecision !== null;
  let sampling: SamplingOutcome | null = null;
  const t1 = performance.now();
  const samplingOptions = {
    shots: req.targetPrecision !== null ? null : req.shots,
    targetPrecision: req.targetPrecision,
    split: req.split,
    readout: req.readout,
    mitigate: req.mitigate,
  };
  if (wantShots) {
    const smp = progress.span(0.5, differentiate ? 0.6 : 1, "sample");
    smp.report(0);
    sampling = await sampleObservable(state, obs, {
      ...samplingOptions,
      seed,
      tick: (f) => smp.tick(f),
    });
  }
  let gradient: GradientResult | null = null;
  let gradientShots = 0;
  if (differentiate) {
    const grd = progress.span(wantShots ? 0.6 : 0.5, 1, "gradient");
    grd.report(0);
    const g = await gradientAtPoint({
      program: differentiate.program,
      params: differentiate.params,
      circuit,
      obs,
      method: req.method,
      noise: req.noise,
      state,
      sampling: wantShots ? samplingOptions : null,
      seed,
      signal: progress.signal,
      tick: (f) => grd.tick(f),
    });
    gradient = g.gradient;
    gradientShots = g.shots;
  }
  return {
    gradient,
    gradientShots,
    groundWeight,
    ideal: ideal ?? exact.value,
    exact: exact.value,
    termValues: exact.terms,
    sampling,
    simulateMs,
    sampleMs: performance.now() - t1,
  };
}

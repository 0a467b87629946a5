/**
 * Gradients of a run's expectation value with respect to its declared inputs, at one
 * parameter point: exact (adjoint method for pure states, forward tangent for noisy or
 * mixed density-matrix runs) and, when shots are drawn, sampled by parameter-shift rules.
 */
import type { ParsedProgram } from "../circuit";
import { EngineError } from "../errors";
import { hasStateNoise } from "../noise/validate";
import type {
  PreparedObservable,
  PreparedState,
  SamplingOptions,
} from "../sampling/sample-observable";
import { simulateStatevector } from "../statevector/simulate";
import type { Circuit, NoiseModel } from "../types";
import { adjointGradient, reserveLambda } from "./adjoint";
import { densityGradient } from "./density-tangent";
import { sampledGradient, shiftedCircuitCount, shiftTerms } from "./shift-sampling";
import { buildTape } from "./tape";

export { shiftedCircuitCount, shiftTerms } from "./shift-sampling";
export { buildTape } from "./tape";

export type GradientResult = Record<
  string,
  { exact: number; sampled?: { mean: number; stdErr: number } }
>;

/** Refuses `gradient: true` on a circuit without inputs (nothing to differentiate). */
export function assertDifferentiable(program: ParsedProgram): void {
  if (program.inputs.length === 0) {
    const message =
      program.format === "qasm3"
        ? "gradient needs inputs to differentiate: the circuit declares none (declare them with 'input float theta;')"
        : "gradient needs inputs to differentiate: OpenQASM 2.0 circuits have none (use the qasm3 format with 'input float theta;')";
    throw new EngineError("invalid_request", message, [{ path: ["gradient"], message }]);
  }
}

/** Shifted circuits per point for the sampled gradient (0 when no shots are drawn). */
export function plannedShiftedCircuits(
  program: ParsedProgram,
  params: Record<string, number>,
): number {
  return shiftedCircuitCount(shiftTerms(buildTape(program, params)));
}

export interface GradientInput {
  program: ParsedProgram;
  params: Record<string, number>;
  circuit: Circuit;
  obs: PreparedObservable;
  method: "statevector" | "density_matrix";
  noise: NoiseModel | undefined;
  /** The point's state; a statevector is overwritten (callers are done with it). */
  state: PreparedState;
  /** Sampling options of the point, or null without shots. */
  sampling: Omit<SamplingOptions, "seed" | "tick"> | null;
  seed: number;
  signal?: AbortSignal;
  tick: (fraction: number) => Promise<void>;
}

export async function gradientAtPoint(
  input: GradientInput,
): Promise<{ gradient: GradientResult; shots: number }> {
  const tape = buildTape(input.program, input.params);
  const pure = !input.circuit.hasMidCircuitMeasurement && !input.circuit.hasReset;
  let exact: Float64Array;
  if (input.state.kind === "statevector") {
    exact = adjointGradient(tape, input.state.state, input.obs, { signal: input.signal });
  } else if (pure && !hasStateNoise(input.noise)) {
    exact = adjointGradient(
      tape,
      simulateStatevector(input.circuit, {
        signal: input.signal,
        companion: reserveLambda(input.circuit.numQubits),
      }),
      input.obs,
      { signal: input.signal },
    );
  } else {
    exact = densityGradient(tape, input.obs, input.noise, { signal: input.signal });
  }
  await input.tick(input.sampling ? 0.1 : 1);
  const gradient: GradientResult = {};
  tape.inputNames.forEach((name, j) => {
    gradient[name] = { exact: exact[j] };
  });
  if (!input.sampling) return { gradient, shots: 0 };
  const sampled = await sampledGradient({
    tape,
    terms: shiftTerms(tape),
    circuit: input.circuit,
    obs: input.obs,
    method: input.method,
    noise: input.noise,
    sampling: input.sampling,
    seed: input.seed,
    signal: input.signal,
    tick: (f) => input.tick(0.1 + 0.9 * f),
  });
  tape.inputNames.forEach((name, j) => {
    gradient[name].sampled = sampled.gradient[j];
  });
  return { gradient, shots: sampled.shots };
}

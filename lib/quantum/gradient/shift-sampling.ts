/**
 * Sampled gradients by parameter-shift rules: for every gate angle θ that depends on an
 * input, the circuit is re-run with θ shifted (two circuits for gates whose generator has
 * one eigenvalue gap — Mitarai et al. 2018, Schuld et al. 2019 — four for controlled
 * rotations, whose generator has the gaps ½ and 1; shift-rules.ts), each shifted circuit
 * is sampled with the run's shot setting on its own seed stream, and
 *   ∂⟨A⟩/∂x_j ≈ Σ_θ (∂θ/∂x_j) Σ_μ w_μ · Ā(θ + s_μ)
 * (chain rule over every occurrence of x_j). The shifted estimates are independent, so the
 * standard error is √(Σ (∂θ/∂x_j · w_μ)² · stdErr_μ²). The sampled value includes readout
 * error; with mitigateReadout the mitigated shifted values are used.
 */
import { EngineError } from "../errors";
import { pointSeed } from "../estimate/sweep-grid";
import {
  sampleObservable,
  type PreparedObservable,
  type PreparedState,
  type SamplingOptions,
} from "../sampling/sample-observable";
import { simulateDensityMatrix } from "../density-matrix/simulate";
import { simulateStatevector } from "../statevector/simulate";
import type { Circuit, CircuitOp, NoiseModel } from "../types";
import { expectationRule, matrixDerivative, type ShiftRule } from "./shift-rules";
import { angleGradient, type Tape, type TapeAngle, type TapePart } from "./tape";

export interface ShiftTerm {
  part: TapePart;
  angle: TapeAngle;
  rule: ShiftRule;
}

/** Every input-dependent angle with its shift rule (angles that cannot change ⟨A⟩ are left out). */
export function shiftTerms(tape: Tape): ShiftTerm[] {
  const out: ShiftTerm[] = [];
  for (const op of tape.ops) {
    if (op.kind !== "gate") continue;
    for (const part of op.parts) {
      for (const angle of part.angles) {
        const du = matrixDerivative((p) => part.gate.matrix(p), part.values, angle.k);
        let rule: ShiftRule | null;
        try {
          rule = expectationRule(part.matrix, du);
        } catch {
          const message = `gate '${part.gate.name}' has no parameter-shift rule for its angle ${angle.k + 1} ('${angle.expr.text}')`;
          throw new EngineError("unsupported", message, [
            { path: ["gradient"], message, line: angle.expr.line, column: angle.expr.column },
          ]);
        }
        if (rule) out.push({ part, angle, rule });
      }
    }
  }
  return out;
}

/** Shifted circuits per point. */
export function shiftedCircuitCount(terms: readonly ShiftTerm[]): number {
  return terms.reduce((a, t) => a + t.rule.shifts.length, 0);
}

function shiftedCircuit(circuit: Circuit, part: TapePart, k: number, shift: number): Circuit {
  const values = part.values.slice();
  values[k] += shift;
  const op = circuit.ops[part.opIndex] as Extract<CircuitOp, { kind: "gate" }>;
  const parts = op.parts.slice();
  parts[part.partIndex] = { ...parts[part.partIndex], matrix: part.gate.matrix(values) };
  const ops = circuit.ops.slice();
  ops[part.opIndex] = { ...op, parts };
  return { ...circuit, ops };
}

export interface ShiftSample {
  weight: number;
  mean: number;
  stdErr: number;
}

/** The one place where shifted estimates are combined: Σ w·mean and its standard error. */
export function combineShifted(samples: readonly ShiftSample[]): { mean: number; stdErr: number } {
  let mean = 0;
  let variance = 0;
  for (const s of samples) {
    mean += s.weight * s.mean;
    variance += s.weight * s.weight * s.stdErr * s.stdErr;
  }
  return { mean, stdErr: Math.sqrt(variance) };
}

export interface ShiftSamplingInput {
  tape: Tape;
  terms: readonly ShiftTerm[];
  circuit: Circuit;
  obs: PreparedObservable;
  method: "statevector" | "density_matrix";
  noise: NoiseModel | undefined;
  sampling: Omit<SamplingOptions, "seed" | "tick">;
  /** The point's seed; shifted circuit c samples with pointSeed(seed ^ 0x5bd1e995, c). */
  seed: number;
  signal?: AbortSignal;
  tick: (fraction: number) => Promise<void>;
}

export async function sampledGradient(
  input: ShiftSamplingInput,
): Promise<{ gradient: { mean: number; stdErr: number }[]; shots: number }> {
  const { tape, terms } = input;
  const perInput: ShiftSample[][] = tape.inputNames.map(() => []);
  const total = shiftedCircuitCount(terms);
  let c = 0;
  let shots = 0;
  for (const term of terms) {
    const chain = angleGradient(tape, term.angle);
    for (let m = 0; m < term.rule.shifts.length; m++) {
      const circuit = shiftedCircuit(input.circuit, term.part, term.angle.k, term.rule.shifts[m]);
      const state: PreparedState =
        input.method === "statevector"
          ? { kind: "statevector", state: simulateStatevector(circuit, { signal: input.signal }) }
          : {
              kind: "density_matrix",
              rho: simulateDensityMatrix(circuit, input.noise, { signal: input.signal }),
            };
      const outcome = await sampleObservable(state, input.obs, {
        ...input.sampling,
        seed: pointSeed((input.seed ^ 0x5bd1e995) >>> 0, c + 1),
      });
      const est =
        input.sampling.mitigate && outcome.mitigated ? outcome.mitigated : outcome.sampled;
      shots += outcome.sampled.shots;
      chain.forEach((g, j) => {
        if (g !== 0)
          perInput[j].push({
            weight: g * term.rule.weights[m],
            mean: est.mean,
            stdErr: est.stdErr,
          });
      });
      c++;
      await input.tick(c / total);
    }
  }
  return { gradient: perInput.map(combineShifted), shots };
}

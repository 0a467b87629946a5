/**
 * Exact gradient of the noisy value Tr(ρA) for density-matrix runs, by forward-mode
 * differentiation: the tangent τ = ∂ρ/∂x_j is propagated beside ρ through the same steps.
 * The noise channels, measurements and resets are linear maps that do not depend on the
 * inputs, so they act on τ exactly as on ρ; a gate U(x) maps
 *   τ → U τ U† + S + S†,  S = (∂U/∂x_j) ρ U†,  ∂U/∂x_j = Σ_angles (∂U/∂θ)(∂θ/∂x_j)
 * (ρ taken before the gate). Then ∂Tr(ρA)/∂x_j = Tr(τA). Exact (no finite differences),
 * and sound for every channel, including the non-invertible ones (reset, strong damping),
 * which rule out running the adjoint method backwards through ρ. Cost: one joint pass of
 * ρ and τ per input, memory two density matrices. Noise placement follows the simulator
 * (density-matrix/simulate.ts): after each top-level gate op on its qubits.
 */
import { applyUnitaryDMUnchecked } from "../density-matrix/kernels";
import { createZeroDensity } from "../density-matrix/state";
import { measureNonSelective, resetQubit } from "../noise/channels";
import { applyOpNoise, NoisePlan } from "../noise/gate-noise";
import { hasStateNoise } from "../noise/validate";
import { matrixExpectationOnDensity } from "../observable/matrix-expectation";
import { pauliExpectationsOnDensity, weightedTotal } from "../observable/pauli-expectation";
import type { PreparedObservable } from "../sampling/sample-observable";
import { applyDense } from "../statevector/dispatch";
import { RunControl, type RunOptions } from "../statevector/run-control";
import type { DensityMatrix, NoiseModel } from "../types";
import { matrixDerivative } from "./shift-rules";
import type { Tape, TapePart } from "./tape";

function conjugate(m: Float64Array): Float64Array {
  const out = m.slice();
  for (let i = 1; i < out.length; i += 2) out[i] = -out[i];
  return out;
}

/** Σ_angles (∂U/∂θ)·(∂θ/∂x_j) for input j, or null when the part does not depend on x_j. */
function partTangent(tape: Tape, part: TapePart, j: number): Float64Array | null {
  let out: Float64Array | null = null;
  for (const angle of part.angles) {
    const g = new Float64Array(tape.numInputs);
    angle.expr.grad(tape.x, g, 1);
    if (g[j] === 0) continue;
    const du = matrixDerivative((p) => part.gate.matrix(p), part.values, angle.k);
    if (out === null) out = new Float64Array(du.length);
    for (let i = 0; i < du.length; i++) out[i] += g[j] * du[i];
  }
  return out;
}

/** τ += S + S† with S = D ρ U† (D on the row bits, conj(U) on the column bits). */
function addSource(
  tau: DensityMatrix,
  rho: DensityMatrix,
  qubits: readonly number[],
  d: Float64Array,
  u: Float64Array,
): void {
  const n = rho.n;
  const sre = rho.re.slice();
  const sim = rho.im.slice();
  applyDense(
    sre,
    sim,
    qubits.map((q) => q + n),
    d,
  );
  applyDense(sre, sim, qubits, conjugate(u));
  const dim = 1 << n;
  for (let r = 0; r < dim; r++) {
    for (let c = 0; c < dim; c++) {
      tau.re[r * dim + c] += sre[r * dim + c] + sre[c * dim + r];
      tau.im[r * dim + c] += sim[r * dim + c] - sim[c * dim + r];
    }
  }
}

function valueOf(rho: DensityMatrix, obs: PreparedObservable): number {
  if (obs.kind === "matrix") return matrixExpectationOnDensity(rho, obs.matrix);
  return weightedTotal(obs.sum, pauliExpectationsOnDensity(rho, obs.sum));
}

/** ∂Tr(ρA)/∂x_j for every input j under the noise model (indexed like the inputs). */
export function densityGradient(
  tape: Tape,
  obs: PreparedObservable,
  noise: NoiseModel | undefined,
  opts: RunOptions = {},
): Float64Array {
  const grad = new Float64Array(tape.numInputs);
  const noisy = hasStateNoise(noise);
  // The noise of every gate application as the simulator resolves it (per-gate overrides, idle noise).
  const plan = new NoisePlan(noise, tape.numQubits);
  const control = new RunControl(opts, tape.numInputs * tape.ops.length, "gradient");
  const depends = new Set<number>();
  for (const op of tape.ops) {
    if (op.kind !== "gate") continue;
    for (const part of op.parts) {
      for (const angle of part.angles) {
        const g = new Float64Array(tape.numInputs);
        angle.expr.grad(tape.x, g, 1);
        g.forEach((v, j) => v !== 0 && depends.add(j));
      }
    }
  }
  for (let j = 0; j < tape.numInputs; j++) {
    if (!depends.has(j)) continue;
    const rho = createZeroDensity(tape.numQubits);
    const tau: DensityMatrix = {
      n: rho.n,
      re: new Float64Array(rho.re.length),
      im: new Float64Array(rho.im.length),
    };
    tape.ops.forEach((op, i) => {
      if (op.kind === "gate") {
        for (const part of op.parts) {
          applyUnitaryDMUnchecked(tau, part.qubits, part.matrix);
          const d = partTangent(tape, part, j);
          if (d !== null) addSource(tau, rho, part.qubits, d, part.matrix);
          applyUnitaryDMUnchecked(rho, part.qubits, part.matrix);
        }
        if (noisy) {
          const after = plan.after(op);
          applyOpNoise(tau, after);
          applyOpNoise(rho, after);
        }
      } else if (op.kind === "measure") {
        if (!op.final) {
          measureNonSelective(tau, op.qubit);
          measureNonSelective(rho, op.qubit);
        }
      } else {
        resetQubit(tau, op.qubit);
        resetQubit(rho, op.qubit);
      }
      control.tick(j * tape.ops.length + i + 1);
    });
    grad[j] = valueOf(tau, obs);
  }
  return grad;
}

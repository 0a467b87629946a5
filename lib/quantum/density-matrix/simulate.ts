/**
 * Density-matrix simulation with the noise model described in DEVELOPERS.md ("Noise model").
 *
 * Starting from ρ = |0…0⟩⟨0…0|, each top-level op in order:
 * - gate on k qubits: its parts as ρ → UρU†; then, on its k qubits,
 *   (1) depolarizing of their 2^k-dim space with p = depolarizing1q (k = 1) or
 *   depolarizing2q (k ≥ 2), (2) amplitude damping γ and (3) phase damping λ on each qubit
 *   (formulas and sources in noise/channels.ts). `id` is a gate and gets the noise.
 *   Rates may be overridden per gate name and idle qubits may get noise too: the
 *   parameters of every application are resolved by NoisePlan (noise/gate-noise.ts).
 * - barrier: nothing. Final measurement (nothing acts on that qubit afterwards): ignored —
 *   the expectation is taken before it. Mid-circuit measurement: non-selective projective
 *   Z measurement (dephasing). reset: ρ → |0⟩⟨0| ⊗ Tr_q ρ.
 * With state noise, a gate on ≤ 2 qubits (its parts multiplied into one matrix) and its noise
 * are ONE pass over ρ (noisy-gate.ts); wider gates take the fused unitary passes and then the
 * channel kernels. Without state noise, gates are fused across ops (between measurements/resets).
 * The noise parameters are handed to the kernels per gate application (NoisePlan).
 */
import type { Circuit, DensityMatrix, GateApplication, NoiseModel } from "../types";
import { checkCircuit } from "../statevector/circuit-check";
import { GateFuser, fuseGates } from "../statevector/fusion";
import { assertDensityMatrixFits, type MemoryLimits } from "../statevector/memory";
import { RunControl, type RunOptions } from "../statevector/run-control";
import { NoisePlan } from "../noise/gate-noise";
import { hasStateNoise, validateNoiseModel } from "../noise/validate";
import { embedMatrix, multiplyMatrices } from "../statevector/matrix-ops";
import { engineThreads, threadsFor } from "../parallel/config";
import { ParallelState } from "../parallel/kernel-pool";
import { applyDensityStep, type DensityStep, splitForSlices } from "./steps";
import { createZeroDensity, densitySlice } from "./state";

export interface DensityOptions extends RunOptions, MemoryLimits {
  /**
   * Engine threads (default engineThreads()); 1 = the single-thread path. ρ of n qubits is a
   * vectorised 2n-bit state: threads from 2n ≥ PARALLEL_MIN_QUBITS.
   */
  threads?: number;
}

type Step = DensityStep;

/** For each op index, whether it is a measurement that nothing follows on its qubit. */
function finalMeasurements(circuit: Circuit): boolean[] {
  const final = new Array<boolean>(circuit.ops.length).fill(false);
  const touchedLater = new Set<number>();
  for (let i = circuit.ops.length - 1; i >= 0; i--) {
    const op = circuit.ops[i];
    if (op.kind === "measure") {
      final[i] = !touchedLater.has(op.qubit);
      touchedLater.add(op.qubit);
    } else if (op.kind === "reset") {
      touchedLater.add(op.qubit);
    } else if (op.kind === "gate") {
      for (const q of op.qubits) touchedLater.add(q);
    }
  }
  return final;
}

/** The product of an op's parts (later parts on the left) on the op's own operands; null when none. */
function opMatrix(
  qubits: readonly number[],
  parts: readonly GateApplication[],
): Float64Array | null {
  const d = 1 << qubits.length;
  let m: Float64Array | null = null;
  for (const part of parts) {
    const u = embedMatrix(part.matrix, part.qubits, qubits);
    m = m ? multiplyMatrices(u, m, d) : u;
  }
  return m;
}

/** The step list: unitaries (fused), noise after each gate op, measurements and resets. */
export function densitySteps(
  circuit: Circuit,
  noisy: boolean,
  plan: NoisePlan = new NoisePlan(undefined, circuit.numQubits),
): Step[] {
  const steps: Step[] = [];
  const final = finalMeasurements(circuit);
  let fuser = new GateFuser();
  const flush = (): void => {
    for (const gate of fuser.result()) steps.push({ kind: "unitary", gate });
    fuser = new GateFuser();
  };
  circuit.ops.forEach((op, i) => {
    if (op.kind === "gate") {
      if (noisy && op.qubits.length <= 2) {
        steps.push({
          kind: "noisy-gate",
          qubits: op.qubits,
          matrix: opMatrix(op.qubits, op.parts),
          noise: plan.after(op),
        });
      } else if (noisy) {
        for (const gate of fuseGates(op.parts)) steps.push({ kind: "unitary", gate });
        steps.push({ kind: "noise", noise: plan.after(op) });
      } else {
        for (const part of op.parts) fuser.add(part);
      }
    } else if (op.kind === "measure" && !final[i]) {
      flush();
      steps.push({ kind: "measure", qubit: op.qubit });
    } else if (op.kind === "reset") {
      flush();
      steps.push({ kind: "reset", qubit: op.qubit });
    }
  });
  flush();
  return steps;
}

export function simulateDensityMatrix(
  circuit: Circuit,
  noise: NoiseModel | undefined,
  opts: DensityOptions = {},
): DensityMatrix {
  validateNoiseModel(noise, circuit.numQubits);
  assertDensityMatrixFits(circuit.numQubits, opts);
  checkCircuit(circuit);
  const noisy = hasStateNoise(noise);
  const steps = densitySteps(circuit, noisy, new NoisePlan(noise, circuit.numQubits));
  const control = new RunControl(opts, steps.length, "simulate");
  const n = circuit.numQubits;
  const threads = threadsFor(2 * n, opts.threads ?? engineThreads());
  const rho = createZeroDensity(n, threads > 1);
  const shared = threads > 1 ? new ParallelState(2 * n, threads, { existing: rho }) : null;
  try {
    // slices of ρ: the top log2(threads) row bits select the thread; steps on lower qubits
    // act inside every slice
    const limit = n - Math.log2(threads);
    for (let i = 0; i < steps.length; i++) {
      if (shared?.parallel) {
        for (const part of splitForSlices(steps[i], limit)) {
          if (!part.low) applyDensityStep(rho, part.step);
          else {
            const payloads = new Array<DensityStep>(threads - 1).fill(part.step);
            shared.runJobs("density", payloads, () =>
              applyDensityStep(densitySlice(rho, 0, threads), part.step),
            );
          }
        }
      } else applyDensityStep(rho, steps[i]);
      control.tick(i + 1);
    }
  } finally {
    shared?.detach();
  }
  control.finish();
  return rho;
}

/**
 * The steps of a density-matrix simulation and how one is applied: a fused unitary, a wide
 * gate's noise, a gate with its noise in one pass, idle-qubit noise, a mid-circuit measurement
 * or a reset. `splitForSlices` cuts a step into parts that touch only qubits below a limit
 * (applied by every engine thread to its slice of ρ) or not (applied to the whole ρ by one),
 * keeping their order, so a threaded run performs the same arithmetic as a single thread.
 */
import type { DensityMatrix, GateApplication } from "../types";
import { measureNonSelective, resetQubit } from "../noise/channels";
import { applyIdleNoise, applyOpNoise, type IdleNoise, type OpNoise } from "../noise/gate-noise";
import { applyUnitaryDMUnchecked } from "./kernels";
import { applyNoisyGate } from "./noisy-gate";

export type DensityStep =
  | { kind: "unitary"; gate: GateApplication }
  | { kind: "noise"; noise: OpNoise }
  /** A gate on ≤ 2 qubits and its noise in one pass (noisy-gate.ts); matrix on `qubits`, null = identity. */
  | { kind: "noisy-gate"; qubits: readonly number[]; matrix: Float64Array | null; noise: OpNoise }
  /** Noise on idle qubits alone (a part of a split step). */
  | { kind: "idle"; idle: IdleNoise }
  | { kind: "measure"; qubit: number }
  | { kind: "reset"; qubit: number };

export function applyDensityStep(rho: DensityMatrix, step: DensityStep): void {
  switch (step.kind) {
    case "unitary":
      applyUnitaryDMUnchecked(rho, step.gate.qubits, step.gate.matrix);
      return;
    case "noisy-gate":
      applyNoisyGate(rho, step.qubits, step.matrix, step.noise.gate);
      if (step.noise.idle) applyIdleNoise(rho, step.noise.idle);
      return;
    case "noise":
      applyOpNoise(rho, step.noise);
      return;
    case "idle":
      applyIdleNoise(rho, step.idle);
      return;
    case "measure":
      measureNonSelective(rho, step.qubit);
      return;
    case "reset":
      resetQubit(rho, step.qubit);
  }
}

/** A part of a step and whether every qubit it touches lies below the limit. */
export interface StepPart {
  step: DensityStep;
  low: boolean;
}

/** Idle noise cut into runs of consecutive qubits on the same side of `limit`. */
function idleParts(idle: IdleNoise, limit: number): StepPart[] {
  const parts: StepPart[] = [];
  for (const q of idle.qubits) {
    const low = q < limit;
    const last = parts[parts.length - 1];
    if (last && last.low === low && last.step.kind === "idle") {
      (last.step.idle.qubits as number[]).push(q);
    } else parts.push({ step: { kind: "idle", idle: { ...idle, qubits: [q] } }, low });
  }
  return parts;
}

/** The step as parts in order (module comment); most steps are one part. */
export function splitForSlices(step: DensityStep, limit: number): StepPart[] {
  const below = (qubits: readonly number[]): boolean => qubits.every((q) => q < limit);
  switch (step.kind) {
    case "unitary":
      return [{ step, low: below(step.gate.qubits) }];
    case "measure":
    case "reset":
      return [{ step, low: step.qubit < limit }];
    case "idle":
      return idleParts(step.idle, limit);
    case "noisy-gate":
    case "noise": {
      const { idle } = step.noise;
      const own = { ...step, noise: { ...step.noise, idle: null } };
      const head: StepPart = { step: own, low: below(step.noise.qubits) };
      if (step.kind === "noisy-gate") head.low &&= below(step.qubits);
      return idle ? [head, ...idleParts(idle, limit)] : [head];
    }
  }
}

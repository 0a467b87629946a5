/**
 * The noise model resolved per gate application: what the density-matrix simulator (and
 * anything else that replays the noisy circuit, e.g. gradients) applies after each
 * top-level gate op. Semantics (README "Noise model", DEVELOPERS.md):
 * - after a gate op on k qubits: depolarizing of their 2^k-dim space with
 *   p = noise.gates[name].depolarizing if given, else depolarizing1q (k = 1) /
 *   depolarizing2q (k ≥ 2); then on each of those qubits amplitude damping γ and phase
 *   damping λ, each also overridable per gate name (`name` = the op's name as written,
 *   e.g. "cx", "mygate", "ctrl @ x");
 * - then, when `idle` is given, every other qubit of the circuit gets the 1-qubit
 *   depolarizing channel p = idle.depolarizing, damping γ = idle.amplitudeDamping and
 *   λ = idle.phaseDamping (idle noise is off by default);
 * - barriers, measurements and resets get no noise.
 * Old models (no `gates`, no `idle`) resolve exactly as before.
 */
import type { DensityMatrix, NoiseModel } from "../types";
import { dampQubit, depolarize, noiseAfter1q } from "./channels";

/** The noise that follows one gate application: p for its 2^k-dim space, γ and λ per operand. */
export interface GateNoise {
  p: number;
  /** Amplitude-damping γ per operand (operand order). */
  gamma: readonly number[];
  /** Phase-damping λ per operand (operand order). */
  lambda: readonly number[];
}

/** 1-qubit channels on each qubit the gate leaves alone. */
export interface IdleNoise {
  qubits: readonly number[];
  p: number;
  gamma: number;
  lambda: number;
}

/** Everything applied after one gate op. */
export interface OpNoise {
  qubits: readonly number[];
  gate: GateNoise;
  idle: IdleNoise | null;
}

/** Resolves a model once per circuit; `after(op)` gives the noise of each gate op. */
export class NoisePlan {
  private readonly idleOn: boolean;

  constructor(
    private readonly model: NoiseModel | undefined,
    private readonly numQubits: number,
  ) {
    const idle = model?.idle;
    this.idleOn =
      !!idle &&
      ((idle.depolarizing ?? 0) > 0 ||
        (idle.amplitudeDamping ?? 0) > 0 ||
        (idle.phaseDamping ?? 0) > 0);
  }

  after(op: { name: string; qubits: readonly number[] }): OpNoise {
    const m = this.model;
    const o = m?.gates && Object.hasOwn(m.gates, op.name) ? m.gates[op.name] : undefined;
    const k = op.qubits.length;
    const p = o?.depolarizing ?? (k === 1 ? m?.depolarizing1q : m?.depolarizing2q) ?? 0;
    const gamma = o?.amplitudeDamping ?? m?.amplitudeDamping ?? 0;
    const lambda = o?.phaseDamping ?? m?.phaseDamping ?? 0;
    let idle: IdleNoise | null = null;
    if (this.idleOn && k < this.numQubits) {
      const touched = new Set(op.qubits);
      const qubits: number[] = [];
      for (let q = 0; q < this.numQubits; q++) if (!touched.has(q)) qubits.push(q);
      idle = {
        qubits,
        p: m?.idle?.depolarizing ?? 0,
        gamma: m?.idle?.amplitudeDamping ?? 0,
        lambda: m?.idle?.phaseDamping ?? 0,
      };
    }
    return {
      qubits: op.qubits,
      gate: { p, gamma: op.qubits.map(() => gamma), lambda: op.qubits.map(() => lambda) },
      idle,
    };
  }
}

/** Applies an op's resolved noise to ρ in place (the kernels of channels.ts). */
export function applyOpNoise(rho: DensityMatrix, noise: OpNoise): void {
  const { qubits, gate, idle } = noise;
  if (qubits.length === 1) {
    noiseAfter1q(rho, qubits[0], gate.p, gate.gamma[0], gate.lambda[0]);
  } else {
    depolarize(rho, qubits, gate.p);
    qubits.forEach((q, j) => dampQubit(rho, q, gate.gamma[j], gate.lambda[j]));
  }
  if (idle) applyIdleNoise(rho, idle);
}

/** The idle part alone (for simulators that fuse the gate's own noise into its pass). */
export function applyIdleNoise(rho: DensityMatrix, idle: IdleNoise): void {
  for (const q of idle.qubits) noiseAfter1q(rho, q, idle.p, idle.gamma, idle.lambda);
}

/**
 * Statevector simulation of a bound circuit: |ψ⟩ = U_L ⋯ U_1 |0…0⟩.
 *
 * Every gate op's `parts` are applied in order after fusion (fusion.ts); barriers are
 * ignored; measurements at the end are ignored (the expectation value is taken on the
 * pre-measurement state). A mid-circuit measurement or a reset makes the state a mixture,
 * which a single statevector cannot hold: EngineError("unsupported") pointing to the
 * density-matrix method.
 */
import { EngineError } from "../errors";
import type { Circuit, GateApplication, StateVector } from "../types";
import { checkCircuit } from "./circuit-check";
import { GateFuser } from "./fusion";
import { assertStatevectorFits, type MemoryLimits } from "./memory";
import { RunControl, type RunOptions } from "./run-control";
import { createZeroState } from "./state";
import { runGates } from "./run-gates";
import { engineThreads, threadsFor } from "../parallel/config";
import { ParallelState } from "../parallel/kernel-pool";

export interface StatevectorOptions extends RunOptions, MemoryLimits {
  /** Fuse gates into ≤ 2-qubit blocks (default true). */
  fuse?: boolean;
  /**
   * Engine threads (default: engineThreads(), i.e. KETWISE_ENGINE_THREADS or the cores);
   * 1 = the single-thread path. States below PARALLEL_MIN_QUBITS always use one thread.
   */
  threads?: number;
  /**
   * Also reserve a companion state in the state's kernel memory (wasm/runtime.ts companionOf):
   * the adjoint gradient keeps λ there and reads λ and φ with one SIMD kernel.
   */
  companion?: boolean;
}

function unsupported(circuit: Circuit, what: string, qubit: number, line: number): never {
  const label = circuit.qubitLabels[qubit] ?? `qubit ${qubit}`;
  const message = `${what} on ${label} (line ${line}) needs the density-matrix method; the statevector method supports only measurements at the end`;
  throw new EngineError("unsupported", message, [{ path: ["method"], message, line }]);
}

/** Rejects resets and measurements followed by anything on the same qubit. */
export function assertNoMidCircuitMeasurement(circuit: Circuit): void {
  const measured = new Map<number, number>(); // qubit → line of its measurement
  for (const op of circuit.ops) {
    if (op.kind === "reset") unsupported(circuit, "a reset", op.qubit, op.line);
    if (op.kind === "measure") {
      const earlier = measured.get(op.qubit);
      if (earlier !== undefined)
        unsupported(circuit, "a mid-circuit measurement", op.qubit, earlier);
      measured.set(op.qubit, op.line);
    } else if (op.kind === "gate") {
      for (const q of op.qubits) {
        const at = measured.get(q);
        if (at !== undefined) unsupported(circuit, "a mid-circuit measurement", q, at);
      }
    }
  }
  if (circuit.hasMidCircuitMeasurement || circuit.hasReset) {
    throw new EngineError(
      "unsupported",
      "mid-circuit measurement and reset need the density-matrix method",
      [
        {
          path: ["method"],
          message: "use the density-matrix method for mid-circuit measurement or reset",
        },
      ],
    );
  }
}

/** The primitive gate list of a circuit, fused unless `fuse` is false. */
export function circuitGates(circuit: Circuit, fuse = true): GateApplication[] {
  const parts: GateApplication[] = [];
  for (const op of circuit.ops) if (op.kind === "gate") parts.push(...op.parts);
  if (!fuse) return parts;
  const fuser = new GateFuser();
  for (const p of parts) fuser.add(p);
  return fuser.result();
}

export function simulateStatevector(circuit: Circuit, opts: StatevectorOptions = {}): StateVector {
  assertStatevectorFits(circuit.numQubits, opts);
  checkCircuit(circuit);
  assertNoMidCircuitMeasurement(circuit);
  const gates = circuitGates(circuit, opts.fuse ?? true);
  const control = new RunControl(opts, gates.length, "simulate");
  const n = circuit.numQubits;
  const threads = threadsFor(n, opts.threads ?? engineThreads());
  const tick = (done: number): void => control.tick(done);
  if (threads > 1) {
    const shared = new ParallelState(n, threads, { reserveCompanion: opts.companion });
    shared.re[0] = 1;
    const state = { n, re: shared.re, im: shared.im };
    try {
      runGates(state, gates, shared, tick);
    } finally {
      shared.detach();
    }
    control.finish();
    return state;
  }
  const state = createZeroState(n, opts.companion);
  runGates(state, gates, null, tick);
  control.finish();
  return state;
}

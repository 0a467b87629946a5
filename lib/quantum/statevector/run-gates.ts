/**
 * A gate sequence applied to a statevector in place, tiled (tiling.ts) and on engine threads
 * when they pay: the one loop behind the simulation and the sampling rotations. With
 * `shared` (helpers attached to the state, kernel-pool.ts) every stage and gate is split over
 * the threads, else everything runs on the calling thread; results are bit-identical either
 * way. `tick(done)` is called after each step with the gates done so far.
 */
import type { ParallelState } from "../parallel/kernel-pool";
import type { GateApplication, StateVector } from "../types";
import { applyToAmplitudes } from "./dispatch";
import { applyStageTiles, planSteps, TILE_MIN_QUBITS_ONE_THREAD, tileCount } from "./tiling";

export function runGates(
  state: StateVector,
  gates: readonly GateApplication[],
  shared: ParallelState | null,
  tick: (done: number) => void = () => {},
): void {
  const { n, re, im } = state;
  const threaded = shared?.parallel === true;
  const steps = planSteps(gates, n, threaded || n >= TILE_MIN_QUBITS_ONE_THREAD);
  let done = 0;
  for (const step of steps) {
    if (threaded && shared) {
      if ("gate" in step) shared.apply(step.gate.qubits, step.gate.matrix);
      else shared.applyStage(step.stage);
    } else if ("gate" in step) applyToAmplitudes(re, im, step.gate.qubits, step.gate.matrix);
    else applyStageTiles(re, im, n, step.stage, 0, tileCount(n, step.stage));
    tick((done += step.count));
  }
}

/**
 * Jobs the engine threads run on an attached state besides gates and stages: each names its
 * work function here, so the helper (kernel-helper.ts) and the caller run the same code. A
 * job's payload is structured-cloned to the helper; results go to shared memory it names.
 */
import { applyDensityStep, type DensityStep } from "../density-matrix/steps";
import { densitySlice } from "../density-matrix/state";
import { runMaskGroups } from "../observable/pauli-expectation";
import type { PauliJob } from "../observable/pauli-threads";

/** What a job sees of the state: the whole amplitude arrays and the thread's index. */
export interface JobContext {
  re: Float64Array;
  im: Float64Array;
  n: number;
  index: number;
  parts: number;
}

export const KERNEL_JOBS: Record<string, (ctx: JobContext, payload: never) => void> = {
  /** A share of the Pauli-sum mask groups: values into the shared output. */
  pauli: (ctx: JobContext, job: PauliJob) =>
    runMaskGroups(ctx.re, ctx.im, ctx.n, job.groups, new Float64Array(job.out), job.lowBits),
  /** A density-matrix step on this thread's slice of ρ (ctx.n = 2 × the qubits). */
  density: (ctx: JobContext, step: DensityStep) =>
    applyDensityStep(
      densitySlice({ n: ctx.n / 2, re: ctx.re, im: ctx.im }, ctx.index, ctx.parts),
      step,
    ),
};

/**
 * Jobs the engine threads run on an attached state besides gates and stages: each names its
 * work function here, so the helper (kernel-helper.ts) and the caller run the same code. A
 * job's payload is structured-cloned to the helper; results go to shared memory it names.
 */
import { applyDensityStep, type DensityStep } from "../density-matrix/steps";
import { densitySlice } from "../density-matrix/state";
import { pauliLambdaRange, type LambdaTerm } from "../gradient/apply-observable";
import { sweepShare, type SweepJob } from "../gradient/sweep-step";
import { runMaskGroups } from "../observable/pauli-expectation";
import { shareOf, sliceOf } from "./shares";
import type { PauliJob } from "../observable/pauli-threads";

/** What a job sees of the state: the whole amplitude arrays and the thread's index. */
export interface JobContext {
  re: Float64Array;
  im: Float64Array;
  n: number;
  index: number;
  parts: number;
  /** The companion state the state was attached with, if any. */
  companion?: { re: Float64Array; im: Float64Array };
}

export const KERNEL_JOBS: Record<string, (ctx: JobContext, payload: never) => void> = {
  /** A share of the Pauli-sum mask groups: values into the shared output. */
  pauli: (ctx: JobContext, job: PauliJob) =>
    runMaskGroups(ctx.re, ctx.im, ctx.n, job.groups, new Float64Array(job.out), job.lowBits),
  /** λ = A·ψ on this thread's output slice (state λ, companion ψ; adjoint gradient). */
  lambda: (ctx: JobContext, terms: LambdaTerm[]) => {
    if (!ctx.companion) throw new Error("the lambda job needs the companion state ψ");
    const [from, to] = shareOf(ctx.re.length, ctx.index, ctx.parts);
    const psi = { n: ctx.n, ...ctx.companion };
    pauliLambdaRange(terms, psi, ctx.re, ctx.im, from, to);
  },
  /** A backward step of the adjoint sweep on this thread's slices of λ (state) and φ (companion). */
  adjoint: (ctx: JobContext, job: SweepJob) => {
    if (!ctx.companion) throw new Error("the adjoint job needs the companion state φ");
    const slice = (re: Float64Array, im: Float64Array) => ({
      re: sliceOf(re, ctx.index, ctx.parts),
      im: sliceOf(im, ctx.index, ctx.parts),
    });
    sweepShare(slice(ctx.re, ctx.im), slice(ctx.companion.re, ctx.companion.im), job, ctx.index);
  },
  /** A density-matrix step on this thread's slice of ρ (ctx.n = 2 × the qubits). */
  density: (ctx: JobContext, step: DensityStep) =>
    applyDensityStep(
      densitySlice({ n: ctx.n / 2, re: ctx.re, im: ctx.im }, ctx.index, ctx.parts),
      step,
    ),
};

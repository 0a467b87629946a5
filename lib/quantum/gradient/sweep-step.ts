/**
 * One backward step of the adjoint sweep (adjoint.ts) on λ and φ — or on the same slice of
 * both, which is how engine threads share a step whose qubits lie below their split bits:
 * φ ← B†φ, the local cross matrix R of λ and φ on the block's qubits (when the block has
 * input-dependent angles), λ ← B†λ (unless it is the first block). R is a sum over the
 * indices, so the threads' partial matrices add up to it (threadedSweepStep).
 */
import { applyToAmplitudes } from "../statevector/dispatch";
import { wasmCross, wasmTwoBlockStep } from "../wasm/cross";
import { wasmBinding } from "../wasm/runtime";
import { backwardStep, crossOnly } from "./backward-step";
import { crossLocal } from "./local-cross";

export interface SweepStep {
  qubits: number[];
  /** B† of the fused block (interleaved 2^k × 2^k). */
  udag: Float64Array;
  /** Whether the block has input-dependent angles (then R is computed). */
  cross: boolean;
  /** Entries of R the derivatives need (nonZeroPattern; 1- and 2-qubit blocks). */
  needed: number;
  updateLambda: boolean;
}

export interface Vec {
  re: Float64Array;
  im: Float64Array;
}

/** The step on (lambda, phi); R or null when the block has no derivatives. */
export function sweepStep(lambda: Vec, phi: Vec, step: SweepStep): Float64Array | null {
  const { qubits, udag, needed, updateLambda } = step;
  if (!step.cross) {
    applyToAmplitudes(phi.re, phi.im, qubits, udag);
    if (updateLambda) applyToAmplitudes(lambda.re, lambda.im, qubits, udag);
    return null;
  }
  const wPhi = wasmBinding(phi.re, phi.im);
  const wLambda = wasmBinding(lambda.re, lambda.im);
  if (qubits.length <= 2 && (!wPhi || !wLambda)) {
    return backwardStep(lambda.re, lambda.im, phi.re, phi.im, qubits, udag, needed, updateLambda);
  }
  // λ and φ in one memory (the forward reserved λ as the state's companion): a two-block B†
  // (a cx fused with gates on its target) is ONE SIMD pass for the whole step
  if (wPhi && wPhi === wLambda) {
    const r = wasmTwoBlockStep(
      wPhi,
      lambda.re,
      lambda.im,
      phi.re,
      phi.im,
      qubits,
      udag,
      needed,
      updateLambda,
    );
    if (r) return r;
  }
  // otherwise B† goes through the SIMD kernels and R is a separate pass: SIMD too when λ and
  // φ share one memory
  applyToAmplitudes(phi.re, phi.im, qubits, udag);
  const r =
    qubits.length > 2
      ? crossLocal(lambda.re, lambda.im, phi.re, phi.im, qubits)
      : wPhi && wPhi === wLambda
        ? wasmCross(wPhi, lambda.re, lambda.im, phi.re, phi.im, qubits, needed)
        : crossOnly(lambda.re, lambda.im, phi.re, phi.im, qubits, needed);
  if (updateLambda) applyToAmplitudes(lambda.re, lambda.im, qubits, udag);
  return r;
}

/** Payload of the "adjoint" job: the step, and where each thread writes its partial R. */
export interface SweepJob {
  step: SweepStep;
  /** T × rSize doubles (slot t for thread t); null when the block has no derivatives. */
  out: SharedArrayBuffer | null;
}

/** A thread's share of a step: its slice of λ and φ, its partial R into its slot. */
export function sweepShare(lambda: Vec, phi: Vec, job: SweepJob, index: number): void {
  const r = sweepStep(lambda, phi, job.step);
  if (r && job.out) new Float64Array(job.out).set(r, index * r.length);
}

/**
 * Exact gradient of ⟨ψ|A|ψ⟩, ψ = U_L ⋯ U_1|0⟩, by adjoint differentiation (Jones & Gacon,
 * "Efficient calculation of gradients in classical simulations of variational quantum
 * algorithms", arXiv:2009.02823, Algorithm 1): with λ = A·ψ and φ = ψ, walking the gates
 * backwards,
 *   φ ← U_k†φ;  for each angle θ of U_k: ∂⟨A⟩/∂θ = 2·Re⟨λ|∂U_k/∂θ|φ⟩;  λ ← U_k†λ.
 * Each angle's derivative enters every input through the chain rule of its expression
 * (tape.ts).
 *
 * The sweep runs over the same fused blocks as the forward simulation (fusion.ts): for a
 * block B = G_m ⋯ G_1, φ ← B†φ, the local cross matrix R of λ and φ on the block's
 * qubits, λ ← B†λ — for blocks on one or two qubits all three in ONE pass over both
 * vectors (backward-step.ts), except in kernel memories (WebAssembly), where B† goes
 * through the SIMD kernels and R is a separate pass (SIMD too when λ is the state's
 * companion in the same memory, wasm/cross.ts); otherwise three (local-cross.ts) — and every
 * angle θ of a member G_j costs only a small matrix product:
 *   ∂⟨A⟩/∂θ = 2·Re Σ_{a,b} (S_j · ∂G_j/∂θ · P_j)[a][b] · R[a][b],
 * P_j = G_{j−1} ⋯ G_1 and S_j = G_m ⋯ G_{j+1} embedded on the block's qubits. Blocks
 * without input-dependent angles just apply B† to both vectors.
 */
import { GateFuser } from "../statevector/fusion";
import { embedMatrix, multiplyMatrices } from "../statevector/matrix-ops";
import { RunControl, type RunOptions } from "../statevector/run-control";
import type { PreparedObservable } from "../sampling/sample-observable";
import type { StateVector } from "../types";
import { engineThreads, threadsFor } from "../parallel/config";
import { shareOf, sliceOf } from "../parallel/shares";
import { allocateAmplitudes } from "../statevector/state";
import { companionOf } from "../wasm/runtime";
import { ParallelState } from "../parallel/kernel-pool";
import { applyObservableInto, pauliLambdaRange, type LambdaTerm } from "./apply-observable";
import { nonZeroPattern } from "./backward-step";
import { sweepShare, sweepStep, type SweepJob, type SweepStep, type Vec } from "./sweep-step";
import { matrixDerivative } from "./shift-rules";
import { dagger, type Tape, type TapeAngle, type TapePart } from "./tape";

/**
 * The sweep posts one job per fused block to the engine threads: below 2^18 amplitudes the
 * hand-off costs what the split saves (measured on the bench's gradient ansatz: 16 qubits
 * 93 ms on one thread and on two; 18 qubits 340 → 233 ms; 20 qubits 1,778 → 1,066 ms).
 */
export const GRADIENT_MIN_PARALLEL_QUBITS = 18;

/**
 * Up to this many qubits a run with a gradient reserves λ as the state's companion at
 * simulation time (the SIMD cross pass). Beyond it λ is allocated when the sweep starts, so a
 * 25- or 26-qubit run does not hold a third state-sized array through its sampling (the
 * rotated copy) — the JavaScript cross pass then reads λ and φ from two memories.
 */
export const COMPANION_MAX_QUBITS = 24;

/** Whether a state simulated for a gradient should reserve λ beside it. */
export const reserveLambda = (n: number): boolean => n <= COMPANION_MAX_QUBITS;

export interface AdjointOptions extends RunOptions {
  /** Engine threads (default engineThreads()); 1 = the single-thread path. */
  threads?: number;
}

/** Gradient (indexed like the inputs). `psi` is the final state of the tape's circuit; it is overwritten. */
export function adjointGradient(
  tape: Tape,
  psi: StateVector,
  obs: PreparedObservable,
  opts: AdjointOptions = {},
): Float64Array {
  const grad = new Float64Array(tape.numInputs);
  const threads =
    psi.n < GRADIENT_MIN_PARALLEL_QUBITS ? 1 : threadsFor(psi.n, opts.threads ?? engineThreads());
  const phi = psi;
  // λ in the state's own kernel memory when the forward reserved it (one SIMD pass reads both)
  const companion = companionOf(psi.re);
  if (companion) {
    companion.re.fill(0);
    companion.im.fill(0);
  }
  const lambda: StateVector = {
    n: psi.n,
    ...(companion ?? allocateAmplitudes(psi.n, threads > 1)),
  };
  const shared =
    threads > 1 ? new ParallelState(psi.n, threads, { existing: lambda, companion: phi }) : null;
  try {
    // λ = A·ψ: by output slices on the engine threads when there are several
    if (shared?.parallel && obs.kind === "pauli") {
      const terms = obs.sum.terms.map(({ xMask, zMask, coefficient }) => ({
        xMask,
        zMask,
        coefficient,
      }));
      const [from, to] = shareOf(lambda.re.length, 0, shared.threads);
      shared.runJobs("lambda", new Array<LambdaTerm[]>(shared.threads - 1).fill(terms), () =>
        pauliLambdaRange(terms, psi, lambda.re, lambda.im, from, to),
      );
    } else applyObservableInto(obs, psi, lambda.re, lambda.im);
    sweep(tape, grad, lambda, phi, shared, opts);
  } finally {
    shared?.detach();
  }
  return grad;
}

/** The backward sweep over the forward's fused blocks (module comment). */
function sweep(
  tape: Tape,
  grad: Float64Array,
  lambda: StateVector,
  phi: StateVector,
  shared: ParallelState | null,
  opts: RunOptions,
): void {
  const parts: TapePart[] = [];
  for (const op of tape.ops) if (op.kind === "gate") parts.push(...op.parts);
  const fuser = new GateFuser();
  for (const p of parts) fuser.add({ name: p.gate.name, qubits: p.qubits, matrix: p.matrix });
  const blocks = fuser.blocksWithSources();
  const control = new RunControl(opts, blocks.length, "gradient");
  for (let i = blocks.length - 1; i >= 0; i--) {
    const { gate, sources } = blocks[i];
    const derivatives = blockDerivatives(parts, sources, gate.qubits);
    const cross = derivatives.length > 0;
    let needed = 0;
    if (gate.qubits.length <= 2) for (const { m } of derivatives) needed |= nonZeroPattern(m);
    const udag = dagger(gate.matrix);
    const step = { qubits: gate.qubits, udag, cross, needed, updateLambda: i > 0 };
    const r =
      shared?.parallel && gate.qubits.every((q) => q < shared.splitBit)
        ? threadedSweepStep(shared, lambda, phi, step)
        : sweepStep(lambda, phi, step);
    if (r) {
      for (const { angle, m } of derivatives) {
        const value = realTrace(m, r);
        if (value !== 0) angle.expr.grad(tape.x, grad, value);
      }
    }
    control.tick(blocks.length - i);
  }
}

/**
 * A step shared by the engine threads (its qubits below their split bits): each on its slice
 * of λ and φ (the state the pool is attached to is λ, the companion φ), R the sum of the
 * partial matrices in thread order.
 */
function threadedSweepStep(
  shared: ParallelState,
  lambda: StateVector,
  phi: StateVector,
  step: SweepStep,
): Float64Array | null {
  const t = shared.threads;
  const size = 2 * 4 ** step.qubits.length;
  const out = step.cross ? new SharedArrayBuffer(8 * size * t) : null;
  const job: SweepJob = { step, out };
  shared.runJobs("adjoint", new Array<SweepJob>(t - 1).fill(job), () =>
    sweepShare(sliceVec(lambda, 0, t), sliceVec(phi, 0, t), job, 0),
  );
  if (!out) return null;
  const all = new Float64Array(out);
  const r = all.slice(0, size);
  for (let k = 1; k < t; k++) for (let w = 0; w < size; w++) r[w] += all[k * size + w];
  return r;
}

const sliceVec = (v: Vec, index: number, parts: number): Vec => ({
  re: sliceOf(v.re, index, parts),
  im: sliceOf(v.im, index, parts),
});

/** 2·Re Σ_{a,b} M[a][b]·R[a][b] for interleaved matrices of equal size. */
function realTrace(m: Float64Array, r: Float64Array): number {
  let acc = 0;
  for (let w = 0; w < m.length; w += 2) acc += m[w] * r[w] - m[w + 1] * r[w + 1];
  return 2 * acc;
}

/** S_j · ∂G_j/∂θ · P_j for every input-dependent angle θ of the block's members (module comment). */
function blockDerivatives(
  parts: readonly TapePart[],
  sources: readonly number[],
  qubits: readonly number[],
): { angle: TapeAngle; m: Float64Array }[] {
  const out: { angle: TapeAngle; m: Float64Array }[] = [];
  if (sources.every((s) => parts[s].angles.length === 0)) return out;
  const d = 1 << qubits.length;
  const embedded = sources.map((s) => embedMatrix(parts[s].matrix, parts[s].qubits, qubits));
  // suffix[j] = G_m ⋯ G_{j+1} (null = identity)
  const suffix: (Float64Array | null)[] = new Array<Float64Array | null>(sources.length).fill(null);
  for (let j = sources.length - 2; j >= 0; j--) {
    const next = embedded[j + 1];
    const after = suffix[j + 1];
    suffix[j] = after === null ? next : multiplyMatrices(after, next, d);
  }
  let prefix: Float64Array | null = null;
  for (let j = 0; j < sources.length; j++) {
    const part = parts[sources[j]];
    for (const angle of part.angles) {
      const du = matrixDerivative((p) => part.gate.matrix(p), part.values, angle.k);
      let m = embedMatrix(du, part.qubits, qubits);
      if (prefix !== null) m = multiplyMatrices(m, prefix, d);
      const after = suffix[j];
      if (after !== null) m = multiplyMatrices(after, m, d);
      out.push({ angle, m });
    }
    prefix = prefix === null ? embedded[j] : multiplyMatrices(embedded[j], prefix, d);
  }
  return out;
}

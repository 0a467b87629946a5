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
 * through the SIMD kernels and R is a separate pass; otherwise three (local-cross.ts) — and every
 * angle θ of a member G_j costs only a small matrix product:
 *   ∂⟨A⟩/∂θ = 2·Re Σ_{a,b} (S_j · ∂G_j/∂θ · P_j)[a][b] · R[a][b],
 * P_j = G_{j−1} ⋯ G_1 and S_j = G_m ⋯ G_{j+1} embedded on the block's qubits. Blocks
 * without input-dependent angles just apply B† to both vectors.
 */
import { applyToAmplitudes } from "../statevector/dispatch";
import { GateFuser } from "../statevector/fusion";
import { embedMatrix, multiplyMatrices } from "../statevector/matrix-ops";
import { RunControl, type RunOptions } from "../statevector/run-control";
import type { PreparedObservable } from "../sampling/sample-observable";
import type { StateVector } from "../types";
import { wasmBinding } from "../wasm/runtime";
import { applyObservable } from "./apply-observable";
import { backwardStep, crossOnly, nonZeroPattern } from "./backward-step";
import { crossLocal } from "./local-cross";
import { matrixDerivative } from "./shift-rules";
import { dagger, type Tape, type TapeAngle, type TapePart } from "./tape";

/** Gradient (indexed like the inputs). `psi` is the final state of the tape's circuit; it is overwritten. */
export function adjointGradient(
  tape: Tape,
  psi: StateVector,
  obs: PreparedObservable,
  opts: RunOptions = {},
): Float64Array {
  const grad = new Float64Array(tape.numInputs);
  const lambda = applyObservable(obs, psi);
  const phi = psi;
  const parts: TapePart[] = [];
  for (const op of tape.ops) if (op.kind === "gate") parts.push(...op.parts);
  const fuser = new GateFuser();
  for (const p of parts) fuser.add({ name: p.gate.name, qubits: p.qubits, matrix: p.matrix });
  const blocks = fuser.blocksWithSources();
  const control = new RunControl(opts, blocks.length, "gradient");
  const simd =
    wasmBinding(phi.re, phi.im) !== undefined && wasmBinding(lambda.re, lambda.im) !== undefined;
  for (let i = blocks.length - 1; i >= 0; i--) {
    const { gate, sources } = blocks[i];
    const udag = dagger(gate.matrix);
    const derivatives = blockDerivatives(parts, sources, gate.qubits);
    if (derivatives.length === 0) {
      applyToAmplitudes(phi.re, phi.im, gate.qubits, udag);
      if (i > 0) applyToAmplitudes(lambda.re, lambda.im, gate.qubits, udag);
    } else {
      let r: Float64Array;
      if (gate.qubits.length <= 2) {
        let needed = 0;
        for (const { m } of derivatives) needed |= nonZeroPattern(m);
        if (simd) {
          applyToAmplitudes(phi.re, phi.im, gate.qubits, udag);
          r = crossOnly(lambda.re, lambda.im, phi.re, phi.im, gate.qubits, needed);
          if (i > 0) applyToAmplitudes(lambda.re, lambda.im, gate.qubits, udag);
        } else {
          r = backwardStep(lambda.re, lambda.im, phi.re, phi.im, gate.qubits, udag, needed, i > 0);
        }
      } else {
        applyToAmplitudes(phi.re, phi.im, gate.qubits, udag);
        r = crossLocal(lambda.re, lambda.im, phi.re, phi.im, gate.qubits);
        if (i > 0) applyToAmplitudes(lambda.re, lambda.im, gate.qubits, udag);
      }
      for (const { angle, m } of derivatives) {
        const value = realTrace(m, r);
        if (value !== 0) angle.expr.grad(tape.x, grad, value);
      }
    }
    control.tick(blocks.length - i);
  }
  return grad;
}

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

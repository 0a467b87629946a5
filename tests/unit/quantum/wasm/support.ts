/** A state in a fresh kernel memory (WebAssembly kernels), filled with seeded random amplitudes. */
import {
  bindMemory,
  companionOf,
  createKernelMemory,
  stateViews,
  wasmBinding,
} from "@/lib/quantum/wasm/runtime";
import { makeRng } from "../statevector/support/random-gates";

export function randomKernelState(n: number, seed: number): { re: Float64Array; im: Float64Array } {
  const memory = createKernelMemory(n);
  if (!memory || !bindMemory(memory, 0)) throw new Error("WebAssembly kernels unavailable");
  const { re, im } = stateViews(memory, n);
  if (!wasmBinding(re, im)) throw new Error("state not bound to the kernels");
  const rng = makeRng(seed);
  let norm = 0;
  for (let i = 0; i < re.length; i++) {
    re[i] = rng.float() - 0.5;
    im[i] = rng.float() - 0.5;
    norm += re[i] * re[i] + im[i] * im[i];
  }
  const f = 1 / Math.sqrt(norm);
  for (let i = 0; i < re.length; i++) {
    re[i] *= f;
    im[i] *= f;
  }
  return { re, im };
}

/**
 * A kernel memory with a companion state (the adjoint sweep's λ beside φ), both filled with
 * seeded random values (not normalised); `rng` continues the same stream.
 */
export function randomCompanionPair(n: number, seed: number) {
  const memory = createKernelMemory(n, 0, true);
  const w = memory && bindMemory(memory, 0);
  if (!memory || !w) throw new Error("WebAssembly kernels unavailable");
  const phi = stateViews(memory, n);
  const lambda = companionOf(phi.re);
  if (!lambda) throw new Error("no companion state");
  const rng = makeRng(seed);
  for (const v of [phi, lambda])
    for (let i = 0; i < v.re.length; i++) {
      v.re[i] = rng.float() - 0.5;
      v.im[i] = rng.float() - 0.5;
    }
  return { w, phi, lambda, rng };
}

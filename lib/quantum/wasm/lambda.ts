/**
 * λ = A·ψ one Pauli term at a time with the SIMD kernel (assembly/lambda-term.ts), for λ and ψ
 * in one kernel memory (the adjoint gradient's companion state): used for flip masks shared
 * by few terms, where a pass per term beats the JavaScript per-mask pass (gradient/
 * apply-observable.ts) by several times.
 */
import { popcount } from "../observable/bits";
import type { WasmBinding } from "./runtime";

/** λ[o] += c·(P ψ)[o] for o in [from, to) (multiples of 8), P = the word with masks (x, z). */
export function wasmLambdaTerm(
  w: WasmBinding,
  lambda: { re: Float64Array; im: Float64Array },
  psi: { re: Float64Array; im: Float64Array },
  from: number,
  to: number,
  x: number,
  z: number,
  coefficient: number,
): void {
  // (Pψ)_o = i^k·s_z(o ⊕ x)·ψ_{o⊕x} and s_z(o ⊕ x) = s_z(o)·s_z(x): i^k and s_z(x) go into c
  const k = popcount(x & z) & 3;
  const c = popcount(x & z) & 1 ? -coefficient : coefficient;
  const cr = k === 0 ? c : k === 2 ? -c : 0;
  const ci = k === 1 ? c : k === 3 ? -c : 0;
  w.k.lambdaTerm(
    lambda.re.byteOffset,
    lambda.im.byteOffset,
    psi.re.byteOffset,
    psi.im.byteOffset,
    from,
    to,
    x,
    z,
    cr,
    ci,
  );
}

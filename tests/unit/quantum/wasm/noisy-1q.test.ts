/**
 * The SIMD noisy 1-qubit gate on a density matrix in a kernel memory (wasm/kernels.ts
 * wasmNoisy1q) against the JavaScript kernel on plain copies (density-matrix/noisy-gate-1q.ts,
 * itself checked against the separate channel passes and N&C Kraus forms in the density-matrix
 * tests): bit-identical for dense and real U on every qubit ≥ 1, on the whole ρ and on slices
 * (how engine threads share a step); qubit 0 stays on the JavaScript kernel.
 */
import { describe, expect, it } from "vitest";
import { noisy1qDense } from "@/lib/quantum/density-matrix/noisy-gate-1q";
import { createZeroDensity, densitySlice } from "@/lib/quantum/density-matrix/state";
import { engineWasm } from "@/lib/quantum/parallel/config";
import { wasmBinding } from "@/lib/quantum/wasm/runtime";
import type { DensityMatrix } from "@/lib/quantum/types";
import { makeRng } from "../statevector/support/random-gates";

const NOISE = { p: 0.013, gamma: [0.021], lambda: [0.034] };

function randomRho(n: number, seed: number): DensityMatrix {
  const rho = createZeroDensity(n);
  const rng = makeRng(seed);
  for (let i = 0; i < rho.re.length; i++) {
    rho.re[i] = rng.float() - 0.5;
    rho.im[i] = rng.float() - 0.5;
  }
  return rho;
}

const plainCopy = (r: DensityMatrix): DensityMatrix => ({
  n: r.n,
  re: Float64Array.from(r.re),
  im: Float64Array.from(r.im),
});

/** cos/sin entries: dense (complex) or real 2×2, interleaved. */
function gate(real: boolean, t: number): Float64Array {
  const c = Math.cos(t),
    s = Math.sin(t);
  return real
    ? Float64Array.of(c, 0, -s, 0, s, 0, c, 0)
    : Float64Array.of(c, 0.1 * s, -s * 0.8, 0.6 * s, s * 0.8, 0.6 * s, c, -0.1 * s);
}

describe.runIf(engineWasm())("wasmNoisy1q", () => {
  const n = 6;

  it("is bit-identical to the JavaScript kernel for dense and real U on qubits 1–5", () => {
    for (const real of [false, true]) {
      for (let q = 0; q < n; q++) {
        const rho = randomRho(n, 40 + q);
        expect(wasmBinding(rho.re, rho.im)).toBeDefined();
        const ref = plainCopy(rho);
        const m = gate(real, 0.3 + q);
        noisy1qDense(rho, q, m, NOISE);
        noisy1qDense(ref, q, m, NOISE);
        expect(rho.re).toEqual(ref.re);
        expect(rho.im).toEqual(ref.im);
      }
    }
  });

  it("gives the same bits on four slices as on the whole ρ (qubits below the slice bits)", () => {
    const rho = randomRho(n, 77);
    const whole = plainCopy(rho);
    const m = gate(false, 1.1);
    for (let k = 0; k < 4; k++) noisy1qDense(densitySlice(rho, k, 4), 3, m, NOISE);
    noisy1qDense(whole, 3, m, NOISE);
    expect(rho.re).toEqual(whole.re);
    expect(rho.im).toEqual(whole.im);
  });
});

/**
 * The WebAssembly gate kernels against the JavaScript kernels (the reference path): on seeded
 * random states, every qubit position and every ordered pair, real and complex matrices, the
 * amplitudes are bit-identical (each lane evaluates the JavaScript expression in its order).
 */
import { describe, expect, it } from "vitest";
import { applyDense, applyToAmplitudes } from "@/lib/quantum/statevector/dispatch";
import { wasmBinding } from "@/lib/quantum/wasm/runtime";
import { type Rng, makeRng } from "../statevector/support/random-gates";
import { randomKernelState } from "./support";

function randomMatrix(rng: Rng, k: number, real: boolean): Float64Array {
  const m = new Float64Array(2 * 4 ** k);
  for (let i = 0; i < m.length; i++) m[i] = i % 2 === 1 && real ? 0 : 2 * rng.float() - 1;
  return m;
}

function expectSame(
  a: { re: Float64Array; im: Float64Array },
  b: { re: Float64Array; im: Float64Array },
): void {
  let diff = 0;
  for (let i = 0; i < a.re.length; i++) {
    diff = Math.max(diff, Math.abs(a.re[i] - b.re[i]), Math.abs(a.im[i] - b.im[i]));
  }
  expect(diff).toBe(0);
}

describe("WebAssembly kernels", () => {
  for (const n of [2, 3, 7, 12]) {
    it(`1-qubit dense, every position, real and complex, n = ${n}`, () => {
      const rng = makeRng(100 + n);
      const w = randomKernelState(n, 7 * n);
      const js = { re: w.re.slice(), im: w.im.slice() };
      expect(wasmBinding(js.re, js.im)).toBeUndefined();
      for (let q = 0; q < n; q++) {
        for (const real of [false, true]) {
          const m = randomMatrix(rng, 1, real);
          applyDense(w.re, w.im, [q], m);
          applyDense(js.re, js.im, [q], m);
          expectSame(w, js);
        }
      }
    });

    it(`2-qubit dense, every ordered pair, real and complex, n = ${n}`, () => {
      const rng = makeRng(200 + n);
      const w = randomKernelState(n, 11 * n);
      const js = { re: w.re.slice(), im: w.im.slice() };
      for (let a = 0; a < n; a++) {
        for (let b = 0; b < n; b++) {
          if (a === b) continue;
          const m = randomMatrix(rng, 2, (a + b) % 2 === 0);
          applyDense(w.re, w.im, [a, b], m);
          applyDense(js.re, js.im, [a, b], m);
          expectSame(w, js);
        }
      }
    });
  }

  it("two-block gates (|0⟩⟨0| ⊗ A + |1⟩⟨1| ⊗ B), every ordered pair, n = 8", () => {
    const n = 8;
    const rng = makeRng(47);
    const w = randomKernelState(n, 9);
    const js = { re: w.re.slice(), im: w.im.slice() };
    for (let a = 0; a < n; a++) {
      for (let b = 0; b < n; b++) {
        if (a === b) continue;
        const A = randomMatrix(rng, 1, false);
        const B = randomMatrix(rng, 1, false);
        const m = new Float64Array(32); // block-diagonal in the first operand
        m.set(A.subarray(0, 4), 0);
        m.set(A.subarray(4, 8), 8);
        m.set(B.subarray(0, 4), 20);
        m.set(B.subarray(4, 8), 28);
        applyToAmplitudes(w.re, w.im, [a, b], m);
        applyToAmplitudes(js.re, js.im, [a, b], m);
        expectSame(w, js);
      }
    }
  });

  it("the structured dispatch (two-block, real 2-qubit, diagonal) agrees as well", () => {
    const n = 9;
    const rng = makeRng(31);
    const w = randomKernelState(n, 5);
    const js = { re: w.re.slice(), im: w.im.slice() };
    const c = Math.cos(0.7),
      s = Math.sin(0.7);
    // cx fused with ry on its target: block-diagonal in the control
    const twoBlock = new Float64Array(32);
    twoBlock.set([c, 0, -s, 0], 0);
    twoBlock.set([s, 0, c, 0], 8);
    twoBlock.set([s, 0, c, 0], 20);
    twoBlock.set([c, 0, -s, 0], 28);
    const gates: [number[], Float64Array][] = [
      [[3, 0], twoBlock],
      [[0, 5], twoBlock],
      [[8, 2], randomMatrix(rng, 2, true)],
      [[4], Float64Array.of(1, 0, 0, 0, 0, 0, c, s)],
      [[1, 6, 7], randomMatrix(rng, 3, false)],
    ];
    for (const [bits, m] of gates) {
      applyToAmplitudes(w.re, w.im, bits, m);
      applyToAmplitudes(js.re, js.im, bits, m);
      expectSame(w, js);
    }
  });
});

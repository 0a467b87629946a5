/**
 * The SIMD cross matrix of two states in one kernel memory (wasm/cross.ts) against the
 * JavaScript cross matrix (gradient/local-cross.ts, itself checked through the adjoint
 * gradient against a per-gate sweep), on random states, every 1- and 2-qubit operand order
 * (bit 0 included) and entry masks: equal to 1e-12 (lane sums add in another order).
 */
import { describe, expect, it } from "vitest";
import { crossLocal } from "@/lib/quantum/gradient/local-cross";
import { wasmCross } from "@/lib/quantum/wasm/cross";
import { randomCompanionPair } from "./support";

describe("wasmCross", () => {
  const n = 9;
  const { w, phi, lambda } = randomCompanionPair(n, 2024);
  const cases: number[][] = [[0], [3], [8], [0, 1], [1, 0], [5, 0], [0, 7], [2, 6], [8, 4], [4, 5]];

  it.each(cases)("bits %j: every entry equals the JavaScript cross matrix to 1e-12", (...bits) => {
    const want = crossLocal(lambda.re, lambda.im, phi.re, phi.im, bits);
    const got = wasmCross(w, lambda.re, lambda.im, phi.re, phi.im, bits, 0xffff);
    expect(got.length).toBe(want.length);
    for (let e = 0; e < want.length; e++) expect(Math.abs(got[e] - want[e])).toBeLessThan(1e-12);
  });

  it("2 qubits: only the requested entries are summed, the others are 0", () => {
    const needed = 0b1010_0000_0110_1001;
    const want = crossLocal(lambda.re, lambda.im, phi.re, phi.im, [6, 2]);
    const got = wasmCross(w, lambda.re, lambda.im, phi.re, phi.im, [6, 2], needed);
    for (let e = 0; e < 16; e++) {
      const on = (needed >> e) & 1;
      for (const k of [0, 1]) {
        if (on) expect(Math.abs(got[2 * e + k] - want[2 * e + k])).toBeLessThan(1e-12);
        else expect(got[2 * e + k]).toBe(0);
      }
    }
  });
});

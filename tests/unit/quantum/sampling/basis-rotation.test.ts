/**
 * The rotated copy behind every Pauli setting's outcome law: through the simulation's gate
 * loop (kernel memory, SIMD kernels) it equals rotating a plain copy qubit by qubit with the
 * JavaScript kernels, bit for bit, and the original state is left untouched. The rotations
 * themselves are the textbook ones (H for X; H·S† for Y), checked on the Bell state.
 */
import { describe, expect, it } from "vitest";
import { HADAMARD, H_SDG, rotateStateCopy } from "@/lib/quantum/sampling/basis-rotation";
import { applyMatrix } from "@/lib/quantum/statevector/kernels";
import { mulberry32, randomState, bellState } from "../observable/random-states";

describe("rotateStateCopy", () => {
  it("equals the qubit-by-qubit rotation of a plain copy exactly (12 and 16 qubits)", () => {
    for (const n of [12, 16]) {
      const rand = mulberry32(n);
      const state = randomState(n, rand);
      const before = state.re.slice();
      const bases = Array.from({ length: n }, () => "IXYZ"[Math.floor(rand() * 4)]).join("");
      const ref = { n, re: state.re.slice(), im: state.im.slice() };
      for (let q = 0; q < n; q++) {
        const m = bases[q] === "X" ? HADAMARD : bases[q] === "Y" ? H_SDG : null;
        if (m) applyMatrix(ref, [q], m);
      }
      const got = rotateStateCopy(state, bases);
      expect(Array.from(got.re)).toEqual(Array.from(ref.re));
      expect(Array.from(got.im)).toEqual(Array.from(ref.im));
      expect(Array.from(state.re)).toEqual(Array.from(before));
    }
  });

  it("Bell state measured in XX: outcomes 00 and 11 only, each ½ (textbook, N&C §1.3.6)", () => {
    const r = rotateStateCopy(bellState(), "XX");
    const p = Array.from(r.re, (x, i) => x * x + r.im[i] * r.im[i]);
    expect(p[0]).toBeCloseTo(0.5, 14);
    expect(p[3]).toBeCloseTo(0.5, 14);
    expect(p[1] + p[2]).toBeCloseTo(0, 14);
  });
});

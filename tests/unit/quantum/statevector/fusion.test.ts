/**
 * Gate fusion keeps the circuit's product (checked against unfused application) and makes
 * the expected blocks on the layered ansatz. Property tests with fast-check (fixed seed).
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { applyDense } from "@/lib/quantum/statevector/dispatch";
import { fuseGates } from "@/lib/quantum/statevector/fusion";
import { classifyMatrix } from "@/lib/quantum/statevector/matrix-classify";
import { circuitGates } from "@/lib/quantum/statevector/simulate";
import type { GateApplication } from "@/lib/quantum/types";
import { layeredAnsatz } from "../../../bench/ansatz";
import { makeRng, randomGate } from "./support/random-gates";

function run(
  n: number,
  gates: GateApplication[],
  seed: number,
): { re: Float64Array; im: Float64Array } {
  const rng = makeRng(seed);
  const re = new Float64Array(2 ** n).map(() => rng.float() - 0.5);
  const im = new Float64Array(2 ** n).map(() => rng.float() - 0.5);
  for (const g of gates) applyDense(re, im, g.qubits, g.matrix);
  return { re, im };
}

describe("fusion", () => {
  it("fused blocks reproduce the unfused product (fast-check, seed 4242, 300 gate lists)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 2 ** 30 }), (seed) => {
        const rng = makeRng(seed);
        const n = rng.int(1, 6);
        // few qubits + many gates: lots of pending products, merges into earlier blocks, 3q barriers
        const gates = Array.from({ length: rng.int(1, 25) }, () =>
          randomGate(rng, n, rng.float() < 0.1 ? 3 : 2),
        );
        const fused = fuseGates(gates);
        expect(fused.every((g) => g.qubits.length <= 3)).toBe(true);
        const a = run(n, gates, seed);
        const b = run(n, fused, seed);
        for (let i = 0; i < a.re.length; i++) {
          expect(Math.abs(a.re[i] - b.re[i])).toBeLessThan(1e-11);
          expect(Math.abs(a.im[i] - b.im[i])).toBeLessThan(1e-11);
        }
      }),
      { seed: 4242, numRuns: 300 },
    );
  });

  it("fuses the ry/rz + cx-ladder ansatz into one pass per cx (cx absorbs its target's rotations)", () => {
    const n = 6;
    const layers = 3;
    const fused = circuitGates(layeredAnsatz(n, layers));
    // per layer: cx(0,1) absorbs both rotations (dense 2q), cx(q,q+1) absorbs qubit q+1's → two-block
    expect(fused.length).toBe(layers * (n - 1));
    const twoBlock = fused.filter(
      (g) => g.qubits.length === 2 && classifyMatrix(g.matrix, 4).blockOperand >= 0,
    );
    expect(twoBlock.length).toBe(layers * (n - 2));
  });

  it("keeps gates of 3+ qubits as they are and never fuses across them", () => {
    const rng = makeRng(5);
    const g1 = randomGate(rng, 3, 1);
    const ccx: GateApplication = { name: "ccx", qubits: [0, 1, 2], matrix: new Float64Array(128) };
    for (let i = 0; i < 6; i++) ccx.matrix[2 * (9 * i)] = 1;
    ccx.matrix[2 * (6 * 8 + 7)] = 1;
    ccx.matrix[2 * (7 * 8 + 6)] = 1;
    const h: GateApplication = {
      name: "h",
      qubits: [g1.qubits[0]],
      matrix: Float64Array.of(Math.SQRT1_2, 0, Math.SQRT1_2, 0, Math.SQRT1_2, 0, -Math.SQRT1_2, 0),
    };
    const out = fuseGates([g1, ccx, h]);
    expect(out.map((g) => g.name)).toEqual([g1.name, "ccx", "h"]);
  });
});

/**
 * Statevector simulation vs an independent dense reference (mathjs complex matrices, kron,
 * multiply — support/dense-reference.ts explains the textbook tensor order and the
 * bit-reversed index mapping). 240 seeded random circuits of 1–6 qubits with random 1-, 2-
 * and 3-qubit gates (random unitaries and structured ones) on random qubit orders.
 */
import { describe, expect, it } from "vitest";
import type { Matrix } from "mathjs";
import { simulateStatevector } from "@/lib/quantum/statevector/simulate";
import { applyMatrix } from "@/lib/quantum/statevector/kernels";
import { createZeroState, normSquared } from "@/lib/quantum/statevector/state";
import { fullOperator, math, stateDistance, zeroColumn } from "./support/dense-reference";
import { makeRng, randomCircuit, randomGate } from "./support/random-gates";
import type { Circuit } from "@/lib/quantum/types";

const TOL = 1e-10;

/** Reference |ψ⟩: for n ≤ 4 the full 2^n unitary U = F_L⋯F_1 is formed, then U|0⟩; above, F_j are applied in turn. */
function referenceState(circuit: Circuit): Matrix {
  const n = circuit.numQubits;
  const fulls: Matrix[] = [];
  for (const op of circuit.ops)
    if (op.kind === "gate")
      for (const p of op.parts) fulls.push(fullOperator(p.matrix, p.qubits, n));
  if (n <= 4) {
    let u = math.identity(1 << n) as Matrix;
    for (const f of fulls) u = math.multiply(f, u) as Matrix;
    return math.multiply(u, zeroColumn(n)) as Matrix;
  }
  let psi = zeroColumn(n);
  for (const f of fulls) psi = math.multiply(f, psi) as Matrix;
  return psi;
}

describe("statevector vs mathjs dense reference (independent library)", () => {
  // 40 circuits per register size n = 1…6 (240 in all), each simulated fused and unfused.
  for (let n = 1; n <= 6; n++) {
    it(`matches on 40 seeded random circuits of ${n} qubit(s) to 1e-10, fused and unfused`, () => {
      for (let i = 0; i < 40; i++) {
        const seed = 7000 + 100 * n + i;
        const rng = makeRng(seed);
        const circuit = randomCircuit(rng, n, rng.int(1, n <= 4 ? 8 : 5));
        const ref = referenceState(circuit);
        const fused = simulateStatevector(circuit);
        const plain = simulateStatevector(circuit, { fuse: false });
        expect({ seed, fused: stateDistance(fused.re, fused.im, ref, n) < TOL }).toEqual({
          seed,
          fused: true,
        });
        expect({ seed, plain: stateDistance(plain.re, plain.im, ref, n) < TOL }).toEqual({
          seed,
          plain: true,
        });
        expect(Math.abs(normSquared(fused) - 1)).toBeLessThan(1e-12);
      }
    }, 60_000);
  }

  it("applyMatrix on single random gates matches the embedded operator (60 cases)", () => {
    for (let i = 0; i < 60; i++) {
      const rng = makeRng(9100 + i);
      const n = 1 + (i % 5);
      const state = createZeroState(n);
      // start from a random state made of two random gates
      let ref = zeroColumn(n);
      for (let g = 0; g < 3; g++) {
        const gate = randomGate(rng, n);
        applyMatrix(state, gate.qubits, gate.matrix);
        ref = math.multiply(fullOperator(gate.matrix, gate.qubits, n), ref) as Matrix;
      }
      expect(stateDistance(state.re, state.im, ref, n)).toBeLessThan(TOL);
    }
  }, 60_000);
});

/**
 * The one-pass noisy gate (unitary + depolarizing + damping per qubit) against the separate
 * kernels it fuses — ρ → UρU† (kernels.ts), depolarize and dampQubit (noise/channels.ts, each
 * checked against Nielsen & Chuang ch. 8 in channels.test.ts) — on random mixed states.
 */
import { describe, expect, it } from "vitest";
import { applyUnitaryDM } from "@/lib/quantum/density-matrix/kernels";
import { applyNoisyGate } from "@/lib/quantum/density-matrix/noisy-gate";
import { dampQubit, depolarize } from "@/lib/quantum/noise/channels";
import type { DensityMatrix } from "@/lib/quantum/types";
import { mulberry32, randomDensity } from "../observable/random-states";
import { makeRng, randomUnitary } from "../statevector/support/random-gates";

const CX = Float64Array.of(
  1,
  0,
  0,
  0,
  0,
  0,
  0,
  0,
  0,
  0,
  1,
  0,
  0,
  0,
  0,
  0,
  0,
  0,
  0,
  0,
  0,
  0,
  1,
  0,
  0,
  0,
  0,
  0,
  1,
  0,
  0,
  0,
);
// S = diag(1, i) times X: a permutation with a phase
const RY = Float64Array.of(
  Math.cos(0.35),
  0,
  -Math.sin(0.35),
  0,
  Math.sin(0.35),
  0,
  Math.cos(0.35),
  0,
);
const XS = Float64Array.of(0, 0, 0, 1, 1, 0, 0, 0);

const clone = (r: DensityMatrix): DensityMatrix => ({ n: r.n, re: r.re.slice(), im: r.im.slice() });

function separate(
  rho: DensityMatrix,
  qubits: number[],
  u: Float64Array | null,
  p: number,
  gamma: number[],
  lambda: number[],
): void {
  if (u) applyUnitaryDM(rho, qubits, u);
  depolarize(rho, qubits, p);
  qubits.forEach((q, j) => dampQubit(rho, q, gamma[j], lambda[j]));
}

describe("applyNoisyGate = unitary, then depolarizing, then damping, in one pass", () => {
  it("1- and 2-qubit gates (dense, permutation, none) on every position of a 4-qubit ρ, per-qubit rates, to 1e-13", () => {
    const rand = mulberry32(31);
    const rng = makeRng(32);
    const n = 4;
    const cases: { qubits: number[]; u: Float64Array | null }[] = [];
    for (let q = 0; q < n; q++)
      cases.push(
        { qubits: [q], u: randomUnitary(rng, 2) },
        { qubits: [q], u: RY },
        { qubits: [q], u: XS },
        { qubits: [q], u: null },
      );
    for (const pair of [
      [0, 1],
      [1, 0],
      [3, 0],
      [2, 3],
      [1, 3],
    ])
      cases.push(
        { qubits: pair, u: randomUnitary(rng, 4) },
        { qubits: pair, u: CX },
        { qubits: pair, u: null },
      );
    for (const { qubits, u } of cases) {
      const p = rand() * 0.3;
      const gamma = qubits.map(() => rand() * 0.4);
      const lambda = qubits.map(() => rand() * 0.4);
      const rho = randomDensity(n, rand);
      const want = clone(rho);
      separate(want, qubits, u, p, gamma, lambda);
      applyNoisyGate(rho, qubits, u, { p, gamma, lambda });
      for (let i = 0; i < rho.re.length; i++) {
        expect(rho.re[i]).toBeCloseTo(want.re[i], 13);
        expect(rho.im[i]).toBeCloseTo(want.im[i], 13);
      }
    }
  });

  it("refuses gates on 0 or 3 qubits (a programming error, not user input)", () => {
    const rho = randomDensity(3, mulberry32(1));
    expect(() => applyNoisyGate(rho, [0, 1, 2], null, { p: 0, gamma: [], lambda: [] })).toThrow(
      RangeError,
    );
  });
});

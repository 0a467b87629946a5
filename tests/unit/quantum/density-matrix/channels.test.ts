/**
 * Noise channels against textbook formulas (Nielsen & Chuang ch. 8, values from memory),
 * Bloch convention ρ = (I + xX + yY + zZ)/2, so x = 2 Re ρ01, y = −2 Im ρ01, z = ρ00 − ρ11.
 * Plus a property test: trace 1, Hermitian, positive semidefinite (eigenvalues through the
 * real-symmetric embedding [[A, −B], [B, A]] of H = A + iB with ml-matrix — common practice).
 */
import fc from "fast-check";
import { EigenvalueDecomposition, Matrix } from "ml-matrix";
import { describe, expect, it } from "vitest";
import {
  amplitudeDamp,
  depolarize,
  measureNonSelective,
  phaseDamp,
  resetQubit,
} from "@/lib/quantum/noise/channels";
import { simulateDensityMatrix } from "@/lib/quantum/density-matrix/simulate";
import { densityFromState, trace } from "@/lib/quantum/density-matrix/state";
import { applyToAmplitudes } from "@/lib/quantum/statevector/dispatch";
import { createZeroState } from "@/lib/quantum/statevector/state";
import type { DensityMatrix } from "@/lib/quantum/types";
import {
  makeRng,
  randomCircuit,
  randomUnitary,
  type Rng,
} from "../statevector/support/random-gates";

type Bloch = [number, number, number];

/** Reduced Bloch vector of qubit q of an n-qubit ρ (partial trace over the others). */
function bloch(rho: DensityMatrix, q: number): Bloch {
  const d = 2 ** rho.n;
  let r00 = 0,
    r11 = 0,
    re01 = 0,
    im01 = 0;
  for (let i = 0; i < d; i++) {
    if ((i >> q) & 1) continue;
    const j = i | (1 << q);
    r00 += rho.re[i * d + i];
    r11 += rho.re[j * d + j];
    re01 += rho.re[i * d + j];
    im01 += rho.im[i * d + j];
  }
  return [2 * re01, -2 * im01, r00 - r11];
}

/** A random product of single-qubit random states on n qubits, as a density matrix. */
function randomProductState(rng: Rng, n: number): DensityMatrix {
  const psi = createZeroState(n);
  for (let q = 0; q < n; q++) applyToAmplitudes(psi.re, psi.im, [q], randomUnitary(rng, 2));
  return densityFromState(psi);
}

function expectBloch(actual: Bloch, expected: Bloch): void {
  for (let i = 0; i < 3; i++) expect(actual[i]).toBeCloseTo(expected[i], 12);
}

describe("single-qubit channels on the Bloch vector (N&C ch. 8)", () => {
  const cases = [0, 1, 2, 3, 4].map((seed) => ({
    seed,
    n: 1 + (seed % 3),
    q: seed % (1 + (seed % 3)),
  }));

  it.each(cases)(
    "depolarizing shrinks the Bloch vector by (1 − p) (§8.3.4), seed $seed",
    ({ seed, n, q }) => {
      const rng = makeRng(seed);
      const rho = randomProductState(rng, n);
      const before = bloch(rho, q);
      const others = Array.from({ length: n }, (_, k) => k)
        .filter((k) => k !== q)
        .map((k) => bloch(rho, k));
      const p = rng.float();
      depolarize(rho, [q], p);
      expectBloch(bloch(rho, q), [before[0] * (1 - p), before[1] * (1 - p), before[2] * (1 - p)]);
      Array.from({ length: n }, (_, k) => k)
        .filter((k) => k !== q)
        .forEach((k, j) => expectBloch(bloch(rho, k), others[j]));
    },
  );

  it.each(cases)(
    "amplitude damping maps (x,y,z) → (√(1−γ)x, √(1−γ)y, γ+(1−γ)z) (§8.3.5), seed $seed",
    ({ seed, n, q }) => {
      const rng = makeRng(100 + seed);
      const rho = randomProductState(rng, n);
      const [x, y, z] = bloch(rho, q);
      const g = rng.float();
      amplitudeDamp(rho, q, g);
      expectBloch(bloch(rho, q), [Math.sqrt(1 - g) * x, Math.sqrt(1 - g) * y, g + (1 - g) * z]);
    },
  );

  it.each(cases)(
    "phase damping shrinks x, y by √(1−λ) and keeps z (§8.3.6), seed $seed",
    ({ seed, n, q }) => {
      const rng = makeRng(200 + seed);
      const rho = randomProductState(rng, n);
      const [x, y, z] = bloch(rho, q);
      const l = rng.float();
      phaseDamp(rho, q, l);
      expectBloch(bloch(rho, q), [Math.sqrt(1 - l) * x, Math.sqrt(1 - l) * y, z]);
    },
  );

  it("non-selective Z measurement removes x, y; reset sends the qubit to |0⟩ (z = 1)", () => {
    const rng = makeRng(9);
    const rho = randomProductState(rng, 2);
    const [, , z] = bloch(rho, 1);
    measureNonSelective(rho, 1);
    expectBloch(bloch(rho, 1), [0, 0, z]);
    resetQubit(rho, 1);
    expectBloch(bloch(rho, 1), [0, 0, 1]);
    expect(trace(rho)).toBeCloseTo(1, 14);
  });

  it("two-qubit depolarizing of the whole register gives (1−p)ρ + p·I/4 (N&C eq. 8.100 form)", () => {
    const rng = makeRng(11);
    const rho = randomProductState(rng, 2);
    const copy = { n: 2, re: rho.re.slice(), im: rho.im.slice() };
    const p = 0.37;
    depolarize(rho, [1, 0], p);
    for (let r = 0; r < 4; r++)
      for (let c = 0; c < 4; c++) {
        expect(rho.re[4 * r + c]).toBeCloseTo(
          (1 - p) * copy.re[4 * r + c] + (r === c ? p / 4 : 0),
          14,
        );
        expect(rho.im[4 * r + c]).toBeCloseTo((1 - p) * copy.im[4 * r + c], 14);
      }
  });
});

function minEigenvalue(rho: DensityMatrix): number {
  const d = 2 ** rho.n;
  const e = new Matrix(2 * d, 2 * d);
  for (let r = 0; r < d; r++)
    for (let c = 0; c < d; c++) {
      const a = rho.re[r * d + c],
        b = rho.im[r * d + c];
      e.set(r, c, a);
      e.set(r + d, c + d, a);
      e.set(r, c + d, -b);
      e.set(r + d, c, b);
    }
  return Math.min(...new EigenvalueDecomposition(e, { assumeSymmetric: true }).realEigenvalues);
}

describe("noisy evolution stays a density matrix (fast-check, seed 31337)", () => {
  it("trace 1, Hermitian, eigenvalues ≥ −1e-10 after random noisy circuits with measure/reset", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 2 ** 30 }),
        fc.record({
          depolarizing1q: fc.double({ min: 0, max: 1, noNaN: true }),
          depolarizing2q: fc.double({ min: 0, max: 1, noNaN: true }),
          amplitudeDamping: fc.double({ min: 0, max: 1, noNaN: true }),
          phaseDamping: fc.double({ min: 0, max: 1, noNaN: true }),
        }),
        (seed, noise) => {
          const rng = makeRng(seed);
          const n = rng.int(1, 4);
          const rho = simulateDensityMatrix(randomCircuit(rng, n, rng.int(1, 8), true), noise);
          const d = 2 ** n;
          expect(trace(rho)).toBeCloseTo(1, 12);
          for (let r = 0; r < d; r++)
            for (let c = 0; c < d; c++) {
              expect(Math.abs(rho.re[r * d + c] - rho.re[c * d + r])).toBeLessThan(1e-12);
              expect(Math.abs(rho.im[r * d + c] + rho.im[c * d + r])).toBeLessThan(1e-12);
            }
          expect(minEigenvalue(rho)).toBeGreaterThan(-1e-10);
        },
      ),
      { seed: 31337, numRuns: 120 },
    );
  }, 60_000);
});

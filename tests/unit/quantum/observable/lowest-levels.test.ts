/**
 * Lowest levels and ground-space weight (Lanczos with deflation; dense eigendecomposition for
 * matrices) against an independent dense reference: ml-matrix's symmetric eigensolver on the
 * real-symmetric embedding [[A, −B], [B, A]] of H = A + iB. The embedding doubles every
 * eigenvalue, and the embedding of a complex state is an isometry that carries P₀ to the
 * projector on the embedded ground space, so ⟨ψ|P₀|ψ⟩ = Σ_u (uᵀ[x; y])² over the embedded
 * ground eigenvectors u (textbook linear algebra).
 */
import { EigenvalueDecomposition, Matrix, SingularValueDecomposition } from "ml-matrix";
import { describe, expect, it } from "vitest";
import { densityFromState } from "@/lib/quantum/density-matrix";
import { hermitianEigen } from "@/lib/quantum/observable/hermitian-eigen";
import {
  groundWeightOnDensity,
  groundWeightOnState,
  levelsOfEigen,
  lowestLevels,
} from "@/lib/quantum/observable/lowest-levels";
import type { HermitianMatrix } from "@/lib/quantum/observable/matrix-observable";
import { parsePauliSum } from "@/lib/quantum/observable/pauli-parse";
import { PauliOperator } from "@/lib/quantum/observable/pauli-operator";
import { padPauliSum } from "@/lib/quantum/observable/pauli-word";
import type { PauliSum, StateVector } from "@/lib/quantum/types";
import { mulberry32, randomPauliText, randomState } from "./random-states";

interface DenseRef {
  lowest: number[];
  degeneracy: number;
  weight: (s: StateVector) => number;
}

/** Dense reference from the complex matrix (row-major re/im, state order). */
function denseReference(re: Float64Array, im: Float64Array, d: number, levelTol: number): DenseRef {
  const m = new Matrix(2 * d, 2 * d);
  for (let i = 0; i < d; i++) {
    for (let j = 0; j < d; j++) {
      m.set(i, j, re[i * d + j]);
      m.set(i + d, j + d, re[i * d + j]);
      m.set(i + d, j, im[i * d + j]);
      m.set(i, j + d, -im[i * d + j]);
    }
  }
  const evd = new EigenvalueDecomposition(m, { assumeSymmetric: true });
  const vals = evd.realEigenvalues;
  const order = vals.map((_, i) => i).sort((a, b) => vals[a] - vals[b]);
  const lowest = order.filter((_, k) => k % 2 === 0).map((i) => vals[i]);
  const groundCols = order.filter((i) => vals[i] <= vals[order[0]] + levelTol);
  const vecs = evd.eigenvectorMatrix;
  return {
    lowest: lowest.slice(0, 4),
    degeneracy: groundCols.length / 2,
    weight: (s) =>
      groundCols.reduce((acc, col) => {
        let dot = 0;
        for (let i = 0; i < d; i++)
          dot += vecs.get(i, col) * s.re[i] + vecs.get(i + d, col) * s.im[i];
        return acc + dot * dot;
      }, 0),
  };
}

function pauliDense(sum: PauliSum): { re: Float64Array; im: Float64Array; d: number } {
  const op = new PauliOperator(sum, 0);
  const d = op.dim;
  const re = new Float64Array(d * d);
  const im = new Float64Array(d * d);
  const er = new Float64Array(d);
  const ei = new Float64Array(d);
  const or = new Float64Array(d);
  const oi = new Float64Array(d);
  for (let j = 0; j < d; j++) {
    er.fill(0);
    er[j] = 1;
    op.apply(er, ei, or, oi);
    for (let i = 0; i < d; i++) {
      re[i * d + j] = or[i];
      im[i * d + j] = oi[i];
    }
  }
  return { re, im, d };
}

const pauli = (text: string, n: number) => padPauliSum(parsePauliSum(text), n);

async function checkPauli(
  sum: PauliSum,
  states: StateVector[],
  opts: Parameters<typeof lowestLevels>[1] = {},
) {
  const levels = await lowestLevels(sum, opts);
  const { re, im, d } = pauliDense(sum);
  const ref = denseReference(re, im, d, levels.levelTol);
  expect(levels.converged).toBe(true);
  expect(levels.lowest.length).toBe(Math.min(4, d));
  levels.lowest.forEach((v, k) => expect(Math.abs(v - ref.lowest[k])).toBeLessThan(1e-9));
  expect(levels.ground).not.toBeNull();
  expect(levels.ground!.length).toBe(ref.degeneracy);
  for (const s of states) {
    expect(Math.abs(groundWeightOnState(levels.ground!, s) - ref.weight(s))).toBeLessThan(1e-9);
  }
  return levels;
}

describe("lowest levels of Pauli sums (Lanczos with deflation) vs dense ml-matrix", () => {
  it(
    "random Pauli sums, n = 1…6: 4 lowest eigenvalues and ground weight to 1e-9",
    { timeout: 30_000 },
    async () => {
      const rand = mulberry32(2024);
      for (let trial = 0; trial < 12; trial++) {
        const n = 1 + (trial % 6);
        const sum = pauli(randomPauliText(n, 2 + Math.floor(rand() * 12), rand), n);
        await checkPauli(sum, [randomState(n, rand), randomState(n, rand)]);
      }
    },
  );

  it(
    "restarts (basis capped at 12 vectors) reach the same levels and weights",
    { timeout: 30_000 },
    async () => {
      const rand = mulberry32(31);
      const sum = pauli(randomPauliText(6, 14, rand), 6);
      await checkPauli(sum, [randomState(6, rand)], { maxBasis: 12, maxRestarts: 400 });
    },
  );

  it("two-qubit Heisenberg X0X1 + Y0Y1 + Z0Z1: singlet −3, 3-fold triplet +1 (textbook, value from memory)", async () => {
    const rand = mulberry32(5);
    const levels = await checkPauli(pauli("X0 X1 + Y0 Y1 + Z0 Z1", 2), [randomState(2, rand)]);
    expect(levels.lowest.map((v) => Math.round(v * 1e9) / 1e9)).toEqual([-3, 1, 1, 1]);
    expect(levels.ground!.length).toBe(1);
    // |01⟩ = (singlet + triplet₀)/√2 → weight ½ (index 1 = qubit 0 set).
    const s: StateVector = { n: 2, re: new Float64Array([0, 1, 0, 0]), im: new Float64Array(4) };
    expect(groundWeightOnState(levels.ground!, s)).toBeCloseTo(0.5, 12);
  });

  it("−Z0Z1 has a 2-fold ground level: weight counts the whole ground space", async () => {
    const rand = mulberry32(6);
    const levels = await checkPauli(pauli("-Z0 Z1", 3), [
      randomState(3, rand),
      randomState(3, rand),
    ]);
    expect(levels.ground!.length).toBe(4); // ±1 on |00⟩, |11⟩ times the free qubit 2
    expect(levels.lowest.map((v) => Math.round(v * 1e9) / 1e9)).toEqual([-1, -1, -1, -1]);
    const zero: StateVector = { n: 3, re: new Float64Array(8), im: new Float64Array(8) };
    zero.re[0] = 1;
    expect(groundWeightOnState(levels.ground!, zero)).toBeCloseTo(1, 12);
    const two = pauli("-Z0 Z1", 2);
    const l2 = await lowestLevels(two);
    expect(l2.lowest.map((v) => Math.round(v * 1e9) / 1e9)).toEqual([-1, -1, 1, 1]);
    expect(l2.ground!.length).toBe(2);
  });

  it("density matrices: Tr(P₀ρ) of a two-state mixture equals the weighted pure weights", async () => {
    const rand = mulberry32(8);
    const sum = pauli(randomPauliText(4, 10, rand), 4);
    const levels = await lowestLevels(sum);
    const a = randomState(4, rand);
    const b = randomState(4, rand);
    const ra = densityFromState(a);
    const rb = densityFromState(b);
    const rho = {
      n: 4,
      re: ra.re.map((v, i) => 0.3 * v + 0.7 * rb.re[i]),
      im: ra.im.map((v, i) => 0.3 * v + 0.7 * rb.im[i]),
    };
    const { re, im, d } = pauliDense(sum);
    const ref = denseReference(re, im, d, levels.levelTol);
    expect(
      Math.abs(
        groundWeightOnDensity(levels.ground!, rho) - (0.3 * ref.weight(a) + 0.7 * ref.weight(b)),
      ),
    ).toBeLessThan(1e-9);
  });

  it("periodic Heisenberg ring of 4 sites, Σ XX + YY + ZZ: ground energy −8, non-degenerate (value from memory)", async () => {
    const bonds = [0, 1, 2, 3].map(
      (i) => `X${i} X${(i + 1) % 4} + Y${i} Y${(i + 1) % 4} + Z${i} Z${(i + 1) % 4}`,
    );
    const levels = await lowestLevels(pauli(bonds.join(" + "), 4));
    expect(levels.lowest[0]).toBeCloseTo(-8, 9);
    expect(levels.ground!.length).toBe(1);
  });

  it("open transverse-field Ising chain: free-fermion spectrum (Pfeuty, Ann. Phys. 57, 79 (1970))", async () => {
    // H = −J Σ Z_i Z_{i+1} − h Σ X_i, open ends: single-fermion energies ε_k are the singular
    // values of the n×n bidiagonal matrix (diagonal h, super-diagonal J); E = −Σε_k + 2Σ_{k∈S} ε_k.
    const n = 6;
    const [J, h] = [1, 0.7];
    const zz = Array.from({ length: n - 1 }, (_, i) => `- ${J} Z${i} Z${i + 1}`).join(" ");
    const x = Array.from({ length: n }, (_, i) => `- ${h} X${i}`).join(" ");
    const levels = await lowestLevels(pauli(`${zz} ${x}`.replace(/^- /, "-"), n));
    const b = new Matrix(n, n);
    for (let i = 0; i < n; i++) {
      b.set(i, i, h);
      if (i + 1 < n) b.set(i, i + 1, J);
    }
    const eps = new SingularValueDecomposition(b).diagonal;
    const e0 = -eps.reduce((s, v) => s + v, 0);
    const all: number[] = [];
    for (let mask = 0; mask < 2 ** n; mask++) {
      all.push(e0 + 2 * eps.reduce((s, v, k) => s + ((mask >> k) & 1 ? v : 0), 0));
    }
    all.sort((p, q) => p - q);
    levels.lowest.forEach((v, k) => expect(Math.abs(v - all[k])).toBeLessThan(1e-9));
  });
});

describe("lowest levels of matrix observables (dense eigendecomposition) vs ml-matrix embedding", () => {
  function randomHermitian(n: number, rand: () => number, degenerate: boolean): HermitianMatrix {
    const d = 2 ** n;
    const re = new Float64Array(d * d);
    const im = new Float64Array(d * d);
    if (degenerate) {
      // diag(−1, −1, 0.5, 2, …) in a random-looking unitary frame is hard to build by hand;
      // a diagonal with a 2-fold lowest level and complex off-diagonal coupling among the rest.
      for (let i = 0; i < d; i++) re[i * d + i] = i < 2 ? -1 : i;
      for (let i = 2; i + 1 < d; i++) {
        const [a, b] = [rand() - 0.5, rand() - 0.5];
        re[i * d + i + 1] = a;
        im[i * d + i + 1] = b;
        re[(i + 1) * d + i] = a;
        im[(i + 1) * d + i] = -b;
      }
      return { n, dim: d, re, im };
    }
    for (let i = 0; i < d; i++) {
      re[i * d + i] = rand() - 0.5;
      for (let j = i + 1; j < d; j++) {
        const [a, b] = [rand() - 0.5, rand() - 0.5];
        re[i * d + j] = a;
        im[i * d + j] = b;
        re[j * d + i] = a;
        im[j * d + i] = -b;
      }
    }
    return { n, dim: d, re, im };
  }

  it("random complex Hermitian matrices (n = 1…4) and a 2-fold ground level: lowest and weight to 1e-9", () => {
    const rand = mulberry32(77);
    for (let trial = 0; trial < 10; trial++) {
      const n = 1 + (trial % 4);
      const h = randomHermitian(n, rand, trial >= 8 && n > 1);
      const levels = levelsOfEigen(hermitianEigen(h));
      const ref = denseReference(h.re, h.im, h.dim, levels.levelTol);
      levels.lowest.forEach((v, k) => expect(Math.abs(v - ref.lowest[k])).toBeLessThan(1e-9));
      expect(levels.ground!.length).toBe(ref.degeneracy);
      if (trial >= 8 && n > 1) expect(ref.degeneracy).toBe(2);
      const s = randomState(n, rand);
      expect(Math.abs(groundWeightOnState(levels.ground!, s) - ref.weight(s))).toBeLessThan(1e-9);
    }
  });
});

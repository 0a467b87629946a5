/** Lanczos extreme eigenvalues vs dense ml-matrix eigenvalues (random Pauli sums, n ≤ 8). */
import { EigenvalueDecomposition, Matrix } from "ml-matrix";
import { describe, expect, it } from "vitest";
import { lanczosExtremes } from "@/lib/quantum/observable/lanczos";
import { parsePauliSum } from "@/lib/quantum/observable/pauli-parse";
import { padPauliSum } from "@/lib/quantum/observable/pauli-word";
import { PauliOperator } from "@/lib/quantum/observable/pauli-operator";
import type { PauliSum } from "@/lib/quantum/types";
import { mulberry32, randomPauliText } from "./random-states";

/** Dense real-symmetric embedding [[A, −B], [B, A]] built column by column with the operator. */
function denseExtremes(sum: PauliSum): { min: number; max: number } {
  const op = new PauliOperator(sum, 0);
  const d = op.dim;
  const m = new Matrix(2 * d, 2 * d);
  const er = new Float64Array(d);
  const ei = new Float64Array(d);
  const or = new Float64Array(d);
  const oi = new Float64Array(d);
  for (let j = 0; j < d; j++) {
    er.fill(0);
    er[j] = 1;
    op.apply(er, ei, or, oi);
    for (let i = 0; i < d; i++) {
      m.set(i, j, or[i]);
      m.set(i + d, j + d, or[i]);
      m.set(i + d, j, oi[i]);
      m.set(i, j + d, -oi[i]);
    }
  }
  const vals = new EigenvalueDecomposition(m, { assumeSymmetric: true }).realEigenvalues;
  return { min: Math.min(...vals), max: Math.max(...vals) };
}

describe("lanczosExtremes", () => {
  it(
    "matches dense ml-matrix eigenvalues for random Pauli sums, n = 1…8, to 1e-9",
    { timeout: 30_000 },
    async () => {
      const rand = mulberry32(42);
      for (let trial = 0; trial < 15; trial++) {
        const n = trial === 14 ? 8 : 1 + (trial % 7);
        const sum = padPauliSum(
          parsePauliSum(randomPauliText(n, 2 + Math.floor(rand() * 20), rand)),
          n,
        );
        const ref = denseExtremes(sum);
        const r = await lanczosExtremes(sum);
        expect(r.converged).toBe(true);
        expect(Math.abs(r.min - ref.min)).toBeLessThan(1e-9);
        expect(Math.abs(r.max - ref.max)).toBeLessThan(1e-9);
      }
    },
  );

  it("transverse-field Ising chain, 7 qubits, vs dense", async () => {
    const n = 7;
    const zz = Array.from({ length: n - 1 }, (_, i) => `- Z${i} Z${i + 1}`).join(" ");
    const x = Array.from({ length: n }, (_, i) => `- 0.7 X${i}`).join(" ");
    const sum = padPauliSum(parsePauliSum(`${zz} ${x}`.replace(/^- /, "-")), n);
    const ref = denseExtremes(sum);
    const r = await lanczosExtremes(sum);
    expect(r.min).toBeCloseTo(ref.min, 9);
    expect(r.max).toBeCloseTo(ref.max, 9);
  });

  it("identity and zero operators", async () => {
    const id = await lanczosExtremes(padPauliSum(parsePauliSum("2.5"), 3));
    expect(id.min).toBeCloseTo(2.5, 12);
    expect(id.max).toBeCloseTo(2.5, 12);
    const zero = await lanczosExtremes(padPauliSum(parsePauliSum("Z0 - Z0"), 2));
    expect(zero.min).toBeCloseTo(0, 12);
    expect(zero.max).toBeCloseTo(0, 12);
  });

  it("restarts converge when the basis cap is small", async () => {
    const rand = mulberry32(9);
    const sum = padPauliSum(parsePauliSum(randomPauliText(7, 25, rand)), 7);
    const ref = denseExtremes(sum);
    const r = await lanczosExtremes(sum, { maxBasis: 12, maxRestarts: 200 });
    expect(r.converged).toBe(true);
    expect(r.min).toBeCloseTo(ref.min, 8);
    expect(r.max).toBeCloseTo(ref.max, 8);
  });
});

describe("PauliOperator (matrix-free H·v, one pass per flip mask)", () => {
  it("stored-table, blocked and term-by-term paths agree with the definition H v = Σ c_t P_t v (n = 9)", () => {
    const rand = mulberry32(909);
    const n = 9;
    // many terms share few flip masks: dense words over I/Z with a fixed X/Y pattern
    const words: string[] = [];
    for (const xPattern of ["XIIIIIIIX", "IIIIIIIII", "IYXIIIIII"]) {
      for (let t = 0; t < 6; t++) {
        const w = [...xPattern]
          .map((c) =>
            c === "I" ? (rand() < 0.5 ? "I" : "Z") : rand() < 0.5 ? c : c === "X" ? "Y" : "X",
          )
          .join("");
        words.push(`${(rand() * 2 - 1).toFixed(5)} ${w}`);
      }
    }
    const sum = padPauliSum(parsePauliSum(words.join(" + ").replace(/\+ -/g, "- ")), n);
    const d = 2 ** n;
    const vRe = Float64Array.from({ length: d }, () => rand() - 0.5);
    const vIm = Float64Array.from({ length: d }, () => rand() - 0.5);
    // definition: P|b⟩ = i^k (−1)^{|b∧z|} |b⊕x⟩, k = number of Y factors
    const refRe = new Float64Array(d);
    const refIm = new Float64Array(d);
    for (const t of sum.terms) {
      let k = 0;
      for (let v = t.xMask & t.zMask; v; v >>>= 1) k += v & 1;
      const [pr, pi] = [
        [1, 0],
        [0, 1],
        [-1, 0],
        [0, -1],
      ][k % 4];
      for (let b = 0; b < d; b++) {
        let par = 0;
        for (let v = b & t.zMask; v; v >>>= 1) par ^= v & 1;
        const w = (par ? -1 : 1) * t.coefficient;
        refRe[b ^ t.xMask] += w * (pr * vRe[b] - pi * vIm[b]);
        refIm[b ^ t.xMask] += w * (pr * vIm[b] + pi * vRe[b]);
      }
    }
    for (const tableBytes of [undefined, 0]) {
      const op = new PauliOperator(sum, tableBytes);
      const oRe = new Float64Array(d);
      const oIm = new Float64Array(d);
      op.apply(vRe, vIm, oRe, oIm);
      for (let b = 0; b < d; b++) {
        expect(oRe[b]).toBeCloseTo(refRe[b], 12);
        expect(oIm[b]).toBeCloseTo(refIm[b], 12);
      }
    }
  });
});

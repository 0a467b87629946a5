/**
 * estimate() end to end against an independent mathjs dense computation: 220 random
 * circuits written as OpenQASM 2.0 on 1–6 qubits, random Pauli-sum and matrix
 * observables, both methods (noise 0: the density matrix must equal the statevector
 * result), agreement 1e-10.
 */
import * as math from "mathjs";
import { describe, expect, it } from "vitest";
import { estimate } from "@/lib/quantum";
import { complexToArrays, sumMatrix } from "../observable/dense-reference";
import { mulberry32, randomPauliText } from "../observable/random-states";
import {
  expectationOf,
  pauliExpectationOf,
  randomCircuit,
  referenceState,
  toQasm2,
  writtenOrder,
} from "./circuit-reference";

function randomHermitianInput(
  n: number,
  rand: () => number,
): { real: number[][]; imag: number[][] } {
  const d = 2 ** n;
  const real = Array.from({ length: d }, () => new Array<number>(d).fill(0));
  const imag = Array.from({ length: d }, () => new Array<number>(d).fill(0));
  for (let i = 0; i < d; i++) {
    real[i][i] = rand() * 2 - 1;
    for (let j = i + 1; j < d; j++) {
      real[i][j] = real[j][i] = rand() - 0.5;
      imag[i][j] = rand() - 0.5;
      imag[j][i] = -imag[i][j];
    }
  }
  return { real, imag };
}

describe("estimate() vs mathjs dense reference (220 random circuits)", () => {
  it(
    "exact values and per-term values agree to 1e-10; density matrix (noise 0) equals statevector",
    { timeout: 120_000 },
    async () => {
      const rand = mulberry32(20260101);
      let checked = 0;
      for (let trial = 0; trial < 220; trial++) {
        const n = 1 + (trial % 6);
        const gates = randomCircuit(n, 2 + Math.floor(rand() * (3 * n + 4)), rand);
        const source = toQasm2(n, gates);
        const psi = referenceState(n, gates);
        const useMatrix = trial % 5 === 4 && n <= 4;
        let observable:
          | { format: "pauli"; terms: string }
          | { format: "matrix"; real: number[][]; imag: number[][] };
        let expected: number;
        if (useMatrix) {
          const h = randomHermitianInput(n, rand);
          observable = { format: "matrix", ...h };
          // matrices are written with qubit 0 as the leftmost Kronecker factor
          expected = expectationOf(
            math.add(
              math.matrix(h.real),
              math.multiply(math.complex(0, 1), math.matrix(h.imag)),
            ) as math.Matrix,
            writtenOrder(psi, n),
          );
        } else {
          const text = randomPauliText(n, 1 + Math.floor(rand() * 6), rand);
          observable = { format: "pauli", terms: text };
          const parsedTerms = text.split(/ (?=[+-] )/).map((part) => {
            const m = part
              .replace(/^\+ /, "")
              .replace(/^- /, "-")
              .match(/^(-?[\d.]+) ([IXYZ]+)$/)!;
            return { coefficient: Number(m[1]), word: m[2] };
          });
          expected = parsedTerms.reduce(
            (acc, t) => acc + t.coefficient * pauliExpectationOf(t.word, n, psi),
            0,
          );
        }
        const sv = await estimate({ circuit: { format: "qasm2", source }, observable });
        const dm = await estimate({
          circuit: { format: "qasm2", source },
          observable,
          method: "density_matrix",
        });
        expect(Math.abs(sv.exact.value - expected)).toBeLessThan(1e-10);
        expect(Math.abs(sv.ideal.value - expected)).toBeLessThan(1e-10);
        expect(Math.abs(dm.exact.value - expected)).toBeLessThan(1e-10);
        expect(Math.abs(dm.ideal.value - sv.ideal.value)).toBeLessThan(1e-10);
        if (!useMatrix && trial % 3 === 0) {
          for (const t of sv.terms) {
            const single = pauliExpectationOf(t.pauli, n, psi);
            expect(Math.abs(t.exact - single)).toBeLessThan(1e-10);
          }
        }
        if (!useMatrix)
          dm.terms.forEach((t, i) =>
            expect(Math.abs(t.exact - sv.terms[i].exact)).toBeLessThan(1e-10),
          );
        checked++;
      }
      expect(checked).toBe(220);
    },
  );

  it("spectrum of a matrix observable equals mathjs eigenvalues; Pauli spectrum equals the dense extremes", async () => {
    const rand = mulberry32(5);
    const h = randomHermitianInput(2, rand);
    const source = toQasm2(2, [{ name: "h", qubits: [0], params: [] }]);
    const r = await estimate({
      circuit: { format: "qasm2", source },
      observable: { format: "matrix", ...h },
    });
    const ref = math.add(
      math.matrix(h.real),
      math.multiply(math.complex(0, 1), math.matrix(h.imag)),
    ) as math.Matrix;
    const vals = (math.eigs(ref).values as math.Matrix)
      .toArray()
      .map((z) => (typeof z === "number" ? z : (z as math.Complex).re)) as number[];
    expect(r.spectrum!.min).toBeCloseTo(Math.min(...vals), 9);
    expect(r.spectrum!.max).toBeCloseTo(Math.max(...vals), 9);
    const m = sumMatrix(
      [
        { coefficient: 0.7, word: "XY" },
        { coefficient: -0.4, word: "ZZ" },
        { coefficient: 0.2, word: "YI" },
      ],
      2,
    );
    const mv = (
      math.eigs(complexToArrays(m).imag.some((row) => row.some((x) => x !== 0)) ? m : m)
        .values as math.Matrix
    )
      .toArray()
      .map((z) => (typeof z === "number" ? z : (z as math.Complex).re)) as number[];
    const p = await estimate({
      circuit: { format: "qasm2", source },
      observable: { format: "pauli", terms: "0.7 XY - 0.4 ZZ + 0.2 YI" },
    });
    expect(p.spectrum!.min).toBeCloseTo(Math.min(...mv), 9);
    expect(p.spectrum!.max).toBeCloseTo(Math.max(...mv), 9);
  });
});

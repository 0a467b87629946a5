/**
 * Exact Pauli expectations on statevectors and density matrices, checked against
 * textbook values and an independent mathjs dense computation.
 */
import { describe, expect, it } from "vitest";
import { densityFromState } from "@/lib/quantum/density-matrix/state";
import { parsePauliSum } from "@/lib/quantum/observable/pauli-parse";
import { pauliExpectationsOnDensity, pauliExpectationsOnState, weightedTotal } from "@/lib/quantum/observable/pauli-expectation";
import { padPauliSum } from "@/lib/quantum/observable/pauli-word";
import { denseExpectation, denseTrace, sumMatrix } from "./dense-reference";
import { basisState, bellState, mulberry32, randomDensity, randomPauliText, randomState } from "./random-states";

const value = (text: string, n: number, s = bellState()) => {
  const sum = padPauliSum(parsePauliSum(text), n);
  return weightedTotal(sum, pauliExpectationsOnState(s, sum));
};

describe("Bell state (|00⟩+|11⟩)/√2 — Nielsen & Chuang §2.6 / §1.3.6", () => {
  it("⟨ZZ⟩ = ⟨XX⟩ = 1, ⟨YY⟩ = −1, single-qubit Paulis vanish (textbook values)", () => {
    expect(value("ZZ", 2)).toBeCloseTo(1, 14);
    expect(value("XX", 2)).toBeCloseTo(1, 14);
    expect(value("YY", 2)).toBeCloseTo(-1, 14);
    for (const w of ["Z0", "Z1", "X0", "Y1", "X0 Y1", "Z0 X1"]) expect(value(w, 2)).toBeCloseTo(0, 14);
  });

  it("CHSH operator √2(ZZ + XX) reaches Tsirelson's bound 2√2 (B. S. Cirel'son, Lett. Math. Phys. 4, 93 (1980))", () => {
    const c = Math.SQRT2;
    expect(value(`${c} ZZ + ${c} XX`, 2)).toBeCloseTo(2 * Math.SQRT2, 12);
  });

  it("density matrix of the Bell state gives the same values", () => {
    const rho = densityFromState(bellState());
    const sum = padPauliSum(parsePauliSum("ZZ + XX - YY + 0.3 Z0 + 0.1 X1 Y0"), 2);
    expect(weightedTotal(sum, pauliExpectationsOnDensity(rho, sum))).toBeCloseTo(3, 13);
  });
});

describe("qubit order is asymmetric (qubit 0 first)", () => {
  // X on qubit 0 only: |ψ⟩ = |1⟩_0 |0⟩_1, amplitude index bit 0 set → index 1.
  const flipped = basisState(2, 0b01);
  it("⟨Z0⟩ = −1 and ⟨Z1⟩ = +1 after X on qubit 0", () => {
    expect(value("Z0", 2, flipped)).toBe(-1);
    expect(value("Z1", 2, flipped)).toBe(1);
  });
  it('dense "ZI" acts on qubit 0, "IZ" on qubit 1', () => {
    expect(value("ZI", 2, flipped)).toBe(-1);
    expect(value("IZ", 2, flipped)).toBe(1);
  });
  it('density matrix agrees: "ZI" = −1, "IZ" = +1', () => {
    const rho = densityFromState(flipped);
    const sum = parsePauliSum("ZI + 10 IZ");
    const v = pauliExpectationsOnDensity(rho, sum);
    expect(Array.from(v)).toEqual([-1, 1]);
  });
});

describe("one qubit: ⟨Z⟩ = p(0) − p(1) (Born rule)", () => {
  it("holds for random states", () => {
    const rand = mulberry32(11);
    for (let k = 0; k < 20; k++) {
      const s = randomState(1, rand);
      const p0 = s.re[0] ** 2 + s.im[0] ** 2;
      const p1 = s.re[1] ** 2 + s.im[1] ** 2;
      expect(value("Z0", 1, s)).toBeCloseTo(p0 - p1, 14);
    }
  });
});

describe("random Pauli sums vs mathjs dense ⟨ψ|A|ψ⟩ and Tr(ρA)", () => {
  it("statevector, 1–6 qubits, agreement 1e-12", { timeout: 30_000 }, () => {
    const rand = mulberry32(2024);
    for (let trial = 0; trial < 60; trial++) {
      const n = 1 + (trial % 6);
      const sum = padPauliSum(parsePauliSum(randomPauliText(n, 1 + Math.floor(rand() * 12), rand)), n);
      const s = randomState(n, rand);
      const per = pauliExpectationsOnState(s, sum);
      const a = sumMatrix(sum.terms, n);
      expect(weightedTotal(sum, per)).toBeCloseTo(denseExpectation(a, s), 12);
      if (n <= 4) sum.terms.forEach((t, i) => expect(per[i]).toBeCloseTo(denseExpectation(sumMatrix([{ coefficient: 1, word: t.word }], n), s), 12));
    }
  });

  it("density matrix, 1–5 qubits (mixed states), agreement 1e-12", { timeout: 30_000 }, () => {
    const rand = mulberry32(77);
    for (let trial = 0; trial < 40; trial++) {
      const n = 1 + (trial % 5);
      const sum = padPauliSum(parsePauliSum(randomPauliText(n, 1 + Math.floor(rand() * 10), rand)), n);
      const rho = randomDensity(n, rand);
      const per = pauliExpectationsOnDensity(rho, sum);
      expect(weightedTotal(sum, per)).toBeCloseTo(denseTrace(sumMatrix(sum.terms, n), rho), 12);
    }
  });

  it("many diagonal terms (Walsh–Hadamard path) equal the one-pass path", () => {
    const rand = mulberry32(5);
    const n = 5;
    const s = randomState(n, rand);
    const text = Array.from({ length: 20 }, (_, i) => `${(i + 1) / 10} ${(i + 1).toString(2).padStart(n, "0").replace(/0/g, "I").replace(/1/g, "Z")}`).join(" + ");
    const sum = parsePauliSum(text);
    const all = pauliExpectationsOnState(s, sum);
    sum.terms.forEach((t, i) => {
      const single = pauliExpectationsOnState(s, { numQubits: n, terms: [t] });
      expect(all[i]).toBeCloseTo(single[0], 13);
    });
  });
});

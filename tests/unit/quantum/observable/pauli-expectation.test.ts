/**
 * Exact Pauli expectations on statevectors and density matrices, checked against
 * textbook values and an independent mathjs dense computation.
 */
import { describe, expect, it } from "vitest";
import { densityFromState } from "@/lib/quantum/density-matrix/state";
import { parsePauliSum } from "@/lib/quantum/observable/pauli-parse";
import {
  pauliExpectationsOnDensity,
  pauliExpectationsOnState,
  weightedTotal,
} from "@/lib/quantum/observable/pauli-expectation";
import { padPauliSum } from "@/lib/quantum/observable/pauli-word";
import { denseExpectation, denseTrace, sumMatrix } from "./dense-reference";
import {
  basisState,
  bellState,
  mulberry32,
  randomDensity,
  randomPauliText,
  randomState,
} from "./random-states";

const value = (text: string, n: number, s = bellState()) => {
  const sum = padPauliSum(parsePauliSum(text), n);
  return weightedTotal(sum, pauliExpectationsOnState(s, sum));
};

describe("Bell state (|00⟩+|11⟩)/√2 — Nielsen & Chuang §2.6 / §1.3.6", () => {
  it("⟨ZZ⟩ = ⟨XX⟩ = 1, ⟨YY⟩ = −1, single-qubit Paulis vanish (textbook values)", () => {
    expect(value("ZZ", 2)).toBeCloseTo(1, 14);
    expect(value("XX", 2)).toBeCloseTo(1, 14);
    expect(value("YY", 2)).toBeCloseTo(-1, 14);
    for (const w of ["Z0", "Z1", "X0", "Y1", "X0 Y1", "Z0 X1"])
      expect(value(w, 2)).toBeCloseTo(0, 14);
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
      const sum = padPauliSum(
        parsePauliSum(randomPauliText(n, 1 + Math.floor(rand() * 12), rand)),
        n,
      );
      const s = randomState(n, rand);
      const per = pauliExpectationsOnState(s, sum);
      const a = sumMatrix(sum.terms, n);
      expect(weightedTotal(sum, per)).toBeCloseTo(denseExpectation(a, s), 12);
      if (n <= 4)
        sum.terms.forEach((t, i) =>
          expect(per[i]).toBeCloseTo(
            denseExpectation(sumMatrix([{ coefficient: 1, word: t.word }], n), s),
            12,
          ),
        );
    }
  });

  it("density matrix, 1–5 qubits (mixed states), agreement 1e-12", { timeout: 30_000 }, () => {
    const rand = mulberry32(77);
    for (let trial = 0; trial < 40; trial++) {
      const n = 1 + (trial % 5);
      const sum = padPauliSum(
        parsePauliSum(randomPauliText(n, 1 + Math.floor(rand() * 10), rand)),
        n,
      );
      const rho = randomDensity(n, rand);
      const per = pauliExpectationsOnDensity(rho, sum);
      expect(weightedTotal(sum, per)).toBeCloseTo(denseTrace(sumMatrix(sum.terms, n), rho), 12);
    }
  });

  it("many diagonal terms (Walsh–Hadamard path) equal the one-pass path", () => {
    const rand = mulberry32(5);
    const n = 5;
    const s = randomState(n, rand);
    const text = Array.from(
      { length: 20 },
      (_, i) =>
        `${(i + 1) / 10} ${(i + 1).toString(2).padStart(n, "0").replace(/0/g, "I").replace(/1/g, "Z")}`,
    ).join(" + ");
    const sum = parsePauliSum(text);
    const all = pauliExpectationsOnState(s, sum);
    sum.terms.forEach((t, i) => {
      const single = pauliExpectationsOnState(s, { numQubits: n, terms: [t] });
      expect(all[i]).toBeCloseTo(single[0], 13);
    });
  });
});

describe("terms sharing a flip mask: one pass per mask (block split and transform paths)", () => {
  // A word whose X/Y positions are fixed by xBits and whose Z-parts vary: X where x=1,z=0;
  // Y where x=1,z=1; Z where x=0,z=1 (textbook Pauli labels).
  const word = (n: number, x: number, z: number): string =>
    Array.from({ length: n }, (_, q) =>
      (x >> q) & 1 ? ((z >> q) & 1 ? "Y" : "X") : (z >> q) & 1 ? "Z" : "I",
    ).join("");

  function sharedMaskSum(n: number, masks: number[], perMask: number, rand: () => number): string {
    const parts: string[] = [];
    const seen = new Set<string>();
    for (const x of masks) {
      for (let t = 0; t < perMask; t++) {
        const w = word(n, x, Math.floor(rand() * 2 ** n));
        if (seen.has(w)) continue;
        seen.add(w);
        parts.push(`${(rand() * 2 - 1).toFixed(6)} ${w}`);
      }
    }
    return parts.join(" + ").replace(/\+ -/g, "- ");
  }

  it(
    "6 qubits, 2–25 terms per mask, every block size: agrees with mathjs dense ⟨ψ|A|ψ⟩ to 1e-12",
    { timeout: 30_000 },
    () => {
      const rand = mulberry32(606);
      const n = 6;
      for (const perMask of [2, 5, 25]) {
        const sum = padPauliSum(
          parsePauliSum(sharedMaskSum(n, [0, 1, 0b100000, 0b010110, 0b111111], perMask, rand)),
          n,
        );
        const s = randomState(n, rand);
        const ref = denseExpectation(sumMatrix(sum.terms, n), s);
        for (const lowBits of [1, 2, 3, 6])
          expect(weightedTotal(sum, pauliExpectationsOnState(s, sum, lowBits))).toBeCloseTo(
            ref,
            12,
          );
      }
    },
  );

  it("11 qubits: grouped per-term values equal term-by-term evaluation (definition Σ_b conj ψ_{b⊕x} i^k (−1)^{|b∧z|} ψ_b)", () => {
    const rand = mulberry32(1111);
    const n = 11;
    const s = randomState(n, rand);
    const sum = padPauliSum(
      parsePauliSum(
        sharedMaskSum(n, [0, 3, 0b10000000000, 0b01100101000, 0b00000001110], 40, rand),
      ),
      n,
    );
    const direct = sum.terms.map((t) => {
      const k = [...word(n, t.xMask, t.zMask)].filter((c) => c === "Y").length % 4;
      let sr = 0;
      let si = 0;
      for (let b = 0; b < 2 ** n; b++) {
        const c = b ^ t.xMask;
        let v = b & t.zMask;
        let par = 0;
        while (v) {
          par ^= v & 1;
          v >>>= 1;
        }
        const sg = par ? -1 : 1;
        // conj(ψ_c) ψ_b
        sr += sg * (s.re[c] * s.re[b] + s.im[c] * s.im[b]);
        si += sg * (s.re[c] * s.im[b] - s.im[c] * s.re[b]);
      }
      // Re(i^k (sr + i si))
      return [sr, -si, -sr, si][k];
    });
    for (const lowBits of [3, 10]) {
      const got = pauliExpectationsOnState(s, sum, lowBits);
      direct.forEach((v, i) => expect(got[i]).toBeCloseTo(v, 12));
    }
  });
});

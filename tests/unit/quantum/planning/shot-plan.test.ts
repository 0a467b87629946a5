/**
 * Shot planning (J. R. McClean et al., New J. Phys. 18, 023023 (2016)): exact setting
 * variances Var_g = Σ_{i,j∈g} c_i c_j (⟨P_iP_j⟩ − ⟨P_i⟩⟨P_j⟩) checked against a mathjs
 * dense computation; state-aware totals (Σ√Var_g)²/ε² never above (Σ|c_i|)²/ε².
 */
import * as math from "mathjs";
import { describe, expect, it } from "vitest";
import { groupQubitWise } from "@/lib/quantum/observable/grouping";
import { parsePauliSum } from "@/lib/quantum/observable/pauli-parse";
import { padPauliSum } from "@/lib/quantum/observable/pauli-word";
import { pauliSettingVariance, varianceFromLaw } from "@/lib/quantum/planning/exact-variance";
import { allocateShots, planFromStdDevs, planShots } from "@/lib/quantum/planning/shot-plan";
import { rotateStateCopy, stateProbabilities } from "@/lib/quantum/sampling/basis-rotation";
import { pauliSettingModel } from "@/lib/quantum/sampling/setting-model";
import { denseExpectation, sumMatrix } from "../observable/dense-reference";
import { mulberry32, randomPauliText, randomState } from "../observable/random-states";

describe("exact setting variance", () => {
  it("equals Σ c_i c_j (⟨P_iP_j⟩ − ⟨P_i⟩⟨P_j⟩) from mathjs (both evaluation paths)", () => {
    const rand = mulberry32(17);
    for (let trial = 0; trial < 20; trial++) {
      const n = 2 + (trial % 4);
      const sum = padPauliSum(
        parsePauliSum(randomPauliText(n, 4 + Math.floor(rand() * 14), rand)),
        n,
      );
      const state = randomState(n, rand);
      for (const g of groupQubitWise(sum)) {
        const terms = g.terms.map((i) => sum.terms[i]);
        const gm = sumMatrix(terms, n);
        const mean = denseExpectation(gm, state);
        const ref = denseExpectation(math.multiply(gm, gm) as math.Matrix, state) - mean * mean;
        const p = stateProbabilities(rotateStateCopy(state, g.bases));
        const model = pauliSettingModel(sum, g.terms, null);
        expect(pauliSettingVariance(p, sum, g.terms, model)).toBeCloseTo(ref, 11);
        expect(varianceFromLaw(p, (b) => model.value(b))).toBeCloseTo(ref, 11);
      }
    }
  });
});

describe("exact setting variance, large groups (Walsh–Hadamard path)", () => {
  it("a 15-term setting on 4 qubits agrees with mathjs", () => {
    const rand = mulberry32(23);
    const n = 4;
    // every non-identity word over {I, Y} on 4 qubits: one setting "YYYY" with 15 terms > n + 1
    const words = Array.from({ length: 15 }, (_, k) =>
      Array.from({ length: n }, (_, q) => (((k + 1) >> q) & 1 ? "Y" : "I")).join(""),
    );
    const sum = padPauliSum(
      parsePauliSum(words.map((w, k) => `${((k % 5) - 2.5) / 3} ${w}`).join(" + ")),
      n,
    );
    const [g] = groupQubitWise(sum);
    expect(g.terms.length).toBe(15);
    const state = randomState(n, rand);
    const gm = sumMatrix(
      g.terms.map((i) => sum.terms[i]),
      n,
    );
    const mean = denseExpectation(gm, state);
    const ref = denseExpectation(math.multiply(gm, gm) as math.Matrix, state) - mean * mean;
    const p = stateProbabilities(rotateStateCopy(state, g.bases));
    expect(
      pauliSettingVariance(p, sum, g.terms, pauliSettingModel(sum, g.terms, null)),
    ).toBeCloseTo(ref, 11);
  });
});

describe("planShots", () => {
  it("worst case is (Σ|c_i|)²/ε² split ∝ Σ_{i∈g}|c_i|; state-aware (Σ√Var_g)²/ε² is smaller", () => {
    const plan = planShots({
      targetPrecision: 0.01,
      stdDevBounds: [1.5, 0.5],
      stdDevs: [0.6, 0.2],
    });
    // (1.5 + 0.5)² / 1e-4 = 40,000 split 30,000 / 10,000
    expect(plan.worstCase).toEqual({ perSetting: [30_000, 10_000], totalShots: 40_000 });
    // (0.6 + 0.2)² / 1e-4 = 6,400 split 4,800 / 1,600
    expect(plan.stateAware).toEqual({ perSetting: [4_800, 1_600], totalShots: 6_400 });
    expect(plan.settings).toBe(2);
  });

  it("the optimal split reaches the target: Σ Var_g / N_g ≤ ε²", () => {
    const rand = mulberry32(2);
    for (let k = 0; k < 50; k++) {
      const sd = Array.from({ length: 1 + Math.floor(rand() * 6) }, () => rand() * 3);
      const eps = 0.001 + rand() * 0.05;
      const p = planFromStdDevs(sd, eps);
      const variance = sd.reduce((a, s, g) => a + (s * s) / p.perSetting[g], 0);
      expect(variance).toBeLessThanOrEqual(eps * eps * (1 + 1e-12));
      const ideal = sd.reduce((a, b) => a + b, 0) ** 2 / (eps * eps);
      expect(p.totalShots).toBeGreaterThanOrEqual(Math.floor(ideal));
      expect(p.totalShots).toBeLessThanOrEqual(Math.ceil(ideal) + sd.length);
    }
  });

  it("chemical accuracy 1.6 mHa (1 kcal/mol = 1.5936 mHa, CODATA) on a unit-norm sum needs (1/0.0016)² ≈ 390,625 shots worst case", () => {
    expect(
      planShots({ targetPrecision: 0.0016, stdDevBounds: [1], stdDevs: null }).worstCase.totalShots,
    ).toBe(390_625);
  });

  it("rejects a non-positive target", () => {
    expect(() => planShots({ targetPrecision: 0, stdDevBounds: [1] })).toThrow(RangeError);
  });
});

describe("allocateShots", () => {
  it("sums to the total, gives each setting ≥ 1, follows the weights", () => {
    expect(allocateShots(10, [1, 1, 1])).toEqual([4, 3, 3]);
    expect(allocateShots(103, [3, 1, 0])).toEqual([76, 26, 1]);
    expect(allocateShots(5, [0, 0])).toEqual([3, 2]);
    expect(() => allocateShots(2, [1, 1, 1])).toThrow(/at least 3 shots/);
    const rand = mulberry32(4);
    for (let k = 0; k < 100; k++) {
      const w = Array.from({ length: 1 + Math.floor(rand() * 8) }, () => rand());
      const total = w.length + Math.floor(rand() * 10_000);
      const out = allocateShots(total, w);
      expect(out.reduce((a, b) => a + b, 0)).toBe(total);
      expect(Math.min(...out)).toBeGreaterThanOrEqual(1);
    }
  });
});

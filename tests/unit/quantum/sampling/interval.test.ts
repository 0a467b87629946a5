/**
 * The interval estimator (interval.ts) and Student's t (student-t.ts), against jstat
 * (statistics reference library) and textbook formulas:
 * - Beta(k + 1, N − k + 1) is the posterior of a binomial rate under the uniform prior
 *   (Bayes–Laplace; common textbook result);
 * - the Dirichlet covariance Cov(w_k, w_l) = (ᾱ_k δ_kl − ᾱ_k ᾱ_l)/(α₀ + 1) (S. Kotz, N. Balakrishnan
 *   & N. L. Johnson, Continuous Multivariate Distributions, 2000, ch. 49);
 * - MOVER square-and-add limits for sums (R. G. Newcombe 1998; G. Y. Zou & A. Donner 2008);
 * - the t quantile series of M. Abramowitz & I. A. Stegun 26.7.5 against jstat.
 */
import { createRequire } from "node:module";
import { describe, expect, it } from "vitest";
import {
  estimateLinearCombination,
  intervalZ,
  settingPosterior,
  tQuantile95,
} from "@/lib/quantum/sampling/interval";
import {
  incompleteBeta,
  studentQuantileTwoSided,
  studentTwoSidedP,
} from "@/lib/quantum/sampling/student-t";

const { jStat } = createRequire(import.meta.url)("jstat") as {
  jStat: {
    studentt: { inv(p: number, df: number): number; cdf(x: number, df: number): number };
    beta: { mean(a: number, b: number): number; variance(a: number, b: number): number };
    ibeta(x: number, a: number, b: number): number;
  };
};

describe("Student's t and the incomplete beta function (jstat)", () => {
  it("97.5 % quantiles for 1 … 10⁴ degrees of freedom, and the normal limit 1.959964", () => {
    for (const df of [1, 2, 3, 4.5, 9, 30, 101, 1000, 10_000]) {
      expect(studentQuantileTwoSided(0.05, df)).toBeCloseTo(jStat.studentt.inv(0.975, df), 6); // jstat agrees to ~1e-7
    }
    expect(studentQuantileTwoSided(0.05, 1e9)).toBeCloseTo(1.959964, 6); // Φ⁻¹(0.975), common practice
    expect(studentQuantileTwoSided(0.05, 0)).toBe(Number.POSITIVE_INFINITY);
    for (const df of [200, 1001, 50_000])
      expect(tQuantile95(df)).toBeCloseTo(jStat.studentt.inv(0.975, df), 6);
    expect(tQuantile95(12)).toBe(studentQuantileTwoSided(0.05, 12));
  });

  it("two-sided p-values and I_x(a, b)", () => {
    for (const df of [1, 3, 12, 200]) {
      for (const t of [0.2, 1, 2.5, 4]) {
        expect(studentTwoSidedP(t, df)).toBeCloseTo(2 * (1 - jStat.studentt.cdf(t, df)), 6);
      }
    }
    expect(studentTwoSidedP(0, 5)).toBe(1);
    // Beta(½, ½) is the arcsine law: I_x(½, ½) = (2/π)·asin(√x) (textbook closed form)
    expect(incompleteBeta(0.9, 0.5, 0.5)).toBeCloseTo(
      (2 / Math.PI) * Math.asin(Math.sqrt(0.9)),
      13,
    );
    for (const [x, a, b] of [
      [0.3, 2.5, 4],
      [0.9, 0.5, 0.5],
      [0.02, 30, 2],
    ]) {
      expect(incompleteBeta(x, a, b)).toBeCloseTo(jStat.ibeta(x, a, b), 8); // jstat agrees to ~1e-10
    }
  });
});

describe("per-setting posterior", () => {
  it("one ±1 outcome: k of N read +1 → ⟨Z⟩ = 2p − 1 with p ~ Beta(k + 1, N − k + 1)", () => {
    for (const [k, N] of [
      [0, 10],
      [3, 10],
      [100, 100],
      [4180, 10_000],
    ]) {
      const post = settingPosterior({ shots: N, sum: 2 * k - N, sumSq: N, lo: -1, hi: 1 });
      expect(post.mean).toBeCloseTo(2 * jStat.beta.mean(k + 1, N - k + 1) - 1, 12);
      expect(post.variance).toBeCloseTo(4 * jStat.beta.variance(k + 1, N - k + 1), 14);
    }
  });

  it("several outcome values: the Dirichlet mean functional's variance from the full covariance matrix", () => {
    const values = [-2, -0.5, 0, 1.5, 2];
    const counts = [0, 7, 3, 11, 0];
    const alpha = counts.slice();
    alpha[0] += 1; // pseudo-shots at the ends of the range [−2, 2]
    alpha[4] += 1;
    const a0 = alpha.reduce((a, b) => a + b, 0);
    let mean = 0;
    let variance = 0;
    for (let k = 0; k < 5; k++) {
      mean += (alpha[k] / a0) * values[k];
      for (let l = 0; l < 5; l++) {
        const cov = ((k === l ? alpha[k] / a0 : 0) - (alpha[k] / a0) * (alpha[l] / a0)) / (a0 + 1);
        variance += values[k] * values[l] * cov;
      }
    }
    const N = counts.reduce((a, b) => a + b, 0);
    const sum = counts.reduce((a, c, k) => a + c * values[k], 0);
    const sumSq = counts.reduce((a, c, k) => a + c * values[k] ** 2, 0);
    const post = settingPosterior({ shots: N, sum, sumSq, lo: -2, hi: 2 });
    expect(post.mean).toBeCloseTo(mean, 14);
    expect(post.variance).toBeCloseTo(variance, 14);
  });
});

describe("estimateLinearCombination", () => {
  it("every shot equal: the mean is the sample mean, the error is small but not zero, the interval stops at the range", () => {
    const e = estimateLinearCombination([{ shots: 100, sum: 100, sumSq: 100, lo: -1, hi: 1 }], {
      range: [-1, 1],
    });
    expect(e.mean).toBe(1);
    expect(e.stdErr).toBeGreaterThan(0.01);
    expect(e.stdErr).toBeLessThan(0.03);
    expect(e.ci95[1]).toBe(1);
    // 100 identical shots cannot exclude ⟨Z⟩ = 0.97 (a flip rate of 1.5 %)
    expect(e.ci95[0]).toBeLessThan(0.97);
    expect(e.ci95[0]).toBeGreaterThan(0.9);
  });

  it("adds independent settings by square-and-add (MOVER): weights scale means by w, variances by w², and swap limits for w < 0", () => {
    const a = { shots: 40, sum: 12, sumSq: 40, lo: -1, hi: 1 };
    const b = { shots: 90, sum: -30, sumSq: 90, lo: -1, hi: 1 };
    const pa = settingPosterior(a);
    const pb = settingPosterior(b);
    const e = estimateLinearCombination(
      [
        { ...a, weight: 0.5 },
        { ...b, weight: -2 },
      ],
      { offset: 3 },
    );
    const xa = 12 / 40;
    const xb = -30 / 90;
    expect(e.mean).toBeCloseTo(3 + 0.5 * xa - 2 * xb, 14);
    expect(e.stdErr).toBeCloseTo(Math.sqrt(0.25 * pa.variance + 4 * pb.variance), 14);
    const limits = (p: { mean: number; variance: number }, n: number): [number, number] => {
      const h = jStat.studentt.inv(0.975, n + 1) * Math.sqrt(p.variance);
      return [p.mean - h, p.mean + h];
    };
    const [la, ua] = limits(pa, 40);
    const [lb, ub] = limits(pb, 90);
    // w = −2 turns setting b's upper limit into the sum's lower one
    expect(e.ci95[0]).toBeCloseTo(e.mean - Math.hypot(0.5 * (xa - la), 2 * (ub - xb)), 6);
    expect(e.ci95[1]).toBeCloseTo(e.mean + Math.hypot(0.5 * (ua - xa), 2 * (xb - lb)), 6);
    // one setting: the interval is the setting's own t interval around its posterior mean
    const one = estimateLinearCombination([a]);
    expect(one.ci95[0]).toBeCloseTo(la, 6);
    expect(one.ci95[1]).toBeCloseTo(ua, 6);
  });

  it("many deterministic settings: the interval still contains the exact sum (no accumulated pull to the middle)", () => {
    const settings = Array.from({ length: 12 }, () => ({
      shots: 50,
      sum: 50,
      sumSq: 50,
      lo: -1,
      hi: 1,
    }));
    const e = estimateLinearCombination(settings, { range: [-12, 12] });
    expect(e.mean).toBe(12);
    expect(e.ci95[1]).toBe(12);
    expect(e.ci95[0]).toBeLessThan(12);
    expect(e.stdErr).toBeGreaterThan(0);
  });

  it("large N: close to the plug-in normal interval mean ± 1.96·√(s²/N) (common practice)", () => {
    const N = 1_000_000;
    const k = 600_000;
    const e = estimateLinearCombination([{ shots: N, sum: 2 * k - N, sumSq: N, lo: -1, hi: 1 }]);
    const m = (2 * k - N) / N;
    const se = Math.sqrt((1 - m * m) / N);
    expect(e.stdErr / se).toBeCloseTo(1, 5);
    expect(e.ci95[0]).toBeCloseTo(m - 1.959964 * se, 5);
    expect(e.ci95[1]).toBeCloseTo(m + 1.959964 * se, 5);
  });

  it("no settings: the offset is exact; a setting without shots is refused", () => {
    expect(estimateLinearCombination([], { offset: 2.5 })).toEqual({
      mean: 2.5,
      stdErr: 0,
      ci95: [2.5, 2.5],
    });
    expect(() =>
      estimateLinearCombination([{ shots: 0, sum: 0, sumSq: 0, lo: -1, hi: 1 }]),
    ).toThrow(RangeError);
  });
});

describe("intervalZ (the verdict's distance)", () => {
  it("|z| ≤ 1.96 exactly inside the interval, using the half-width on the reference's side", () => {
    const e = { mean: 1, stdErr: 0.02, ci95: [0.94, 1] as [number, number] };
    expect(intervalZ(e, 0.94)).toBeCloseTo(1.959963984540054, 12);
    expect(intervalZ(e, 1)).toBe(0);
    expect(intervalZ(e, 1.01)).toBeCloseTo(0.01 / -0.02, 12); // zero-width side: falls back to stdErr
    expect(intervalZ({ mean: 2, stdErr: 0, ci95: [2, 2] }, 2.1)).toBeNull();
  });
});

import { createRequire } from "node:module";
import { describe, expect, it } from "vitest";
import { Z95, erfc, twoSidedP, zScore } from "@/lib/quantum/sampling/normal";
/** jstat (statistics reference library) ships no type declarations. */
const { jStat } = createRequire(import.meta.url)("jstat") as {
  jStat: {
    normal: {
      cdf: (x: number, m: number, s: number) => number;
      inv: (p: number, m: number, s: number) => number;
    };
  };
};

describe("erfc and the two-sided p-value", () => {
  it("matches jStat's normal CDF: p = 2(1 − Φ(|z|)) (reference library jstat)", () => {
    for (const z of [0, 0.3, 1, 1.959963984540054, 2.5, 3, 4, 5.5]) {
      const ref = 2 * (1 - jStat.normal.cdf(z, 0, 1));
      expect(twoSidedP(z)).toBeCloseTo(ref, 6);
      expect(twoSidedP(-z)).toBeCloseTo(ref, 6);
    }
  });
  it("erfc(0) = 1, erfc(1) = 0.157299207 (A&S Table 7.1, value from memory), erfc(−x) = 2 − erfc(x)", () => {
    expect(erfc(0)).toBeCloseTo(1, 7);
    expect(erfc(1)).toBeCloseTo(0.157299207, 7);
    expect(erfc(-0.7)).toBeCloseTo(2 - erfc(0.7), 12);
  });
  it("erfc to 1e-13 relative across the range, tails included (values of Python's math.erfc, the C library's erfc)", () => {
    const table: [number, number][] = [
      [0.1, 0.8875370839817152],
      [0.49, 0.4883317388114769],
      [0.5, 0.4795001221869535],
      [1, 0.15729920705028513],
      [2, 0.004677734981047265],
      [3, 2.2090496998585438e-5],
      [5, 1.5374597944280351e-12],
      [10, 2.088487583762545e-45],
      [26, 5.663192408856143e-296],
    ];
    for (const [x, ref] of table) {
      expect(Math.abs(erfc(x) - ref) / ref).toBeLessThan(1e-13);
      expect(erfc(-x)).toBeCloseTo(2 - ref, 14);
    }
  });
  it("Z95 is the 97.5 % normal quantile to double precision (jstat inverse CDF gives 1.9599639845400545)", () => {
    expect(Z95).toBeCloseTo(jStat.normal.inv(0.975, 0, 1), 14);
    expect(Z95.toFixed(6)).toBe("1.959964"); // printed normal tables, common practice
    expect(twoSidedP(Z95)).toBeCloseTo(0.05, 6);
  });
  it("computes z = (mean − exact)/stdErr", () => {
    expect(zScore(-1.1372, -1.138, 0.0008)).toBeCloseTo(1, 9);
    expect(zScore(1, 1, 0)).toBeNull();
  });
});

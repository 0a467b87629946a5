import { describe, expect, it } from "vitest";
import { argMin, gridShape, rampColor, type SweepPoint } from "@/components/charts/sweep-math";
import {
  linear,
  logTicks,
  niceStep,
  niceTicks,
  paddedDomain,
  tickLabel,
} from "@/components/charts/scale";

describe("chart scales (nice-number axis ticks, common practice: steps of 1, 2 or 5 × 10^k)", () => {
  it("chooses 1-2-5 steps", () => {
    expect(niceStep(1, 5)).toBeCloseTo(0.2, 12);
    expect(niceStep(10, 5)).toBe(2);
    expect(niceStep(0.003, 5)).toBeCloseTo(0.001, 12);
    expect(niceStep(7, 5)).toBe(2);
    expect(niceStep(23, 5)).toBe(5);
  });
  it("puts ticks on multiples of the step inside the domain", () => {
    expect(niceTicks(-1.16, -1.1, 4)).toEqual([-1.16, -1.14, -1.12, -1.1]);
    const t = niceTicks(0.13, 0.87, 5);
    expect(t[0]).toBeGreaterThanOrEqual(0.13);
    expect(t[t.length - 1]).toBeLessThanOrEqual(0.87);
    for (let i = 1; i < t.length; i++) expect(t[i] - t[i - 1]).toBeCloseTo(0.2, 12);
  });
  it("pads the domain and never collapses it", () => {
    const [lo, hi] = paddedDomain([1, 2]);
    expect(lo).toBeLessThan(1);
    expect(hi).toBeGreaterThan(2);
    const [a, b] = paddedDomain([-1.137, -1.137]);
    expect(b).toBeGreaterThan(a);
    // a single value gets a visible window: ±2 % before padding
    expect(b - a).toBeGreaterThan(0.04 * 1.137);
    expect(niceTicks(a, b, 5).length).toBeGreaterThan(2);
    expect(new Set(niceTicks(a, b, 5).map(tickLabel)).size).toBe(niceTicks(a, b, 5).length);
    expect(paddedDomain([])).toEqual([-1, 1]);
    expect(paddedDomain([Number.NaN, 3, Number.POSITIVE_INFINITY])[0]).toBeLessThan(3);
  });
  it("maps linearly and labels with a true minus sign", () => {
    const x = linear([0, 10], [100, 200]);
    expect(x(5)).toBe(150);
    expect(tickLabel(-1.125)).toBe("\u22121.125");
    expect(tickLabel(0.00001)).toBe("1.0e\u22125");
  });
});

describe("sweep helpers", () => {
  const pt = (a: number, b: number, e: number): SweepPoint => ({
    params: { a, b },
    ideal: e,
    exact: e,
    sampled: null,
  });
  it("finds the minimum, skipping missing values", () => {
    expect(argMin([3, null, 1, 1, Number.NaN])).toBe(2);
    expect(argMin([null])).toBe(-1);
  });
  it("recovers the row-major grid with the first parameter slowest (engine order, sweep-grid.ts)", () => {
    const pts = [pt(0, 0, 1), pt(0, 1, 2), pt(0, 2, 3), pt(1, 0, 4), pt(1, 1, 5), pt(1, 2, 6)];
    const g = gridShape(pts, ["a", "b"]);
    expect(g.rows).toEqual([0, 1]);
    expect(g.cols).toEqual([0, 1, 2]);
    expect(g.cells[4]).toEqual({ row: 1, col: 1 });
  });
  it("ramps from a dark low end to a lighter middle, clamped outside [0, 1]", () => {
    const L = (s: string) => Number(/oklch\(([\d.]+)/.exec(s)![1]);
    expect(L(rampColor(0))).toBeLessThan(L(rampColor(0.5)));
    expect(rampColor(-1)).toBe(rampColor(0));
    expect(rampColor(2)).toBe(rampColor(1));
  });
});

describe("logTicks", () => {
  it("uses powers of ten when there are at least three, else 1-2-5 steps", () => {
    expect(logTicks(10, 4000)).toEqual([10, 100, 1000]);
    expect(logTicks(10, 400)).toEqual([10, 20, 50, 100, 200]);
    expect(logTicks(0, 10)).toEqual([]);
  });
});

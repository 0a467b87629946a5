/**
 * Calibration of the sampled 95 % intervals (interval.ts) — a sub-grid of
 * `npm run bench:coverage`. With discrete shot counts no interval covers exactly 95 % at every
 * ⟨A⟩: coverage oscillates with the value (L. D. Brown, T. T. Cai & A. DasGupta, Stat. Sci. 16,
 * 101 (2001)). For one ±1 outcome the exact binomial coverage of our interval stays ≥ 91.5 %
 * for every N ≥ 10 and every ⟨Z⟩, ≥ 93 % from N = 50 (binomial law summed over all counts, N ≤ 400), so
 * each cell asserts coverage ≥ 91.5 % − 3·SE over 400 fixed seeds, SE = √(0.915·0.085/400) ≈
 * 1.4 % (floor ≈ 87.3 %). That fails a collapsing interval (the plug-in normal interval
 * covered 18–64 % at ⟨Z⟩ = 0.98 with 20–100 shots) and accepts a conservative one (up to
 * 100 %, as any honest interval is when ~1 outcome in N differs). Exact values: N. D. Mermin,
 * Phys. Rev. Lett. 65, 1838 (1990) (⟨M⟩ = 4 on the GHZ state); the singlet's σ·σ = −3 (textbook).
 */
import { describe, expect, it } from "vitest";
import { agreementVerdict } from "@/lib/runs/verdict";
import { estimate } from "@/lib/quantum";
import { coverage, coverageSe, type CoverageCase } from "../../../support/coverage-cases";

const SEEDS = 400;
const FLOOR = 0.915 - 3 * coverageSe(0.915, SEEDS);

const CELLS: CoverageCase[] = [
  { family: "one term", a: 0, shots: 10, mitigated: false },
  { family: "one term", a: 0.9, shots: 100, mitigated: false },
  { family: "one term", a: 0.98, shots: 20, mitigated: false },
  { family: "one term", a: 0.98, shots: 100, mitigated: false },
  { family: "one term", a: 0.999, shots: 1000, mitigated: false },
  { family: "one term", a: 0.62, shots: 500, mitigated: true },
  { family: "one term", a: 0.99, shots: 200, mitigated: true },
  { family: "correlated", a: 0.9, shots: 100, mitigated: false },
  { family: "correlated", a: 0.99, shots: 1000, mitigated: true },
  { family: "settings", a: 0.5, shots: 30, mitigated: false },
  { family: "settings", a: 0.99, shots: 300, mitigated: false },
  { family: "mermin", a: 0.9, shots: 100, mitigated: false },
  { family: "mermin", a: 0.999, shots: 1000, mitigated: true },
  { family: "heisenberg", a: 0.99, shots: 200, mitigated: false },
];

describe("95 % intervals keep their promise (coverage ≥ 91.5 % − 3 SE over 400 seeds)", () => {
  for (const cell of CELLS) {
    const name = `${cell.family}, a = ${cell.a}, ${cell.shots} shots, ${cell.mitigated ? "mitigated" : "raw"}`;
    it(name, { timeout: 60_000 }, async () => {
      const r = await coverage(cell, SEEDS);
      expect(r.covered / SEEDS).toBeGreaterThanOrEqual(FLOOR);
    });
  }

  it("many shots, mid-range value: the half-width is the normal 1.96·√((1 − a²)/N) (no needless width)", async () => {
    const r = await coverage({ family: "one term", a: 0.5, shots: 4000, mitigated: false }, 40);
    expect(r.widthRatio / (1.959964 * Math.sqrt((1 - 0.25) / 4000))).toBeCloseTo(1, 1);
  });
});

describe("exact eigenstates get a small, non-zero, honest interval", () => {
  const GHZ =
    'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[3];\nh q[0];\ncx q[0],q[1];\ncx q[1],q[2];\n';

  it("GHZ state, Mermin operator XXX − XYY − YXY − YYX = 4: every shot agrees, stdErr > 0, verdict consistent", async () => {
    const r = await estimate({
      circuit: { format: "qasm2", source: GHZ },
      observable: { format: "pauli", terms: "XXX - XYY - YXY - YYX" },
      shots: 400,
      seed: 11,
    });
    expect(r.exact.value).toBeCloseTo(4, 12);
    expect(r.sampled!.mean).toBeCloseTo(4, 12);
    expect(r.sampled!.stdErr).toBeGreaterThan(0);
    expect(r.sampled!.stdErr).toBeLessThan(0.1);
    expect(r.sampled!.ci95[0]).toBeLessThan(4);
    expect(r.sampled!.ci95[0]).toBeGreaterThan(3.6);
    expect(r.sampled!.ci95[1]).toBeCloseTo(4, 12);
    for (const t of r.terms) {
      expect(t.stdErr).toBeGreaterThan(0);
      expect(t.ci95![0]).toBeLessThanOrEqual(t.exact + 1e-12);
      expect(t.ci95![1]).toBeGreaterThanOrEqual(t.exact - 1e-12);
    }
    const v = agreementVerdict(r.sampled, r.exact.value);
    expect(v.kind).toBe("consistent");
    expect(v.z).toBeCloseTo(0, 9);
    expect(v.p).toBeCloseTo(1, 6);
  });
});

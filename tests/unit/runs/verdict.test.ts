import { describe, expect, it } from "vitest";
import { Z95 } from "@/lib/quantum/sampling/normal";
import { agreementVerdict, pickComparison } from "@/lib/runs/verdict";

describe("agreementVerdict", () => {
  it("calls |z| ≤ 3 consistent and beyond suspicious (three-sigma rule, common practice)", () => {
    expect(agreementVerdict({ mean: 0.51, stdErr: 0.01 }, 0.5).kind).toBe("consistent");
    expect(agreementVerdict({ mean: 0.529, stdErr: 0.01 }, 0.5).kind).toBe("consistent");
    const off = agreementVerdict({ mean: 0.55, stdErr: 0.01 }, 0.5);
    expect(off.kind).toBe("suspicious");
    expect(off.z).toBeCloseTo(5, 9);
    expect(off.p).toBeLessThan(1e-6);
  });
  it("treats zero spread as exact only when the values agree", () => {
    expect(agreementVerdict({ mean: 1, stdErr: 0 }, 1).kind).toBe("exact");
    expect(agreementVerdict({ mean: 1, stdErr: 0 }, 0.9).kind).toBe("suspicious");
  });
  it("with an interval: z uses the half-width on the exact value's side; deterministic shots are never falsely suspicious", () => {
    // 100 shots all +1 on an eigenstate (⟨Z⟩ = 1): interval [0.942, 1], stdErr 0.0193
    const eigen = agreementVerdict({ mean: 1, stdErr: 0.0193, ci95: [0.942, 1] }, 1);
    expect(eigen.kind).toBe("consistent");
    expect(eigen.z).toBe(0);
    expect(eigen.p).toBeCloseTo(1, 6);
    // exact 0.97 (a 1.5 % flip rate the 100 shots missed): inside the interval, |z| < 1.96
    const near = agreementVerdict({ mean: 1, stdErr: 0.0193, ci95: [0.942, 1] }, 0.97);
    expect(near.kind).toBe("consistent");
    expect(near.z).toBeCloseTo((0.03 / 0.058) * Z95, 9);
    // far below the interval: suspicious
    expect(agreementVerdict({ mean: 1, stdErr: 0.0193, ci95: [0.942, 1] }, 0.8).kind).toBe(
      "suspicious",
    );
  });
  it("is unavailable without a sample", () => {
    expect(agreementVerdict(null, 1).kind).toBe("unavailable");
  });
  it("about 95 % of normal draws fall within the 95 % interval (simulation, seeded LCG)", () => {
    // Box–Muller normals from a fixed linear congruential generator (Numerical Recipes constants).
    let s = 12345;
    const u = () => ((s = (1664525 * s + 1013904223) % 2 ** 32) + 0.5) / 2 ** 32;
    let inside = 0;
    let consistent = 0;
    const n = 20_000;
    for (let i = 0; i < n; i++) {
      const z = Math.sqrt(-2 * Math.log(u())) * Math.cos(2 * Math.PI * u());
      if (Math.abs(z) <= Z95) inside++;
      if (agreementVerdict({ mean: 0.2 + 0.01 * z, stdErr: 0.01 }, 0.2).kind === "consistent")
        consistent++;
    }
    expect(inside / n).toBeGreaterThan(0.94);
    expect(inside / n).toBeLessThan(0.96);
    expect(consistent / n).toBeGreaterThan(0.995); // P(|z| ≤ 3) = 0.9973
  });
});

describe("pickComparison — readout error biases the raw mean", () => {
  it("compares the mitigated mean when readout error is present and mitigation ran", () => {
    expect(pickComparison({ readout: { p1Given0: 0.02 }, hasMitigated: true })).toEqual({
      basis: "mitigated",
      readoutBiased: true,
    });
    expect(pickComparison({ readout: { p1Given0: 0.02 }, hasMitigated: false })).toEqual({
      basis: "raw",
      readoutBiased: true,
    });
    expect(pickComparison({ readout: null, hasMitigated: false })).toEqual({
      basis: "raw",
      readoutBiased: false,
    });
  });
});

/**
 * Shot split and plan for the reported posterior standard error (posterior-allocation.ts):
 * minimise Σ_g (σ_g²/N_g + D_g/N_g²) under Σ N_g = N (Lagrange condition
 * σ²/N² + 2D/N³ = λ, checked directly); with D = 0 it is the plug-in split N_g ∝ σ_g
 * (J. R. McClean et al., New J. Phys. 18, 023023 (2016)).
 */
import { describe, expect, it } from "vitest";
import {
  expectedPosteriorVariance,
  posteriorPlan,
  posteriorWeights,
} from "@/lib/quantum/planning/posterior-allocation";
import { sampleObservable } from "@/lib/quantum/sampling/sample-observable";
import type { StateVector } from "@/lib/quantum/types";
import { options, pauliObservable } from "../sampling/sampling-helpers";

describe("posterior shot split", () => {
  it("without pseudo-shot terms it is N_g ∝ σ_g", () => {
    const w = posteriorWeights(6000, [
      { variance: 1, pseudo: 0 },
      { variance: 4, pseudo: 0 },
      { variance: 9, pseudo: 0 },
    ]);
    expect(w[0]).toBeCloseTo(1000, 6);
    expect(w[1]).toBeCloseTo(2000, 6);
    expect(w[2]).toBeCloseTo(3000, 6);
  });

  it("a deterministic setting gets the shots its error bar needs, and every setting meets the Lagrange condition", () => {
    const loads = [
      { variance: 0, pseudo: 4 },
      { variance: 0.5, pseudo: 3 },
      { variance: 2, pseudo: 1 },
    ];
    const w = posteriorWeights(3000, loads);
    expect(w.reduce((a, b) => a + b, 0)).toBeCloseTo(3000, 6);
    expect(w[0]).toBeGreaterThan(50);
    const lambda = loads.map((l, g) => l.variance / w[g] ** 2 + (2 * l.pseudo) / w[g] ** 3);
    expect(lambda[1] / lambda[0]).toBeCloseTo(1, 8);
    expect(lambda[2] / lambda[0]).toBeCloseTo(1, 8);
  });

  it("the plan reaches ε² in expected posterior variance, with shots no plug-in plan would give a deterministic setting", () => {
    const loads = [
      { variance: 0, pseudo: 4 },
      { variance: 1, pseudo: 2 },
    ];
    const plan = posteriorPlan(0.01, loads);
    const v = plan.perSetting.reduce((a, n, g) => a + expectedPosteriorVariance(n, loads[g]), 0);
    expect(v).toBeLessThanOrEqual(1e-4);
    expect(plan.perSetting[0]).toBeGreaterThan(20);
    expect(plan.totalShots).toBe(plan.perSetting[0] + plan.perSetting[1]);
  });
});

describe("through the sampler", () => {
  it("|0⟩ with Z0 + X0: the deterministic Z setting gets many shots; targetPrecision lands at or below the target", async () => {
    const state: StateVector = { n: 1, re: new Float64Array([1, 0]), im: new Float64Array(2) };
    const obs = pauliObservable("Z0 + X0", 1);
    const split = await sampleObservable(
      { kind: "statevector", state },
      obs,
      options({ shots: 2000, seed: 2 }),
    );
    const z = split.groups.find((g) => g.bases === "Z")!;
    expect(z.shots).toBeGreaterThan(50);
    const planned = await sampleObservable(
      { kind: "statevector", state },
      obs,
      options({ shots: null, targetPrecision: 0.02, seed: 3 }),
    );
    expect(planned.sampled.stdErr).toBeLessThan(0.021);
    expect(planned.sampled.stdErr).toBeGreaterThan(0.015);
  });
});

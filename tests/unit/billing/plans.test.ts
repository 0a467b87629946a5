import { describe, expect, it } from "vitest";
import {
  UnknownPlanError,
  getPlan,
  isPaidPlan,
  isPlanId,
  overageCents,
  planIds,
  plans,
  type PlanLimits,
} from "@/lib/billing/plans";

const limitKeys: (keyof PlanLimits)[] = [
  "seats",
  "maxStatevectorQubits",
  "maxDensityMatrixQubits",
  "monthlyShots",
  "monthlySimulationSeconds",
  "concurrentRuns",
  "maxRunSeconds",
];

describe("plan table", () => {
  it("lists the three plans in price order, each under its own id", () => {
    expect(planIds).toEqual(["sandbox", "lab", "institute"]);
    expect(plans.map((p) => p.id)).toEqual(planIds);
    for (const id of planIds) expect(getPlan(id).id).toBe(id);
  });

  it("getPlan rejects unknown ids with a typed error naming the id", () => {
    expect(() => getPlan("enterprise")).toThrow(UnknownPlanError);
    expect(() => getPlan("")).toThrow(/Unknown plan ""/);
    expect(isPlanId("lab")).toBe(true);
    expect(isPlanId("Lab")).toBe(false);
    expect(isPlanId(3)).toBe(false);
  });

  it("every limit is a positive integer", () => {
    for (const plan of plans) {
      for (const key of limitKeys) {
        expect(Number.isInteger(plan.limits[key]), `${plan.id}.${key}`).toBe(true);
        expect(plan.limits[key], `${plan.id}.${key}`).toBeGreaterThan(0);
      }
    }
  });

  it("each step up gives at least as much on every limit and costs more per seat", () => {
    for (let i = 1; i < plans.length; i++) {
      const lower = plans[i - 1];
      const higher = plans[i];
      for (const key of limitKeys) {
        expect(
          higher.limits[key],
          `${higher.id}.${key} >= ${lower.id}.${key}`,
        ).toBeGreaterThanOrEqual(lower.limits[key]);
      }
      expect(higher.seatPriceCents).toBeGreaterThan(lower.seatPriceCents);
    }
  });

  it("only paid plans have overage prices; the higher plan has the lower rates", () => {
    expect(isPaidPlan(getPlan("sandbox"))).toBe(false);
    expect(getPlan("sandbox").seatPriceCents).toBe(0);
    const lab = getPlan("lab");
    const institute = getPlan("institute");
    expect(isPaidPlan(lab) && isPaidPlan(institute)).toBe(true);
    expect(institute.overage!.shotsPer1000Cents).toBeLessThanOrEqual(
      lab.overage!.shotsPer1000Cents,
    );
    expect(Number(institute.overage!.simulationSecondCentsDecimal)).toBeLessThanOrEqual(
      Number(lab.overage!.simulationSecondCentsDecimal),
    );
    // The provider accepts unit_amount_decimal with at most 12 decimal places.
    for (const p of [lab, institute])
      expect(p.overage!.simulationSecondCentsDecimal).toMatch(/^\d+(\.\d{1,12})?$/);
  });

  it("a density matrix needs 4^n amplitudes, so its qubit cap stays near half the statevector cap", () => {
    // Memory of a dense n-qubit density matrix equals that of a 2n-qubit statevector.
    for (const plan of plans) {
      expect(2 * plan.limits.maxDensityMatrixQubits).toBeLessThanOrEqual(
        plan.limits.maxStatevectorQubits,
      );
    }
  });

  it("has a description and feature bullets for the pricing section", () => {
    for (const plan of plans) {
      expect(plan.description.length).toBeGreaterThan(10);
      expect(plan.features.length).toBeGreaterThanOrEqual(3);
      expect(plan.currency).toBe("usd");
    }
  });
});

describe("overageCents", () => {
  const lab = getPlan("lab");

  it("is zero within quota and on the free plan", () => {
    expect(overageCents(lab, { shots: lab.limits.monthlyShots, simulationSeconds: 10 })).toBe(0);
    expect(overageCents(getPlan("sandbox"), { shots: 1e9, simulationSeconds: 1e6 })).toBe(0);
  });

  it("bills started blocks of 1,000 shots and whole seconds above quota", () => {
    // 1 shot over → one block; 1,001 over → two blocks. 0.5 s over → 1 s.
    expect(overageCents(lab, { shots: lab.limits.monthlyShots + 1, simulationSeconds: 0 })).toBe(5);
    expect(overageCents(lab, { shots: lab.limits.monthlyShots + 1001, simulationSeconds: 0 })).toBe(
      10,
    );
    expect(
      overageCents(lab, { shots: 0, simulationSeconds: lab.limits.monthlySimulationSeconds + 0.5 }),
    ).toBeCloseTo(0.2, 12);
    expect(
      overageCents(lab, {
        shots: lab.limits.monthlyShots + 3000,
        simulationSeconds: lab.limits.monthlySimulationSeconds + 100,
      }),
    ).toBeCloseTo(15 + 20, 12);
  });
});

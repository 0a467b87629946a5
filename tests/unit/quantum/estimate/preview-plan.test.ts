/**
 * The preview's state-aware shot plan: within its work budget it plans exactly as the run
 * does (the shots drawn by estimate() equal the shots planned), beyond the budget it falls
 * back to the worst-case bound and says so; a precision no plan reaches is refused before
 * running. Formulas: N = (Σ_g √Var_g)²/ε² (McClean et al., New J. Phys. 18, 023023 (2016));
 * the 2×2 assignment matrix [[1−p10, p01], [p10, 1−p01]] has determinant 1 − p10 − p01
 * (textbook linear algebra).
 */
import { describe, expect, it } from "vitest";
import { EngineError, estimate, previewRequest, previewResultSchema } from "@/lib/quantum";
import { engineProblem } from "@/lib/runs/problems";

const qasm2 = (n: number, body: string) =>
  `OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[${n}];\n${body}\n`;
const SRC = qasm2(3, "ry(0.8) q[0];\ncx q[0],q[1];\nrx(0.3) q[2];\ncz q[1],q[2];");
const PAULI = { format: "pauli" as const, terms: "0.7 Z0 Z1 - 0.4 X1 + 0.25 Y0 Y2 + 0.1 Z2" };

function engineError(f: () => unknown): EngineError {
  try {
    f();
  } catch (e) {
    if (e instanceof EngineError) return e;
    throw e;
  }
  throw new Error("expected an EngineError");
}

describe("state-aware preview plan = the shots the run draws", () => {
  const cases = [
    {
      name: "Pauli sum, statevector",
      req: {
        circuit: { format: "qasm2" as const, source: SRC },
        observable: PAULI,
        targetPrecision: 0.02,
        seed: 5,
      },
    },
    {
      name: "density matrix with noise, readout and mitigation",
      req: {
        circuit: { format: "qasm2" as const, source: SRC },
        observable: PAULI,
        method: "density_matrix" as const,
        noise: {
          depolarizing1q: 0.01,
          depolarizing2q: 0.03,
          readout: { p1Given0: 0.02, p0Given1: 0.05 },
        },
        mitigateReadout: true,
        targetPrecision: 0.03,
        seed: 6,
      },
    },
    {
      name: "matrix observable (eigenbasis)",
      req: {
        circuit: { format: "qasm2" as const, source: qasm2(2, "h q[0];\nry(0.4) q[1];") },
        observable: {
          format: "matrix" as const,
          real: [
            [1, 0.5, 0, 0],
            [0.5, -1, 0, 0.2],
            [0, 0, 0.3, 0],
            [0, 0.2, 0, 2],
          ],
        },
        targetPrecision: 0.01,
        seed: 7,
      },
    },
  ];
  it.each(cases)("$name", async ({ req }) => {
    const p = previewRequest(req);
    expect(() => previewResultSchema.parse(p)).not.toThrow();
    expect(p.varianceSource).toBe("state_aware");
    expect(p.notes.join(" ")).toMatch(/these are the shots the run will draw/);
    const r = await estimate(req);
    expect(p.totalShots).toBe(r.sampled!.shots);
    expect(p.shotsPerSetting).toEqual(r.groups.map((g) => g.shots));
    expect(p.shotPlan).toEqual(r.shotPlan);
    // the state-aware plan never exceeds the worst-case bound (Var_g ≤ (Σ_{i∈g}|c_i|)²)
    expect(p.totalShots).toBeLessThanOrEqual(p.shotPlan!.worstCase.totalShots);
  });

  it("a sweep plans every point: the total equals the shots drawn over the grid", async () => {
    const src =
      'OPENQASM 3.0;\ninclude "stdgates.inc";\ninput float[64] t;\nqubit[2] q;\nry(t) q[0];\ncx q[0], q[1];\n';
    const req = {
      circuit: { format: "qasm3" as const, source: src },
      observable: { format: "pauli" as const, terms: "Z0 Z1 + 0.5 X0" },
      sweep: { t: [0.1, 0.9, 1.7] },
      targetPrecision: 0.05,
      seed: 3,
    };
    const p = previewRequest(req);
    const r = await estimate(req);
    expect(p.varianceSource).toBe("state_aware");
    expect(p.totalShots).toBe(r.sweep!.points.reduce((a, pt) => a + pt.sampled!.shots, 0));
    expect(p.shots).toBe(Math.max(...r.sweep!.points.map((pt) => pt.sampled!.shots)));
  });

  it("over the work budget: the worst-case bound, said in the notes, with the work figures", () => {
    const p = previewRequest(cases[0].req, { workBudget: 10 });
    expect(p.varianceSource).toBe("worst_case");
    expect(p.planWork!.budget).toBe(10);
    expect(p.planWork!.estimated).toBeGreaterThan(10);
    // (0.7 + 0.4 + 0.25 + 0.1)² / 0.02² = 5,256.25 → per setting rounded up
    expect(p.shotPlan!.worstCase.totalShots).toBeGreaterThanOrEqual(5257);
    expect(p.totalShots).toBe(p.shotPlan!.worstCase.totalShots);
    expect(p.notes.join(" ")).toMatch(/over the preview's budget/);
  });
});

describe("refused at submission, with the shots it would need", () => {
  it("targetPrecision 1e-300: 422 naming about 10^600 shots (no overflow, no 500)", () => {
    const e = engineError(() => previewRequest({ ...cases0(), targetPrecision: 1e-300 }));
    expect(e.code).toBe("infeasible");
    expect(e.issues[0].path).toEqual(["targetPrecision"]);
    expect(e.message).toMatch(
      /needs about \d\.\d×10\^(599|600|601) shots \(from the state's exact variances\), more than the limit of 100,000,000 per run/,
    );
    expect(engineProblem(e).status).toBe(422);
  });

  it("a state-aware plan above the engine's cap is refused with its count; the worker would refuse the same", async () => {
    // ⟨X⟩ on |0⟩: Var = 1, so N ≈ 1/ε² = 4×10^8 for ε = 5e-5 (the posterior plan differs by a
    // few shots because of its two pseudo-shots), over the cap of 10^8
    const req = {
      circuit: { format: "qasm2" as const, source: qasm2(1, "id q[0];") },
      observable: { format: "pauli" as const, terms: "X0" },
      targetPrecision: 5e-5,
    };
    const e = engineError(() => previewRequest(req));
    const needed = Number(/needs ([\d,]+) shots/.exec(e.message)![1].replace(/,/g, ""));
    expect(needed).toBeGreaterThan(399_000_000);
    expect(needed).toBeLessThan(401_000_000);
    await expect(estimate(req)).rejects.toMatchObject({ code: "infeasible", message: e.message });
    // the worst-case fallback refuses too, and says what it planned from
    const w = engineError(() => previewRequest(req, { workBudget: 0 }));
    expect(w.message).toMatch(/needs 400,000,000 shots \(from worst-case variance bounds/);
  });

  it("readout mitigation with p1Given0 + p0Given1 ≥ 1 (singular or inverting assignment matrix) is refused", async () => {
    const base = { ...cases0(), shots: 1000, mitigateReadout: true };
    for (const readout of [
      { p1Given0: 0.5, p0Given1: 0.5 },
      { p1Given0: 0.7, p0Given1: 0.6 },
    ]) {
      const e = engineError(() => previewRequest({ ...base, noise: { readout } }));
      expect(e.code).toBe("infeasible");
      expect(e.issues.map((i) => i.path.join("."))).toEqual([
        "mitigateReadout",
        "noise.readout.p0Given1",
      ]);
      expect(e.message).toMatch(/readout mitigation needs p1Given0 \+ p0Given1 < 1/);
      await expect(estimate({ ...base, noise: { readout } })).rejects.toMatchObject({
        code: "infeasible",
      });
    }
    // without mitigation the same readout error is a valid (if useless) model
    expect(() =>
      previewRequest({
        ...base,
        mitigateReadout: false,
        noise: { readout: { p1Given0: 0.5, p0Given1: 0.5 } },
      }),
    ).not.toThrow();
  });
});

function cases0() {
  return { circuit: { format: "qasm2" as const, source: SRC }, observable: PAULI };
}

describe("ε² underflow", () => {
  it("an eigenstate with ε = 1e-300 is refused with a finite count in words (no 0/0, no NaN)", () => {
    // Var = 0, but the posterior's two pseudo-shots still need N ≈ (Σ D^{1/3})^{3/2}/ε
    const e = engineError(() =>
      previewRequest({
        circuit: { format: "qasm2", source: qasm2(2, "h q[0];\ncx q[0],q[1];") },
        observable: { format: "pauli", terms: "Z0 Z1 + X0 X1" },
        targetPrecision: 1e-300,
      }),
    );
    expect(e.message).toMatch(/needs about \d\.\d×10\^30\d shots/);
    expect(e.message).not.toMatch(/NaN|Infinity/);
  });
});

describe("sweep results name the point the top level describes", () => {
  it("top level = the point of lowest exact value (ry(t) then ⟨Z⟩ = cos t, Born rule), named in sweep.topLevel", async () => {
    const src =
      'OPENQASM 3.0;\ninclude "stdgates.inc";\ninput float[64] t;\nqubit[1] q;\nry(t) q[0];\n';
    const t = [0.3, 2.9, 1.2];
    const r = await estimate({
      circuit: { format: "qasm3", source: src },
      observable: { format: "pauli", terms: "Z0" },
      sweep: { t },
      shots: 200,
      seed: 1,
    });
    expect(r.sweep!.topLevel).toEqual({ index: 1, rule: "lowest_exact" });
    expect(r.exact.value).toBeCloseTo(Math.cos(2.9), 12);
    expect(r.exact.value).toBe(r.sweep!.points[1].exact);
    expect(r.sampled!.mean).toBe(r.sweep!.points[1].sampled!.mean);
    expect(r.terms[0].exact).toBeCloseTo(Math.cos(2.9), 12);
    expect(r.groups[0].shots).toBe(200);
  });
});

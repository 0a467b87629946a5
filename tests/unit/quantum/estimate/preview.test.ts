/**
 * previewRequest: counts and settings without simulation, the shot plan for a target
 * precision (worst case when the state is over the work budget); same errors as estimate.
 */
import { describe, expect, it } from "vitest";
import {
  EngineError,
  estimateRequestSchema,
  previewRequest,
  previewResultSchema,
} from "@/lib/quantum";

const source =
  'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[3];\ncreg c[3];\nh q[0];\ncx q[0],q[1];\nccx q[0],q[1],q[2];\nmeasure q -> c;\n';
const base = {
  circuit: { format: "qasm2" as const, source },
  observable: { format: "pauli" as const, terms: "Z0 Z1 + 0.5 X0 X1 X2 - 0.2 Y2 + 3" },
};

describe("previewRequest", () => {
  it("gate counts, depth, settings, worst-case shot plan for a target when simulation is over budget (McClean et al. 2016)", () => {
    const p = previewRequest({ ...base, targetPrecision: 0.01 }, { workBudget: 0 });
    expect(() => previewResultSchema.parse(p)).not.toThrow();
    expect(p).toMatchObject({
      qubits: 3,
      gateCounts: { h: 1, cx: 1, ccx: 1 },
      totalGates: 3,
      twoQubitGates: 2,
      depth: 4,
      sweepPoints: 1,
    });
    expect(p.groups.map((g) => g.bases)).toEqual(["ZZY", "XXX"]);
    // (Σ|c_i|, identity excluded)² / ε² = (1 + 0.5 + 0.2)² / 1e-4 = 28,900; split ∝ (1.2, 0.5): 1.2·1.7/1e-4 = 20,400 and 0.5·1.7/1e-4 = 8,500
    expect(p.shotPlan!.worstCase.perSetting).toEqual([20_400, 8_500]);
    expect(p.shots).toBe(28_900);
    expect(p.varianceSource).toBe("worst_case");
    expect(p.notes.join(" ")).toMatch(/worst-case/);
    expect(p.stateBytes).toBe(128);
  });

  it("shots split by worst-case weights or evenly; too few shots rejected", () => {
    expect(previewRequest({ ...base, shots: 1000 }).shotsPerSetting).toEqual([705, 295]);
    expect(previewRequest({ ...base, shots: 1001, shotSplit: "even" }).shotsPerSetting).toEqual([
      501, 500,
    ]);
    expect(() => previewRequest({ ...base, shots: 1 })).toThrow(EngineError);
  });

  it("sweeps multiply the shots; density-matrix memory is 16·4^n", () => {
    const q3 =
      'OPENQASM 3.0;\ninclude "stdgates.inc";\ninput angle t;\nqubit[2] q;\nrx(t) q[0];\ncx q[0], q[1];\n';
    const p = previewRequest({
      circuit: { format: "qasm3", source: q3 },
      observable: { format: "pauli", terms: "ZZ" },
      sweep: { t: [0, 1, 2, 3] },
      shots: 100,
      method: "density_matrix",
    });
    expect(p.sweepPoints).toBe(4);
    expect(p.totalShots).toBe(400);
    expect(p.stateBytes).toBe(16 * 4 ** 2);
  });

  it("matrix observables: one eigenbasis setting, Gershgorin bound", () => {
    const q = 'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[1];\nh q[0];\n';
    const p = previewRequest(
      {
        circuit: { format: "qasm2", source: q },
        observable: {
          format: "matrix",
          real: [
            [1, 0.5],
            [0.5, -1],
          ],
        },
        targetPrecision: 0.1,
      },
      { workBudget: 0 },
    );
    expect(p.groups).toEqual([{ bases: "eigenbasis", terms: [] }]);
    // max row sum 1.5 → 1.5² / 0.01 = 225
    expect(p.shots).toBe(225);
  });

  it("the same errors as estimate", () => {
    expect(() => previewRequest({ ...base, observable: { format: "pauli", terms: "Z7" } })).toThrow(
      "observable acts on qubit 7 but the circuit has 3 qubits",
    );
    expect(() => previewRequest({ ...base, extra: true })).toThrow(/unknown field "extra"/);
  });
});

describe("estimateRequestSchema", () => {
  it("accepts the documented request shape and rejects bad fields", () => {
    expect(
      estimateRequestSchema.safeParse({
        ...base,
        method: "density_matrix",
        shots: 0,
        seed: 42,
        parameters: { a: 1 },
        noise: { depolarizing1q: 0.01, readout: { p1Given0: 0.02 } },
        mitigateReadout: true,
      }).success,
    ).toBe(true);
    const bad = [
      { ...base, shots: -1 },
      { ...base, shots: 2.5 },
      { ...base, seed: -3 },
      { ...base, noise: { depolarizing1q: 1.2 } },
      { ...base, noise: { readout: { p1Given0: 0.1, bogus: 1 } } },
      { ...base, targetPrecision: 0 },
      { ...base, parameters: { a: Number.POSITIVE_INFINITY } },
      {
        ...base,
        sweep: {
          a: Array.from({ length: 101 }, (_, i) => i),
          b: Array.from({ length: 100 }, (_, i) => i),
        },
      },
      { ...base, method: "tensor" },
      { ...base, observable: { format: "pauli", terms: "" } },
      { ...base, observable: { format: "matrix", real: [[1]], imag: [[0]], extra: 1 } },
    ];
    for (const b of bad) expect(estimateRequestSchema.safeParse(b).success).toBe(false);
  });
});

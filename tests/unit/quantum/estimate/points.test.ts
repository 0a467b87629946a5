/**
 * `points`: an explicit list of input bindings in one run — results in request order,
 * equal to separate single-point runs; each point samples on its own reproducible seed
 * stream; bad lists are refused before any simulation with the field path; and
 * `gradient` on a circuit without inputs is refused.
 */
import { describe, expect, it } from "vitest";
import { EngineError, estimate, estimateResultSchema, previewRequest } from "@/lib/quantum";
import { pointSeed } from "@/lib/quantum/estimate/sweep-grid";

const SOURCE = `OPENQASM 3.0;
include "stdgates.inc";
qubit[2] q;
input float a;
input float b;
ry(a) q[0];
cx q[0], q[1];
rx(0.5*b + 0.1) q[1];
`;
const base = {
  circuit: { format: "qasm3" as const, source: SOURCE },
  observable: { format: "pauli" as const, terms: "Z0 Z1 + 0.5 X1" },
};

function rejects(f: () => unknown): EngineError {
  try {
    f();
  } catch (e) {
    if (e instanceof EngineError) return e;
    throw e;
  }
  throw new Error("expected an EngineError");
}

async function rejectsAsync(p: Promise<unknown>): Promise<EngineError> {
  try {
    await p;
  } catch (e) {
    if (e instanceof EngineError) return e;
    throw e;
  }
  throw new Error("expected an EngineError");
}

describe("points", () => {
  it("evaluates every binding in request order, each equal to its own single run", async () => {
    const points = [
      { a: 1.2, b: -0.3 },
      { a: 0.1, b: 2 },
      { a: 1.2, b: -0.3 },
    ];
    const r = await estimate({ ...base, points });
    expect(() => estimateResultSchema.parse(r)).not.toThrow();
    expect(r.sweep!.kind).toBe("points");
    expect(r.sweep!.parameters).toEqual(["a", "b"]);
    expect(r.sweep!.points.map((p) => p.params)).toEqual(points);
    for (const [k, p] of points.entries()) {
      const single = await estimate({ ...base, parameters: p });
      expect(r.sweep!.points[k].exact).toBeCloseTo(single.exact.value, 14);
    }
    // Textbook value: ry(a) then CNOT gives ⟨Z0 Z1⟩ = 1 before rx on q1; rx(φ) makes ⟨Z0Z1⟩ = cos φ, ⟨X1⟩ = 0.
    expect(r.sweep!.points[1].exact).toBeCloseTo(Math.cos(0.5 * 2 + 0.1), 12);
    // the top level describes the point of lowest exact value (sweep.topLevel)
    expect(r.exact.value).toBeCloseTo(r.sweep!.points[r.sweep!.topLevel!.index].exact, 14);
    expect(r.exact.value).toBe(Math.min(...r.sweep!.points.map((p) => p.exact)));
  });

  it("merges each point over `parameters` and lists only the inputs the points set", async () => {
    const r = await estimate({
      ...base,
      parameters: { b: 0.4 },
      points: [{ a: 0 }, { a: Math.PI }],
    });
    expect(r.sweep!.parameters).toEqual(["a"]);
    expect(r.sweep!.points[1].params).toEqual({ a: Math.PI, b: 0.4 });
  });

  it("samples each point on its own seed stream, reproducibly (point k uses pointSeed(seed, k))", async () => {
    const points = [
      { a: 0.7, b: 0.2 },
      { a: 0.7, b: 0.2 },
    ];
    const r1 = await estimate({ ...base, points, shots: 4000, seed: 11 });
    const r2 = await estimate({ ...base, points, shots: 4000, seed: 11 });
    expect(r2.sweep!.points).toEqual(r1.sweep!.points);
    // Same binding, different streams: the two estimates differ.
    expect(r1.sweep!.points[0].sampled!.mean).not.toBe(r1.sweep!.points[1].sampled!.mean);
    const second = await estimate({
      ...base,
      parameters: points[1],
      shots: 4000,
      seed: pointSeed(11, 1),
    });
    expect(r1.sweep!.points[1].sampled!.mean).toBe(second.sampled!.mean);
  });

  it("refuses a missing input, an extra input, sweep together with points, and an empty list, with paths", () => {
    let e = rejects(() => previewRequest({ ...base, points: [{ a: 1, b: 2 }, { a: 1 }] }));
    expect(e.issues[0].path).toEqual(["points", 1, "b"]);
    expect(e.message).toMatch(/points\[1\] has no value for input 'b'/);
    e = rejects(() => previewRequest({ ...base, points: [{ a: 1, b: 2, c: 3 }] }));
    expect(e.issues[0].path).toEqual(["points", 0, "c"]);
    e = rejects(() => previewRequest({ ...base, points: [{ a: 1, b: 2 }], sweep: { a: [1] } }));
    expect(e.issues[0].path).toEqual(["points"]);
    e = rejects(() => previewRequest({ ...base, points: [] }));
    expect(e.issues[0].path).toEqual(["points"]);
  });

  it("refuses non-finite and non-numeric values with their path", () => {
    for (const bad of [Number.NaN, Number.POSITIVE_INFINITY, "1"]) {
      const e = rejects(() =>
        previewRequest({
          ...base,
          points: [
            { a: 1, b: 2 },
            { a: 1, b: 2 },
            { a: 1, b: 2 },
            { a: bad, b: 2 },
          ],
        }),
      );
      expect(e.issues[0].path).toEqual(["points", 3, "a"]);
    }
  });

  it("refuses more than 10,000 points", () => {
    const points = Array.from({ length: 10_001 }, () => ({ a: 0, b: 0 }));
    const e = rejects(() => previewRequest({ ...base, points }));
    expect(e.issues[0].path).toEqual(["points"]);
    expect(e.message).toMatch(/10000/);
  });

  it("refuses at submission a point where an angle is not finite, naming the point", () => {
    const source = SOURCE.replace("ry(a)", "ry(log(a))");
    const e = rejects(() =>
      previewRequest({
        ...base,
        circuit: { format: "qasm3", source },
        points: [
          { a: 1, b: 0 },
          { a: -1, b: 0 },
        ],
      }),
    );
    expect(e.issues[0].path).toEqual(["points", 1]);
  });

  it("preview counts every point's shots", () => {
    const p = previewRequest({
      ...base,
      points: [
        { a: 1, b: 2 },
        { a: 0, b: 0 },
        { a: 3, b: 1 },
      ],
      shots: 1000,
    });
    expect(p.sweepPoints).toBe(3);
    expect(p.totalShots).toBe(3000);
  });
});

describe("gradient requests", () => {
  it("refuses gradient on a circuit without inputs", async () => {
    const q2 = 'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[1];\nh q[0];\n';
    const e = await rejectsAsync(
      estimate({
        circuit: { format: "qasm2", source: q2 },
        observable: { format: "pauli", terms: "Z0" },
        gradient: true,
      }),
    );
    expect(e.issues[0].path).toEqual(["gradient"]);
    expect(
      rejects(() =>
        previewRequest({
          circuit: { format: "qasm2", source: q2 },
          observable: { format: "pauli", terms: "Z0" },
          gradient: true,
        }),
      ).issues[0].path,
    ).toEqual(["gradient"]);
  });

  it("preview plans the shifted circuits: two per rotation angle, four per controlled rotation, each with the run's shots", () => {
    const source = `OPENQASM 3.0;\ninclude "stdgates.inc";\nqubit[2] q;\ninput float a;\nrx(a) q[0];\ncry(2*a) q[0], q[1];\nrz(0.3) q[1];\n`;
    const p = previewRequest({
      circuit: { format: "qasm3", source },
      observable: { format: "pauli", terms: "Z0 Z1" },
      shots: 500,
      gradient: true,
      points: [{ a: 0.1 }, { a: 0.2 }],
    });
    expect(p.gradient).toEqual({ inputs: ["a"], shiftedCircuits: 6, shotsPerPoint: 3000 });
    expect(p.totalShots).toBe(2 * (500 + 3000));
  });
});

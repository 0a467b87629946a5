/**
 * estimate(): the engine contract — textbook values end to end, qubit order,
 * seeds, shot planning, noise, sweeps, validation, progress and cancellation.
 */
import { describe, expect, it } from "vitest";
import { EngineError, estimate, estimateResultSchema, type EstimateResult } from "@/lib/quantum";

const qasm2 = (n: number, body: string, creg = false) =>
  `OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[${n}];\n${creg ? `creg c[${n}];\n` : ""}${body}\n`;
const BELL = qasm2(2, "h q[0];\ncx q[0],q[1];");
const R2 = Math.SQRT2;

async function rejects(p: Promise<unknown>): Promise<EngineError> {
  try {
    await p;
  } catch (e) {
    if (e instanceof EngineError) return e;
    throw e;
  }
  throw new Error("expected an EngineError");
}

describe("textbook values through the whole engine", () => {
  it("Bell state: CHSH √2(ZZ + XX) = 2√2 (Tsirelson, Cirel'son 1980), spectrum ±2√2, result matches the schema", async () => {
    const r = await estimate({
      circuit: { format: "qasm2", source: BELL },
      observable: { format: "pauli", terms: `${R2} ZZ + ${R2} XX` },
      shots: 2000,
      seed: 7,
    });
    expect(r.ideal.value).toBeCloseTo(2 * R2, 12);
    expect(r.exact.value).toBeCloseTo(2 * R2, 12);
    expect(r.spectrum!.min).toBeCloseTo(-2 * R2, 9);
    expect(r.spectrum!.max).toBeCloseTo(2 * R2, 9);
    // Bell state gives ±1-valued ZZ and XX with no spread: every shot agrees, the mean is
    // exact and the interval is small but not zero (1000 identical shots cannot exclude a
    // flip rate of ~1/1000), clipped at the largest possible value 2√2.
    expect(r.sampled!.mean).toBeCloseTo(2 * R2, 12);
    expect(r.sampled!.stdErr).toBeGreaterThan(0);
    expect(r.sampled!.stdErr).toBeLessThan(0.01);
    expect(r.sampled!.ci95[0]).toBeLessThan(2 * R2);
    expect(r.sampled!.ci95[1]).toBeCloseTo(2 * R2, 12);
    expect(Object.keys(r.groups[0].counts!).sort()).toEqual(["00", "11"]);
    expect(() => estimateResultSchema.parse(r)).not.toThrow();
  });

  it("⟨YY⟩ = −1 on the Bell state (textbook value)", async () => {
    const r = await estimate({
      circuit: { format: "qasm2", source: BELL },
      observable: { format: "pauli", terms: "Y0 Y1" },
    });
    expect(r.exact.value).toBeCloseTo(-1, 12);
  });

  it("qubit order: x on qubit 0 → ⟨Z0⟩ = −1, ⟨Z1⟩ = +1, counts key '10' (qubit 0 first)", async () => {
    const r = await estimate({
      circuit: { format: "qasm2", source: qasm2(2, "x q[0];") },
      observable: { format: "pauli", terms: "ZI + 2 IZ" },
      shots: 50,
      seed: 1,
    });
    expect(r.terms.map((t) => [t.pauli, t.exact])).toEqual([
      ["ZI", -1],
      ["IZ", 1],
    ]);
    expect(r.groups[0].counts).toEqual({ "10": 50 });
    expect(r.exact.value).toBe(1);
  });

  it("one qubit: ⟨Z⟩ = p(0) − p(1) = cos θ after ry(θ) (Born rule)", async () => {
    const r = await estimate({
      circuit: { format: "qasm2", source: qasm2(1, "ry(0.9) q[0];") },
      observable: { format: "pauli", terms: "Z0" },
    });
    expect(r.exact.value).toBeCloseTo(Math.cos(0.9), 14);
  });
});

describe("seeds and shots", () => {
  const req = {
    circuit: {
      format: "qasm2" as const,
      source: qasm2(2, "ry(1.1) q[0];\ncx q[0],q[1];\nrx(0.4) q[1];"),
    },
    observable: { format: "pauli" as const, terms: "Z0 Z1 + 0.5 X1 - 0.2 Y0" },
    shots: 3000,
  };

  it("a missing seed is chosen and returned; re-running with it reproduces every sampled figure", async () => {
    const a = await estimate(req);
    expect(Number.isInteger(a.seed)).toBe(true);
    const b = await estimate({ ...req, seed: a.seed });
    expect(b.sampled).toEqual(a.sampled);
    expect(b.groups).toEqual(a.groups);
  });

  it("targetPrecision chooses the shots (state-aware plan ≤ worst case) and lands near the target", async () => {
    const r = await estimate({ ...req, shots: undefined, targetPrecision: 0.01, seed: 11 });
    expect(r.shotPlan!.stateAware!.totalShots).toBe(r.sampled!.shots);
    expect(r.shotPlan!.stateAware!.totalShots).toBeLessThanOrEqual(
      r.shotPlan!.worstCase.totalShots,
    );
    // McClean et al. 2016: worst case (Σ|c_i|)²/ε² = 1.7²/1e-4 = 28,900 (rounded up per setting)
    expect(r.shotPlan!.worstCase.totalShots).toBeGreaterThanOrEqual(28_900);
    expect(r.shotPlan!.worstCase.totalShots).toBeLessThanOrEqual(28_900 + r.groups.length);
    expect(r.sampled!.stdErr).toBeGreaterThan(0.009);
    expect(r.sampled!.stdErr).toBeLessThan(0.011);
  });

  it("shots and targetPrecision together are rejected", async () => {
    const e = await rejects(estimate({ ...req, targetPrecision: 0.1 }));
    expect(e.code).toBe("invalid_request");
    expect(e.issues[0].path).toEqual(["targetPrecision"]);
  });

  it("even split and convergence series", async () => {
    const r = await estimate({ ...req, shotSplit: "even", seed: 2 });
    const shots = r.groups.map((g) => g.shots);
    expect(Math.max(...shots) - Math.min(...shots)).toBeLessThanOrEqual(1);
    const c = r.sampled!.convergence;
    expect(c[c.length - 1].shots).toBe(3000);
  });
});

describe("noise (density-matrix method)", () => {
  it("depolarizing: exact is biased toward 0, ideal is not; statevector rejects gate noise", async () => {
    const base = {
      circuit: { format: "qasm2" as const, source: BELL },
      observable: { format: "pauli" as const, terms: "ZZ" },
    };
    const r = await estimate({ ...base, method: "density_matrix", noise: { depolarizing2q: 0.1 } });
    expect(r.ideal.value).toBeCloseTo(1, 12);
    // N&C depolarizing ρ → (1−p)ρ + p I/4 after cx: ⟨ZZ⟩ = 1 − p
    expect(r.exact.value).toBeCloseTo(0.9, 12);
    const e = await rejects(estimate({ ...base, noise: { depolarizing2q: 0.1 } }));
    expect(e.code).toBe("unsupported");
    expect(e.issues[0].path).toEqual(["noise", "depolarizing2q"]);
  });

  it("readout error biases sampled ⟨Z⟩ as (e1−e0) + (1−e0−e1)⟨Z⟩; mitigation recovers it; exact ignores readout", async () => {
    const r = await estimate({
      circuit: { format: "qasm2", source: qasm2(1, "ry(0.5) q[0];") },
      observable: { format: "pauli", terms: "Z0" },
      shots: 100_000,
      seed: 5,
      noise: { readout: { p1Given0: 0.05, p0Given1: 0.1 } },
      mitigateReadout: true,
    });
    const z = Math.cos(0.5);
    expect(r.exact.value).toBeCloseTo(z, 12);
    expect(Math.abs(r.sampled!.mean - (0.05 + 0.85 * z))).toBeLessThan(4 * r.sampled!.stdErr);
    expect(Math.abs(r.mitigated!.mean - z)).toBeLessThan(4 * r.mitigated!.stdErr);
  });

  it("mid-circuit measurement needs the density-matrix method", async () => {
    const src = qasm2(2, "h q[0];\nmeasure q[0] -> c[0];\ncx q[0],q[1];", true);
    const obs = { format: "pauli" as const, terms: "Z0 Z1 + X0" };
    expect(
      (await rejects(estimate({ circuit: { format: "qasm2", source: src }, observable: obs })))
        .code,
    ).toBe("unsupported");
    const r = await estimate({
      circuit: { format: "qasm2", source: src },
      observable: obs,
      method: "density_matrix",
    });
    // measuring q0 then cx: ZZ stays 1 (perfect correlation), X0 coherence destroyed
    expect(r.exact.value).toBeCloseTo(1, 12);
  });
});

describe("matrix observables", () => {
  it("sampled in the eigenbasis; ideal from dense algebra", async () => {
    const r = await estimate({
      circuit: { format: "qasm2", source: qasm2(1, "h q[0];") },
      observable: {
        format: "matrix",
        real: [
          [1, 0.5],
          [0.5, -1],
        ],
        imag: [
          [0, 0],
          [0, 0],
        ],
      },
      shots: 20_000,
      seed: 3,
    });
    // |+⟩: ⟨H⟩ = (1 + 0.5 + 0.5 − 1)/2 = 0.5
    expect(r.exact.value).toBeCloseTo(0.5, 12);
    expect(r.groups[0].bases).toBe("eigenbasis");
    expect(r.spectrum!.max).toBeCloseTo(Math.sqrt(1.25), 12);
    expect(Math.abs(r.sampled!.mean - 0.5)).toBeLessThan(4 * r.sampled!.stdErr);
    expect(r.terms).toEqual([]);
  });

  it("non-Hermitian matrix: the error names the entries", async () => {
    const e = await rejects(
      estimate({
        circuit: { format: "qasm2", source: qasm2(1, "h q[0];") },
        observable: {
          format: "matrix",
          real: [
            [1, 2],
            [3, 1],
          ],
        },
      }),
    );
    expect(e.code).toBe("not_hermitian");
    expect(e.message).toMatch(/entry \(0,1\) = 2 but conjugate of entry \(1,0\) = 3; mismatch 1/);
  });
});

describe("sweeps", () => {
  const q3 = `OPENQASM 3.0;\ninclude "stdgates.inc";\ninput float[64] a;\ninput float[64] b;\nqubit[1] q;\nry(a) q[0];\nrz(b) q[0];\n`;
  it("grid = Cartesian product, first name slowest; each point's ideal matches cos(a)", async () => {
    const r: EstimateResult = await estimate({
      circuit: { format: "qasm3", source: q3 },
      observable: { format: "pauli", terms: "Z0 + X0" },
      sweep: { a: [0, 0.5, 1], b: [0, Math.PI] },
      shots: 200,
      seed: 4,
    });
    expect(r.sweep!.parameters).toEqual(["a", "b"]);
    expect(r.sweep!.points.map((p) => p.params)).toEqual([
      { a: 0, b: 0 },
      { a: 0, b: Math.PI },
      { a: 0.5, b: 0 },
      { a: 0.5, b: Math.PI },
      { a: 1, b: 0 },
      { a: 1, b: Math.PI },
    ]);
    for (const p of r.sweep!.points) {
      // ry(a) then rz(b): ⟨Z⟩ = cos a, ⟨X⟩ = sin a cos b
      expect(p.ideal).toBeCloseTo(
        Math.cos(p.params.a) + Math.sin(p.params.a) * Math.cos(p.params.b),
        12,
      );
      expect(p.sampled!.shots).toBe(200);
    }
    // the top level describes the point of lowest exact value (sweep.topLevel)
    expect(r.exact.value).toBeCloseTo(r.sweep!.points[r.sweep!.topLevel!.index].exact, 14);
    expect(r.exact.value).toBe(Math.min(...r.sweep!.points.map((p) => p.exact)));
  });

  it("sweeping a name that is not an input is rejected with its path", async () => {
    const e = await rejects(
      estimate({
        circuit: { format: "qasm3", source: q3 },
        observable: { format: "pauli", terms: "Z0" },
        parameters: { a: 1, b: 2 },
        sweep: { c: [1] },
      }),
    );
    expect(e.code).toBe("invalid_request");
    expect(e.issues[0].path).toEqual(["sweep", "c"]);
  });
});

describe("validation and limits", () => {
  it("zod issues become invalid_request with paths; unknown fields are rejected", async () => {
    const e = await rejects(
      estimate({
        circuit: { format: "qasm2", source: BELL },
        observable: { format: "pauli", terms: "Z0" },
        shots: 1.5,
        colour: "red",
      }),
    );
    expect(e.code).toBe("invalid_request");
    expect(e.issues.map((i) => i.path)).toEqual(expect.arrayContaining([["shots"], ["colour"]]));
    const f = await rejects(
      estimate({
        circuit: { format: "qasm2", source: BELL },
        observable: { format: "pauli", terms: "Z0" },
        noise: { readout: { p1Given0: 1.5 } },
      }),
    );
    expect(f.issues[0].path).toEqual(["noise", "readout", "p1Given0"]);
  });

  it("too many qubits for the method", async () => {
    const e = await rejects(
      estimate({
        circuit: { format: "qasm2", source: qasm2(13, "h q[0];") },
        observable: { format: "pauli", terms: "Z0" },
        method: "density_matrix",
      }),
    );
    expect(e.code).toBe("too_large");
    expect(e.message).toBe(
      "the circuit has 13 qubits; the density-matrix method handles at most 12",
    );
    const f = await rejects(
      estimate({
        circuit: { format: "qasm2", source: qasm2(27, "h q[0];") },
        observable: { format: "pauli", terms: "Z0" },
      }),
    );
    expect(f.code).toBe("too_large");
  });

  it("observable beyond the circuit names the qubit", async () => {
    const e = await rejects(
      estimate({
        circuit: { format: "qasm2", source: BELL },
        observable: { format: "pauli", terms: "Z0 + X5" },
      }),
    );
    expect(e.message).toBe("observable acts on qubit 5 but the circuit has 2 qubits");
    expect(e.issues[0]).toMatchObject({ path: ["observable", "terms"], line: 1, column: 6 });
  });
});

describe("progress and cancellation", () => {
  const big = {
    circuit: { format: "qasm2" as const, source: qasm2(10, "h q;\ncx q[0],q[1];") },
    observable: { format: "pauli" as const, terms: "Z0 Z1 + X0 X1 + Y2" },
  };

  it("progress starts at 0 ('parse'), is non-decreasing, throttled, and ends at 1 ('done')", async () => {
    const seen: [number, string, number][] = [];
    await estimate(
      { ...big, shots: 20_000_000, seed: 1 },
      { onProgress: (f, p) => seen.push([f, p, performance.now()]) },
    );
    expect(seen[0].slice(0, 2)).toEqual([0, "parse"]);
    expect(seen[seen.length - 1].slice(0, 2)).toEqual([1, "done"]);
    for (let k = 1; k < seen.length; k++) expect(seen[k][0]).toBeGreaterThanOrEqual(seen[k - 1][0]);
    // intermediate reports are at least 100 ms apart
    for (let k = 2; k < seen.length - 1; k++)
      expect(seen[k][2] - seen[k - 1][2]).toBeGreaterThanOrEqual(99);
    expect(seen.length).toBeGreaterThan(2);
  }, 60_000); // 20 million shots: seconds on a loaded machine

  it("an AbortSignal fired by a timer mid-run cancels it", async () => {
    const ctrl = new AbortController();
    setTimeout(() => ctrl.abort(), 30);
    const e = await rejects(
      estimate({ ...big, shots: 50_000_000, seed: 1 }, { signal: ctrl.signal }),
    );
    expect(e.code).toBe("canceled");
  });

  it("an already-aborted signal cancels before any work", async () => {
    const ctrl = new AbortController();
    ctrl.abort();
    expect((await rejects(estimate({ ...big }, { signal: ctrl.signal }))).code).toBe("canceled");
  });
});

describe("spectrum.lowest and spectrum.groundWeight through the whole engine", () => {
  it("−Z0Z1 on |00⟩ and on H⊗I|00⟩: 2-fold ground level, weight 1 then ½ (hand-computed)", async () => {
    const run = (source: string, method: "statevector" | "density_matrix" = "statevector") =>
      estimate({
        circuit: { format: "qasm2", source },
        observable: { format: "pauli", terms: "-Z0 Z1" },
        shots: 0,
        seed: 1,
        method,
      });
    const head = 'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[2];\n';
    const a = await run(head);
    expect(a.spectrum!.lowest!.map((v) => Math.round(v * 1e9) / 1e9)).toEqual([-1, -1, 1, 1]);
    expect(a.spectrum!.groundDegeneracy).toBe(2);
    expect(a.spectrum!.groundWeight).toBeCloseTo(1, 12);
    // (|00⟩ + |10⟩)/√2: half the weight on |00⟩ (ground), half on |10⟩ (excited).
    const b = await run(`${head}h q[0];\n`, "density_matrix");
    expect(b.spectrum!.groundWeight).toBeCloseTo(0.5, 12);
    expect(estimateResultSchema.parse(b).spectrum!.groundWeight).toBeCloseTo(0.5, 12);
  });

  it("matrix observable diag(−1, 0, 0, 2) on |00⟩: lowest = the diagonal, weight 1 (hand-computed)", async () => {
    const r = await estimate({
      circuit: { format: "qasm2", source: 'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[2];\n' },
      observable: {
        format: "matrix",
        real: [
          [-1, 0, 0, 0],
          [0, 0, 0, 0],
          [0, 0, 0, 0],
          [0, 0, 0, 2],
        ],
      },
      shots: 0,
      seed: 1,
    });
    expect(r.spectrum!.lowest!.map((v) => Math.round(v * 1e9) / 1e9 + 0)).toEqual([-1, 0, 0, 2]);
    expect(r.spectrum!.groundDegeneracy).toBe(1);
    expect(r.spectrum!.groundWeight).toBeCloseTo(1, 12);
  });
});

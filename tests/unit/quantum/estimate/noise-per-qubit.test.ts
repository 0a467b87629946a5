/**
 * Noise per qubit and per gate kind through estimate(): per-qubit readout rates on sampled
 * outcomes (Pauli settings and eigenbasis outcomes), their mitigation, and the refusals.
 * Reference: a qubit read with assignment errors e0 = p(1|0), e1 = p(0|1) reports
 * ⟨Z⟩_read = (e1 − e0) + (1 − e0 − e1)⟨Z⟩ (common practice; the tensored readout model).
 */
import { describe, expect, it } from "vitest";
import { EngineError, estimate } from "@/lib/quantum";
import { convolveReadout } from "@/lib/quantum/sampling/readout";

const src = (n: number, body: string) =>
  `OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[${n}];\n${body}\n`;
const zRead = (e0: number, e1: number, z: number) => e1 - e0 + (1 - e0 - e1) * z;

async function rejects(p: Promise<unknown>): Promise<EngineError> {
  try {
    await p;
  } catch (e) {
    if (e instanceof EngineError) return e;
    throw e;
  }
  throw new Error("expected an EngineError");
}

describe("per-qubit readout", () => {
  it("convolves each index bit with the rates of its own qubit", () => {
    // True outcome: qubit 0 = 1, qubit 1 = 0 (index bit k = qubit k → index 1).
    const p = Float64Array.from([0, 1, 0, 0]);
    convolveReadout(p, {
      e0: 0,
      e1: 0,
      qubits: [
        { e0: 0, e1: 0.2 },
        { e0: 0.1, e1: 0 },
      ],
    });
    expect(Array.from(p)).toEqual(
      [0.2 * 0.9, 0.8 * 0.9, 0.2 * 0.1, 0.8 * 0.1].map((x) => expect.closeTo(x, 15)),
    );
  });

  it("sampled Pauli values follow each qubit's rates; mitigation undoes them", async () => {
    const r = await estimate({
      circuit: { format: "qasm2", source: src(2, "x q[0];") },
      observable: { format: "pauli", terms: "Z0 + Z1" },
      shots: 200_000,
      seed: 5,
      mitigateReadout: true,
      noise: { readout: { p1Given0: 0.05, qubits: { "0": { p0Given1: 0.2 } } } },
    });
    const expected = zRead(0.05, 0.2, -1) + zRead(0.05, 0, 1);
    expect(r.exact.value).toBeCloseTo(0, 12);
    expect(Math.abs(r.sampled!.mean - expected)).toBeLessThan(5 * r.sampled!.stdErr);
    expect(Math.abs(r.mitigated!.mean - 0)).toBeLessThan(5 * r.mitigated!.stdErr);
  });

  it("eigenbasis outcomes flip the digit of the right qubit (qubit 0 = most significant digit)", async () => {
    const r = await estimate({
      circuit: { format: "qasm2", source: src(2, "x q[0];") },
      // Z on qubit 0: kron(Z, I), qubit 0 the leftmost factor.
      observable: {
        format: "matrix",
        real: [
          [1, 0, 0, 0],
          [0, 1, 0, 0],
          [0, 0, -1, 0],
          [0, 0, 0, -1],
        ],
      },
      shots: 200_000,
      seed: 9,
      mitigateReadout: true,
      noise: { readout: { qubits: { "0": { p1Given0: 0.3 } } } },
    });
    // Outcome k = the k-th eigenvalue (−1, −1, 1, 1); the state gives k = 0 ("00"). Reading
    // qubit 0's digit wrong with probability 0.3 turns it into k = 2 (eigenvalue +1); the
    // other digit would keep −1.
    expect(Math.abs(r.sampled!.mean - (-0.7 + 0.3))).toBeLessThan(5 * r.sampled!.stdErr);
    expect(r.sampled!.stdErr).toBeGreaterThan(0);
    expect(Math.abs(r.mitigated!.mean - -1)).toBeLessThan(5 * r.mitigated!.stdErr);
  });
});

describe("refusals name the field", () => {
  it("a readout qubit the circuit lacks", async () => {
    const e = await rejects(
      estimate({
        circuit: { format: "qasm2", source: src(3, "h q[0];") },
        observable: { format: "pauli", terms: "Z0" },
        noise: { readout: { qubits: { "5": { p1Given0: 0.1 } } } },
      }),
    );
    expect(e.issues[0].path).toEqual(["noise", "readout", "qubits", "5"]);
    expect(e.issues[0].message).toContain("names qubit 5 but the circuit has 3 qubits");
  });

  it("a readout key that is not a qubit index", async () => {
    const e = await rejects(
      estimate({
        circuit: { format: "qasm2", source: src(1, "h q[0];") },
        observable: { format: "pauli", terms: "Z0" },
        noise: { readout: { qubits: { q0: { p1Given0: 0.1 } } } },
      }),
    );
    expect(e.issues[0].path.slice(0, 3)).toEqual(["noise", "readout", "qubits"]);
  });

  it("per-gate or idle noise with the statevector method", async () => {
    const base = {
      circuit: { format: "qasm2" as const, source: src(2, "cx q[0], q[1];") },
      observable: { format: "pauli" as const, terms: "Z0" },
    };
    const a = await rejects(estimate({ ...base, noise: { gates: { cx: { depolarizing: 0.1 } } } }));
    expect(a.code).toBe("unsupported");
    expect(a.issues[0].path).toEqual(["noise", "gates", "cx", "depolarizing"]);
    const b = await rejects(estimate({ ...base, noise: { idle: { phaseDamping: 0.1 } } }));
    expect(b.issues[0].path).toEqual(["noise", "idle", "phaseDamping"]);
  });

  it("a rate outside [0, 1] in an override", async () => {
    const e = await rejects(
      estimate({
        circuit: { format: "qasm2", source: src(2, "cx q[0], q[1];") },
        observable: { format: "pauli", terms: "Z0" },
        method: "density_matrix",
        noise: { gates: { cx: { depolarizing: 1.5 } } },
      }),
    );
    expect(e.issues[0].path).toEqual(["noise", "gates", "cx", "depolarizing"]);
  });

  it("old noise objects mean what they meant: an empty override and no idle field change nothing", async () => {
    const req = {
      circuit: { format: "qasm2" as const, source: src(2, "h q[0];\ncx q[0], q[1];") },
      observable: { format: "pauli" as const, terms: "Z0 Z1 + X0" },
      method: "density_matrix" as const,
    };
    const old = await estimate({
      ...req,
      noise: { depolarizing1q: 0.02, depolarizing2q: 0.05, amplitudeDamping: 0.01 },
    });
    const same = await estimate({
      ...req,
      noise: {
        depolarizing1q: 0.02,
        depolarizing2q: 0.05,
        amplitudeDamping: 0.01,
        gates: { cx: {} },
      },
    });
    const override = await estimate({
      ...req,
      noise: {
        depolarizing1q: 0.02,
        depolarizing2q: 0.9,
        amplitudeDamping: 0.01,
        gates: { cx: { depolarizing: 0.05 } },
      },
    });
    expect(same.exact.value).toBe(old.exact.value);
    expect(override.exact.value).toBeCloseTo(old.exact.value, 14);
  });
});

describe("gradients see the same per-gate and idle noise", () => {
  it("the exact gradient equals central differences of the noisy exact value (modified gates included)", async () => {
    const source = `OPENQASM 3.0;\ninclude "stdgates.inc";\ninput float t;\nqubit[3] q;\nh q[0];\nctrl @ rx(2*t) q[0], q[1];\ninv @ ry(t) q[2];\ncx q[1], q[2];\n`;
    const base = {
      circuit: { format: "qasm3" as const, source },
      observable: { format: "pauli" as const, terms: "Z1 + X0 Z2 + Y2" },
      method: "density_matrix" as const,
      noise: {
        depolarizing1q: 0.01,
        gates: { cx: { depolarizing: 0.2 } },
        idle: { amplitudeDamping: 0.05 },
      },
    };
    const r = await estimate({ ...base, parameters: { t: 0.7 }, gradient: true });
    const h = 1e-5;
    const f = async (t: number) => (await estimate({ ...base, parameters: { t } })).exact.value;
    const central = ((await f(0.7 + h)) - (await f(0.7 - h))) / (2 * h);
    expect(r.gradient!.t.exact).toBeCloseTo(central, 7);
  });
});

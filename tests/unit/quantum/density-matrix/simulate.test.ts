/**
 * simulateDensityMatrix: the noise semantics (noise once per top-level gate,
 * `id` is a gate, barrier is not, depolarizing2q for k ≥ 2), measurement/reset handling,
 * agreement with the statevector without noise, guards and noise validation.
 */
import { describe, expect, it } from "vitest";
import { EngineError } from "@/lib/quantum/errors";
import { simulateDensityMatrix } from "@/lib/quantum/density-matrix/simulate";
import { densityFromState, diagonal } from "@/lib/quantum/density-matrix/state";
import { validateNoiseModel } from "@/lib/quantum/noise/validate";
import { simulateStatevector } from "@/lib/quantum/statevector/simulate";
import type { Circuit, CircuitOp, GateApplication } from "@/lib/quantum/types";
import { CX } from "../../../bench/ansatz";
import { makeRng, randomCircuit } from "../statevector/support/random-gates";

const s = Math.SQRT1_2;
const H = Float64Array.of(s, 0, s, 0, s, 0, -s, 0);
const X = Float64Array.of(0, 0, 1, 0, 1, 0, 0, 0);
const I2 = Float64Array.of(1, 0, 0, 0, 0, 0, 1, 0);

function gate(name: string, qubits: number[], parts: GateApplication[], line = 1): CircuitOp {
  return { kind: "gate", name, qubits, params: [], parts, line };
}
const g1 = (name: string, q: number, m: Float64Array, line = 1): CircuitOp =>
  gate(name, [q], [{ name, qubits: [q], matrix: m }], line);

function circuit(n: number, ops: CircuitOp[]): Circuit {
  return {
    numQubits: n,
    numClbits: n,
    ops,
    qubitLabels: [],
    hasMidCircuitMeasurement: false,
    hasReset: false,
  };
}

function engineError(fn: () => unknown): EngineError {
  try {
    fn();
  } catch (e) {
    if (e instanceof EngineError) return e;
    throw e;
  }
  throw new Error("expected an EngineError");
}

/** ⟨X⟩ of qubit 0 of a 1-qubit ρ: 2 Re ρ01. */
const xOf = (re: Float64Array): number => 2 * re[1];

describe("simulateDensityMatrix — noise semantics", () => {
  it("applies the noise ONCE after a top-level gate, however many parts it has", () => {
    // a user gate made of h, x, x (= h): ⟨X⟩ = 1 before noise; depolarizing p → (1 − p)
    const op = gate(
      "mygate",
      [0],
      [
        { name: "h", qubits: [0], matrix: H },
        { name: "x", qubits: [0], matrix: X },
        { name: "x", qubits: [0], matrix: X },
      ],
    );
    const rho = simulateDensityMatrix(circuit(1, [op]), { depolarizing1q: 0.2 });
    expect(xOf(rho.re)).toBeCloseTo(0.8, 14);
  });

  it("treats id as a gate (noise applies) and barrier as nothing", () => {
    const ops: CircuitOp[] = [
      g1("x", 0, X),
      { kind: "barrier", qubits: [0], line: 2 },
      g1("id", 0, I2, 3),
    ];
    // amplitude damping γ after x and after id: P(1) = (1 − γ)² (N&C §8.3.5 population decay)
    const rho = simulateDensityMatrix(circuit(1, ops), { amplitudeDamping: 0.1 });
    expect(diagonal(rho)[1]).toBeCloseTo(0.81, 14);
  });

  it("uses depolarizing2q for gates on 2 or more qubits and depolarizing1q for 1 qubit", () => {
    // Bell state then depolarizing2q p on both qubits: ρ → (1−p)ρ + p·I/4, so ⟨ZZ⟩ = 1 − p
    const bell = [
      g1("h", 0, H),
      gate("cx", [0, 1], [{ name: "cx", qubits: [0, 1], matrix: CX }], 2),
    ];
    const rho = simulateDensityMatrix(circuit(2, bell), { depolarizing1q: 0, depolarizing2q: 0.3 });
    const p = diagonal(rho);
    expect(p[0] + p[3] - p[1] - p[2]).toBeCloseTo(0.7, 14);
    // a 3-qubit op (one part on 2 of its qubits) also takes depolarizing2q, on all 3 qubits
    const op3 = gate("g3", [0, 1, 2], [{ name: "cx", qubits: [0, 1], matrix: CX }]);
    const rho3 = simulateDensityMatrix(circuit(3, [op3]), {
      depolarizing1q: 0.9,
      depolarizing2q: 0.4,
    });
    expect(diagonal(rho3)[0]).toBeCloseTo(0.6 + 0.4 / 8, 14);
  });

  it("ignores final measurements but dephases at mid-circuit measurements; reset → |0⟩", () => {
    const plus = simulateDensityMatrix(
      circuit(1, [g1("h", 0, H), { kind: "measure", qubit: 0, clbit: 0, line: 2 }]),
      undefined,
    );
    expect(xOf(plus.re)).toBeCloseTo(1, 14);
    // h; measure; h  →  the measurement makes ρ = I/2, so the second h leaves P(0) = 1/2
    const mid = simulateDensityMatrix(
      circuit(1, [
        g1("h", 0, H),
        { kind: "measure", qubit: 0, clbit: 0, line: 2 },
        g1("h", 0, H, 3),
      ]),
      undefined,
    );
    expect(diagonal(mid)[0]).toBeCloseTo(0.5, 14);
    const reset = simulateDensityMatrix(
      circuit(1, [g1("x", 0, X), { kind: "reset", qubit: 0, line: 2 }]),
      undefined,
    );
    expect(diagonal(reset)[0]).toBeCloseTo(1, 14);
  });

  it("without state noise equals |ψ⟩⟨ψ| of the statevector method (20 random circuits)", () => {
    for (let i = 0; i < 20; i++) {
      const rng = makeRng(600 + i);
      const c = randomCircuit(rng, 1 + (i % 5), 8);
      const rho = simulateDensityMatrix(c, { readout: { p0Given1: 0.2 } });
      const pure = densityFromState(simulateStatevector(c));
      for (let j = 0; j < rho.re.length; j++) {
        expect(Math.abs(rho.re[j] - pure.re[j])).toBeLessThan(1e-12);
        expect(Math.abs(rho.im[j] - pure.im[j])).toBeLessThan(1e-12);
      }
    }
  });
});

describe("simulateDensityMatrix — guards", () => {
  it("refuses more than 12 qubits, stating the memory (4^n × 16 B)", () => {
    const e = engineError(() => simulateDensityMatrix(circuit(13, []), undefined));
    expect(e.code).toBe("too_large");
    expect(e.message).toBe("a 13-qubit density matrix needs 1.0 GiB; the limit is 12 qubits");
  });

  it("rejects noise rates outside [0, 1] naming each field", () => {
    const e = engineError(() =>
      validateNoiseModel({
        depolarizing1q: 1.5,
        phaseDamping: -0.1,
        readout: { p0Given1: Number.NaN },
      }),
    );
    expect(e.code).toBe("invalid_request");
    expect(e.issues.map((i) => i.path.join("."))).toEqual([
      "noise.depolarizing1q",
      "noise.phaseDamping",
      "noise.readout.p0Given1",
    ]);
    expect(e.message).toMatch(
      /noise\.depolarizing1q must be a probability between 0 and 1 \(got 1\.5\)/,
    );
    expect(
      engineError(() => simulateDensityMatrix(circuit(1, []), { amplitudeDamping: 2 })).code,
    ).toBe("invalid_request");
    expect(() =>
      validateNoiseModel({ depolarizing1q: 0, depolarizing2q: 1, readout: { p1Given0: 0.5 } }),
    ).not.toThrow();
  });

  it("throws 'canceled' when aborted", () => {
    const ac = new AbortController();
    ac.abort();
    expect(
      engineError(() =>
        simulateDensityMatrix(circuit(1, [g1("h", 0, H)]), undefined, { signal: ac.signal }),
      ).code,
    ).toBe("canceled");
  });
});

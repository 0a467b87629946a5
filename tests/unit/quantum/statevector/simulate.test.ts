/**
 * simulateStatevector: textbook states, qubit order, guards (memory, unsupported ops,
 * cancellation, malformed circuits) and progress reporting.
 */
import { describe, expect, it } from "vitest";
import { EngineError } from "@/lib/quantum/errors";
import { formatBytes, statevectorBytes } from "@/lib/quantum/statevector/memory";
import { simulateStatevector } from "@/lib/quantum/statevector/simulate";
import { probabilities } from "@/lib/quantum/statevector/state";
import type { Circuit, CircuitOp } from "@/lib/quantum/types";
import { CX } from "../../../bench/ansatz";

const s = Math.SQRT1_2;
const H = Float64Array.of(s, 0, s, 0, s, 0, -s, 0);
const X = Float64Array.of(0, 0, 1, 0, 1, 0, 0, 0);

function gate(name: string, qubits: number[], matrix: Float64Array, line = 1): CircuitOp {
  return { kind: "gate", name, qubits, params: [], parts: [{ name, qubits, matrix }], line };
}

function circuit(n: number, ops: CircuitOp[], extra: Partial<Circuit> = {}): Circuit {
  return {
    numQubits: n,
    numClbits: n,
    ops,
    qubitLabels: Array.from({ length: n }, (_, i) => `q[${i}]`),
    hasMidCircuitMeasurement: false,
    hasReset: false,
    ...extra,
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

describe("simulateStatevector", () => {
  it("prepares the Bell state (|00⟩+|11⟩)/√2 with h; cx (N&C §1.3.6, value from memory)", () => {
    const psi = simulateStatevector(circuit(2, [gate("h", [0], H), gate("cx", [0, 1], CX, 2)]));
    expect(psi.re[0]).toBeCloseTo(s, 14);
    expect(psi.re[3]).toBeCloseTo(s, 14);
    expect(
      Math.abs(psi.re[1]) + Math.abs(psi.re[2]) + Math.abs(psi.im[0]) + Math.abs(psi.im[3]),
    ).toBeLessThan(1e-15);
  });

  it("puts qubit k at index bit k (asymmetric check: x on q[2] of 3 → index 4)", () => {
    const p = probabilities(simulateStatevector(circuit(3, [gate("x", [2], X)])));
    expect(Array.from(p)).toEqual([0, 0, 0, 0, 1, 0, 0, 0]);
    // cx with control q[2], target q[0] after x q[2]: |q0 q1 q2⟩ = |1 0 1⟩ → index 1 + 4 = 5
    const p2 = probabilities(
      simulateStatevector(circuit(3, [gate("x", [2], X), gate("cx", [2, 0], CX, 2)])),
    );
    expect(p2[5]).toBe(1);
  });

  it("ignores barriers and measurements at the end", () => {
    const ops: CircuitOp[] = [
      gate("h", [0], H),
      { kind: "barrier", qubits: [0, 1], line: 2 },
      gate("cx", [0, 1], CX, 3),
      { kind: "measure", qubit: 0, clbit: 0, line: 4 },
      { kind: "measure", qubit: 1, clbit: 1, line: 5 },
    ];
    const psi = simulateStatevector(circuit(2, ops));
    expect(psi.re[0]).toBeCloseTo(s, 14);
    expect(psi.re[3]).toBeCloseTo(s, 14);
  });

  it("refuses reset and mid-circuit measurement with 'unsupported', pointing to the density-matrix method", () => {
    const reset = engineError(() =>
      simulateStatevector(circuit(1, [{ kind: "reset", qubit: 0, line: 3 }], { hasReset: true })),
    );
    expect(reset.code).toBe("unsupported");
    expect(reset.message).toMatch(/density-matrix method/);
    expect(reset.message).toMatch(/q\[0\] \(line 3\)/);
    const mid = engineError(() =>
      simulateStatevector(
        circuit(2, [{ kind: "measure", qubit: 1, clbit: 0, line: 2 }, gate("cx", [0, 1], CX, 3)]),
      ),
    );
    expect(mid.code).toBe("unsupported");
    expect(mid.message).toMatch(/mid-circuit measurement on q\[1\] \(line 2\)/);
  });

  it("refuses more than 26 qubits with the memory the run would need (2^n × 16 B)", () => {
    expect(statevectorBytes(28)).toBe(4 * 2 ** 30);
    const e = engineError(() => simulateStatevector(circuit(28, [])));
    expect(e.code).toBe("too_large");
    expect(e.message).toBe("a 28-qubit statevector needs 4.0 GiB; the limit is 26 qubits");
    const bytes = engineError(() =>
      simulateStatevector(circuit(20, []), { maxBytes: 8 * 2 ** 20 }),
    );
    expect(bytes.code).toBe("too_large");
    expect(bytes.message).toBe("a 20-qubit statevector needs 16 MiB; the limit is 8.0 MiB");
    expect(formatBytes(256 * 2 ** 20)).toBe("256 MiB");
  });

  it("rejects malformed circuits with invalid_request naming the line", () => {
    const e = engineError(() => simulateStatevector(circuit(2, [gate("h", [2], H, 7)])));
    expect(e.code).toBe("invalid_request");
    expect(e.message).toMatch(/line 7/);
    const m = engineError(() => simulateStatevector(circuit(2, [gate("cx", [0, 1], H, 4)])));
    expect(m.message).toMatch(/needs a matrix of 32 numbers/);
  });

  it("throws 'canceled' when the signal is aborted (before the run or from a progress callback)", () => {
    const ac = new AbortController();
    ac.abort();
    expect(
      engineError(() => simulateStatevector(circuit(2, [gate("h", [0], H)]), { signal: ac.signal }))
        .code,
    ).toBe("canceled");
    const ac2 = new AbortController();
    const ops = Array.from({ length: 50 }, (_, i) => gate("h", [i % 3], H, i + 1));
    const e = engineError(() =>
      simulateStatevector(circuit(3, ops), {
        signal: ac2.signal,
        onProgress: () => ac2.abort(),
        fuse: false,
      }),
    );
    expect(e.code).toBe("canceled");
  });

  it("reports progress from 0 to 1, monotonically", () => {
    const seen: number[] = [];
    simulateStatevector(circuit(2, [gate("h", [0], H), gate("cx", [0, 1], CX, 2)]), {
      onProgress: (f) => seen.push(f),
    });
    expect(seen[0]).toBe(0);
    expect(seen[seen.length - 1]).toBe(1);
    for (let i = 1; i < seen.length; i++) expect(seen[i]).toBeGreaterThanOrEqual(seen[i - 1]);
  });
});

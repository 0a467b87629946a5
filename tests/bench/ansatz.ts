/**
 * The benchmark's layered ansatz, built by hand as a Circuit (no parser): per layer an ry
 * on every qubit, an rz on every qubit, then a cx ladder (0,1), (1,2), …, (n−2, n−1).
 * Angles are fixed formulas shared with ansatz_numpy.py:
 *   θ(l, q) = 0.1 + 0.37·l + 0.61·q (ry),  φ(l, q) = 0.2 + 0.53·l + 0.29·q (rz).
 * ry(θ) = [[cos θ/2, −sin θ/2], [sin θ/2, cos θ/2]], rz(φ) = diag(e^{−iφ/2}, e^{iφ/2}),
 * cx on (control, target) = [[1,0,0,0],[0,1,0,0],[0,0,0,1],[0,0,1,0]] (control = first operand).
 */
import type { Circuit, CircuitOp, GateApplication } from "@/lib/quantum/types";

export const ryAngle = (l: number, q: number): number => 0.1 + 0.37 * l + 0.61 * q;
export const rzAngle = (l: number, q: number): number => 0.2 + 0.53 * l + 0.29 * q;

export function ry(t: number): Float64Array {
  const c = Math.cos(t / 2),
    s = Math.sin(t / 2);
  return Float64Array.of(c, 0, -s, 0, s, 0, c, 0);
}

export function rz(t: number): Float64Array {
  return Float64Array.of(
    Math.cos(t / 2),
    -Math.sin(t / 2),
    0,
    0,
    0,
    0,
    Math.cos(t / 2),
    Math.sin(t / 2),
  );
}

export const CX = Float64Array.of(
  1,
  0,
  0,
  0,
  0,
  0,
  0,
  0,
  0,
  0,
  1,
  0,
  0,
  0,
  0,
  0,
  0,
  0,
  0,
  0,
  0,
  0,
  1,
  0,
  0,
  0,
  0,
  0,
  1,
  0,
  0,
  0,
);

function gate(name: string, qubits: number[], matrix: Float64Array, line: number): CircuitOp {
  const part: GateApplication = { name, qubits, matrix };
  return { kind: "gate", name, qubits, params: [], parts: [part], line };
}

export function layeredAnsatz(n: number, layers: number): Circuit {
  const ops: CircuitOp[] = [];
  for (let l = 0; l < layers; l++) {
    for (let q = 0; q < n; q++) ops.push(gate("ry", [q], ry(ryAngle(l, q)), ops.length + 1));
    for (let q = 0; q < n; q++) ops.push(gate("rz", [q], rz(rzAngle(l, q)), ops.length + 1));
    for (let q = 0; q + 1 < n; q++) ops.push(gate("cx", [q, q + 1], CX, ops.length + 1));
  }
  return {
    numQubits: n,
    numClbits: 0,
    ops,
    qubitLabels: Array.from({ length: n }, (_, i) => `q[${i}]`),
    hasMidCircuitMeasurement: false,
    hasReset: false,
  };
}

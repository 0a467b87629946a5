/**
 * Summary figures of a bound circuit, over its top-level operations (a call of `ccx`
 * or of a user gate counts once, as in the noise model, which acts once after each top-level gate).
 */
import type { Circuit } from "../types";

export interface CircuitStats {
  qubits: number;
  /** Gate calls by name as written (e.g. { h: 2, cx: 1, mygate: 1 }). */
  gateCounts: Record<string, number>;
  totalGates: number;
  /** Gate calls acting on two or more qubits. */
  twoQubitGates: number;
  /**
   * Number of layers when every gate, measurement and reset waits for the previous
   * operation on each of its qubits (common practice); barriers are not counted.
   */
  depth: number;
}

export function circuitStats(circuit: Circuit): CircuitStats {
  const counts = new Map<string, number>();
  const level = new Array<number>(circuit.numQubits).fill(0);
  let totalGates = 0;
  let twoQubitGates = 0;
  let depth = 0;
  for (const op of circuit.ops) {
    if (op.kind === "barrier") continue;
    const qubits = op.kind === "gate" ? op.qubits : [op.qubit];
    if (op.kind === "gate") {
      totalGates += 1;
      if (op.qubits.length >= 2) twoQubitGates += 1;
      counts.set(op.name, (counts.get(op.name) ?? 0) + 1);
    }
    let d = 0;
    for (const q of qubits) d = Math.max(d, level[q]);
    d += 1;
    for (const q of qubits) level[q] = d;
    depth = Math.max(depth, d);
  }
  // fromEntries defines own properties, so a gate named "__proto__" is counted safely.
  return {
    qubits: circuit.numQubits,
    gateCounts: Object.fromEntries(counts),
    totalGates,
    twoQubitGates,
    depth,
  };
}

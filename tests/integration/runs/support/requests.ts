/**
 * Run requests used by the integration tests.
 * - BELL: H q0; CX q0,q1 prepares (|00⟩+|11⟩)/√2; ⟨Z0 Z1⟩ = ⟨X0 X1⟩ = 1, so
 *   √2(ZZ + XX) has exact value 2√2 (Tsirelson's bound; B. S. Cirel'son,
 *   Lett. Math. Phys. 4, 93 (1980)).
 * - longRun(): a density-matrix run with many noisy gates and sweep points —
 *   seconds of engine work, for cancellation and crash tests.
 */
export const BELL_QASM =
  'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[2];\nh q[0];\ncx q[0],q[1];\n';

export function bellRequest(extra: Record<string, unknown> = {}) {
  return {
    circuit: { format: "qasm2", source: BELL_QASM },
    observable: { format: "pauli", terms: "1.4142135623730951 Z0 Z1 + 1.4142135623730951 X0 X1" },
    shots: 1000,
    seed: 11,
    ...extra,
  };
}

/** Four qubits, 1,000 shots (the benchmark's small run). */
export function smallRequest(seed = 5) {
  const source = [
    "OPENQASM 2.0;",
    'include "qelib1.inc";',
    "qreg q[4];",
    "h q[0];",
    "cx q[0],q[1];",
    "ry(0.3) q[2];",
    "cx q[2],q[3];",
    "rz(0.7) q[3];",
  ].join("\n");
  return {
    circuit: { format: "qasm2", source },
    observable: { format: "pauli", terms: "0.5 Z0 Z1 + 0.25 X2 X3 - 0.1 Y1 Y2 + 0.3 Z3" },
    shots: 1000,
    seed,
  };
}

/** A run that keeps the engine busy for several seconds: 8-qubit noisy density matrix over a parameter sweep. */
export function longRunRequest(points = 400) {
  const lines = [
    "OPENQASM 3.0;",
    'include "stdgates.inc";',
    "input float[64] theta;",
    "qubit[8] q;",
  ];
  for (let layer = 0; layer < 6; layer++) {
    for (let i = 0; i < 8; i++) lines.push(`ry(theta) q[${i}];`);
    for (let i = 0; i < 7; i++) lines.push(`cx q[${i}], q[${i + 1}];`);
  }
  return {
    circuit: { format: "qasm3", source: lines.join("\n") },
    observable: { format: "pauli", terms: "Z0 Z1 + 0.5 X3 + 0.25 Z7" },
    method: "density_matrix",
    noise: { depolarizing1q: 0.001, depolarizing2q: 0.01 },
    shots: 100,
    seed: 3,
    sweep: { theta: Array.from({ length: points }, (_, i) => (i * Math.PI) / points) },
  };
}

/**
 * Density-matrix row: 10 qubits (ρ has 4^10 entries = the size of a 20-qubit state), 100
 * noisy gates (ry on qubit i, then cx(i, i+1), alternating) with every channel switched on.
 * Reported as time ÷ (100 × one baseline pass over ρ): the number of memcpy-equivalent
 * passes one noisy gate costs (unitary + depolarizing + damping on each qubit), on one engine
 * thread (the threads rows measure it on several).
 */
import { simulateDensityMatrix } from "@/lib/quantum/density-matrix/simulate";
import type { Circuit, CircuitOp } from "@/lib/quantum/types";
import { CX, ry } from "../ansatz";
import { type BenchRow, fmtClocks, fmtMs, paired, ratioResult } from "../bench-kit";

const N = 10;
const GATES = 100;

export function noisyCircuit(): Circuit {
  const ops: CircuitOp[] = [];
  for (let g = 0; g < GATES; g++) {
    const q = (g >> 1) % N;
    if (g % 2 === 0) {
      const m = ry(0.3 + 0.1 * g);
      ops.push({
        kind: "gate",
        name: "ry",
        qubits: [q],
        params: [],
        parts: [{ name: "ry", qubits: [q], matrix: m }],
        line: g + 1,
      });
    } else {
      const t = (q + 1) % N;
      ops.push({
        kind: "gate",
        name: "cx",
        qubits: [q, t],
        params: [],
        parts: [{ name: "cx", qubits: [q, t], matrix: CX }],
        line: g + 1,
      });
    }
  }
  return {
    numQubits: N,
    numClbits: 0,
    ops,
    qubitLabels: [],
    hasMidCircuitMeasurement: false,
    hasReset: false,
  };
}

/** Every channel switched on. */
export const BENCH_NOISE = {
  depolarizing1q: 0.001,
  depolarizing2q: 0.01,
  amplitudeDamping: 0.002,
  phaseDamping: 0.003,
};

export const densityRow: BenchRow = (ctx) => {
  const circuit = noisyCircuit();
  const p = paired(
    () => simulateDensityMatrix(circuit, BENCH_NOISE, { threads: 1 }),
    ctx.copy(2 * N),
  );
  const per = {
    ...p,
    ratio: { median: p.ratio.median / GATES, min: p.ratio.min / GATES, max: p.ratio.max / GATES },
  };
  return [
    ratioResult(
      per,
      `density matrix n=${N}, ${GATES} noisy gates (passes per noisy gate)`,
      `${fmtClocks(p.row)} vs ${GATES} × ${fmtMs(p.base.cpu.median)}`,
      "≤ 3",
      (r) => r <= 3,
    ),
  ];
};

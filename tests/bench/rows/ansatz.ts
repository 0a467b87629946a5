/**
 * Layered-ansatz row: 20 qubits, 20 layers of ry/rz on every qubit + a cx ladder
 * (1,180 gates). Total simulate time (fusion included) against gate count × one baseline
 * pass of a 20-qubit state: a per-gate simulator running at memcpy speed would score 1.0.
 */
import { circuitGates, simulateStatevector } from "@/lib/quantum/statevector/simulate";
import type { StateVector } from "@/lib/quantum/types";
import { layeredAnsatz } from "../ansatz";
import { type BenchRow, fmtClocks, fmtMs, paired, ratioResult } from "../bench-kit";

export const ANSATZ_N = 20;
export const ANSATZ_LAYERS = 20;

export const ansatzRow: BenchRow = (ctx) => {
  const circuit = layeredAnsatz(ANSATZ_N, ANSATZ_LAYERS);
  const gateCount = circuit.ops.length;
  const passes = circuitGates(circuit).length;
  let state: StateVector = simulateStatevector(circuit, { threads: 1 });
  const p = paired(
    () => (state = simulateStatevector(circuit, { threads: 1 })),
    ctx.copy(ANSATZ_N),
    { warmup: 0 },
  );
  ctx.shared.set("ansatzMs", p.row.cpu.median);
  ctx.shared.set("ansatzState", state);
  const scaled = {
    ...p,
    ratio: {
      median: p.ratio.median / gateCount,
      min: p.ratio.min / gateCount,
      max: p.ratio.max / gateCount,
    },
  };
  return [
    ratioResult(
      scaled,
      `ansatz n=${ANSATZ_N}, ${ANSATZ_LAYERS} layers (${gateCount} gates → ${passes} fused passes)`,
      `${fmtClocks(p.row)} vs ${gateCount} × ${fmtMs(p.base.cpu.median)}`,
      "≤ 0.5",
      (r) => r <= 0.5,
    ),
  ];
};

/**
 * Layered-ansatz row: 20 qubits, 20 layers of ry/rz on every qubit + a cx ladder
 * (1,180 gates). Total simulate time (fusion included) against gate count × one baseline
 * pass of a 20-qubit state: a per-gate simulator running at memcpy speed would score 1.0.
 */
import { simulateStatevector } from "@/lib/quantum/statevector/simulate";
import { circuitGates } from "@/lib/quantum/statevector/simulate";
import { layeredAnsatz } from "../ansatz";
import { type BenchRow, fmtMs, timeMs } from "../bench-kit";

export const ANSATZ_N = 20;
export const ANSATZ_LAYERS = 20;

export const ansatzRow: BenchRow = (ctx) => {
  const circuit = layeredAnsatz(ANSATZ_N, ANSATZ_LAYERS);
  const gateCount = circuit.ops.length;
  const passes = circuitGates(circuit).length;
  let state = simulateStatevector(circuit);
  const ms = timeMs(() => {
    state = simulateStatevector(circuit);
  }, 3, 1);
  ctx.shared.set("ansatzMs", ms);
  ctx.shared.set("ansatzState", state);
  const base = ctx.copyMs(ANSATZ_N);
  const ratio = ms / (gateCount * base);
  return [
    {
      row: `ansatz n=${ANSATZ_N}, ${ANSATZ_LAYERS} layers (${gateCount} gates → ${passes} fused passes)`,
      measured: `${fmtMs(ms)} vs ${gateCount} × ${fmtMs(base)}`,
      value: ratio,
      target: "≤ 0.8",
      pass: ratio <= 0.8,
    },
  ];
};

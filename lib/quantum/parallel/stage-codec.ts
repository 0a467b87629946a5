/**
 * A tiling stage (statevector/tiling.ts) written to and read from the shared command buffer
 * of the engine threads: [gate count, tile bit count, tile bits…, then per gate: k, bits…,
 * the interleaved 2^k × 2^k matrix]. Doubles hold the small integers exactly.
 */
import {
  makeStageFrom,
  MAX_STAGE_GATES,
  MAX_STAGE_GATE_QUBITS,
  TILE_QUBITS,
  type Stage,
} from "../statevector/tiling";

/** Doubles the buffer needs for the largest stage. */
export const STAGE_DOUBLES =
  2 + TILE_QUBITS + MAX_STAGE_GATES * (1 + MAX_STAGE_GATE_QUBITS + 2 * 4 ** MAX_STAGE_GATE_QUBITS);

export function writeStage(buf: Float64Array, stage: Stage): void {
  let o = 0;
  buf[o++] = stage.gates.length;
  buf[o++] = stage.tileBits.length;
  for (const b of stage.tileBits) buf[o++] = b;
  for (const g of stage.gates) {
    buf[o++] = g.bits.length;
    for (const b of g.bits) buf[o++] = b;
    buf.set(g.matrix, o);
    o += g.matrix.length;
  }
}

export function readStage(buf: Float64Array): Stage {
  let o = 0;
  const count = buf[o++];
  const tileBits = Array.from(buf.subarray(o + 1, o + 1 + buf[o]));
  o += 1 + tileBits.length;
  const gates: { bits: number[]; matrix: Float64Array }[] = [];
  for (let g = 0; g < count; g++) {
    const k = buf[o++];
    const bits = Array.from(buf.subarray(o, o + k));
    o += k;
    const len = 2 * 4 ** k;
    gates.push({ bits, matrix: buf.slice(o, o + len) });
    o += len;
  }
  return makeStageFrom(gates, tileBits);
}

/**
 * Cache tiling of a gate sequence. Consecutive gates whose qubits together with the lowest
 * index bits fit in TILE_QUBITS bits form a stage; a stage is applied tile by tile: the
 * 2^TILE_QUBITS amplitudes that share the bits outside the stage's tile bits are gathered
 * into a small buffer (that stays in the core's cache), every gate of the stage is applied
 * there with its qubits renumbered, and the tile is written back. The state then crosses
 * memory once per stage instead of once per gate, and the tiles of a stage are independent,
 * so engine threads share a stage by splitting the tiles (any qubit, the top ones included).
 *
 * Every amplitude goes through the same kernels with the same matrices in the same order as
 * gate-by-gate application: results are bit-identical (tested). Pure computation.
 */
import type { GateApplication } from "../types";
import { applyWithShape } from "./dispatch";
import { classifyMatrix, type MatrixShape } from "./matrix-classify";
import { IM_GAP_BYTES, RESERVED_BYTES, stateEndByte, wasmBinding } from "../wasm/runtime";

/**
 * Bits of a tile: 2^15 amplitudes = 512 KiB of re + im, within a core's L2 cache (measured on
 * the 22-qubit ansatz: 14–16 bits within a few percent of each other, 13 clearly slower).
 */
export const TILE_QUBITS = 15;
/**
 * Index bits 0 … MIN_RUN_BITS−1 always belong to the tile, so gathers copy runs of ≥ 64
 * amplitudes (512 bytes); with runs of 16 the copies cost more than the tiling saves.
 */
export const MIN_RUN_BITS = 6;
/**
 * One engine thread tiles states from 2^22 amplitudes (64 MiB, beyond the shared L3 cache of
 * the machines measured): below that a gate's pass is served from L3 and the gathers cost more
 * than they save (20 qubits: 270 → 330 ms untiled → tiled; 22 qubits: 427 → 397 ms). Engine
 * threads always tile: the top qubits' gates are then shared too, and the threads stop
 * competing for memory bandwidth (22 qubits on two threads: 280 → 223 ms).
 */
export const TILE_MIN_QUBITS_ONE_THREAD = 22;
/** Longest stage (bounds the command buffer of the engine threads). */
export const MAX_STAGE_GATES = 64;
/** Largest gate a stage takes (larger ones run alone). */
export const MAX_STAGE_GATE_QUBITS = 3;

/** One gate of a stage: qubits renumbered to tile bits, matrix classified once. */
export interface StageGate {
  bits: number[];
  matrix: Float64Array;
  shape: MatrixShape;
}

export interface Stage {
  /** State index bits inside a tile, ascending (length TILE_QUBITS). */
  tileBits: number[];
  gates: StageGate[];
}

/** A step of a tiled sequence: a stage, or one gate applied to the whole state as before. */
export type Step = { stage: Stage; count: number } | { gate: GateApplication; count: 1 };

/** The tile bits of a stage whose gates touch `used`: those, then the lowest free bits. */
export function tileBitsFor(used: Iterable<number>, tileQubits = TILE_QUBITS): number[] {
  const bits = new Set(used);
  for (let b = 0; bits.size < tileQubits; b++) bits.add(b);
  return [...bits].sort((a, b) => a - b);
}

/** A stage from gates on the given tile bits (qubits renumbered by their rank among them). */
export function makeStage(gates: readonly GateApplication[], tileBits: number[]): Stage {
  const rank = new Map(tileBits.map((b, i) => [b, i]));
  return makeStageFrom(
    gates.map((g) => ({ bits: g.qubits.map((q) => rank.get(q) as number), matrix: g.matrix })),
    tileBits,
  );
}

/** A stage from gates already given on tile bits (the matrices are classified here). */
export function makeStageFrom(
  gates: readonly { bits: number[]; matrix: Float64Array }[],
  tileBits: number[],
): Stage {
  return {
    tileBits,
    gates: gates.map((g) => ({
      ...g,
      shape: classifyMatrix(g.matrix, 1 << g.bits.length),
    })),
  };
}

/**
 * Splits the gate sequence of an n-qubit state into steps (order kept). Without `tile`, and for
 * states of at most TILE_QUBITS qubits (one tile already), every gate is its own step.
 */
export function planSteps(
  gates: readonly GateApplication[],
  n: number,
  tile = true,
  tileQubits = TILE_QUBITS,
): Step[] {
  const steps: Step[] = [];
  if (!tile || n <= tileQubits) {
    for (const gate of gates) steps.push({ gate, count: 1 });
    return steps;
  }
  let run: GateApplication[] = [];
  const used = new Set<number>();
  const close = (): void => {
    if (run.length === 1) steps.push({ gate: run[0], count: 1 });
    else if (run.length > 1) {
      const tileBits = tileBitsFor(used, tileQubits);
      steps.push({ stage: makeStage(run, tileBits), count: run.length });
    }
    run = [];
    used.clear();
    for (let b = 0; b < MIN_RUN_BITS; b++) used.add(b);
  };
  close();
  for (const gate of gates) {
    if (gate.qubits.length > MAX_STAGE_GATE_QUBITS) {
      close();
      steps.push({ gate, count: 1 });
      continue;
    }
    const fresh = gate.qubits.filter((q) => !used.has(q)).length;
    if (used.size + fresh > tileQubits || run.length === MAX_STAGE_GATES) close();
    run.push(gate);
    for (const q of gate.qubits) used.add(q);
  }
  close();
  return steps;
}

/** Number of tiles of a stage on an n-qubit state. */
export function tileCount(n: number, stage: Stage): number {
  return 2 ** (n - stage.tileBits.length);
}

/** Bytes of one tile buffer in the tail of a kernel memory: re, gap, im, the run table. */
const TILE_TABLE_BYTES = 4 * 2 ** (TILE_QUBITS - MIN_RUN_BITS);
const TILE_SLOT_BYTES = 16 * 2 ** TILE_QUBITS + IM_GAP_BYTES + TILE_TABLE_BYTES;

/** Tail bytes a kernel memory of an n-qubit state needs for `threads` tile buffers. */
export function tileTailBytes(n: number, threads: number): number {
  return n > TILE_QUBITS ? threads * TILE_SLOT_BYTES : 0;
}

interface TileBuffer {
  re: Float64Array;
  im: Float64Array;
  /** Run table (byte offsets) beside a tile in a kernel memory; null for plain arrays. */
  table: Uint32Array | null;
}

let plainTile: TileBuffer | undefined;

/**
 * Tile buffer `slot` of the state's kernel memory, or a plain one (JavaScript path), holding
 * `size` ≤ 2^TILE_QUBITS amplitudes.
 */
function tileBuffer(
  re: Float64Array,
  im: Float64Array,
  n: number,
  slot: number,
  size: number,
): TileBuffer {
  const room = 2 ** TILE_QUBITS;
  const buffer = re.buffer;
  const at = stateEndByte(n) + slot * TILE_SLOT_BYTES;
  if (
    wasmBinding(re, im) !== undefined &&
    re.byteOffset === RESERVED_BYTES &&
    buffer.byteLength >= at + TILE_SLOT_BYTES
  ) {
    const tableAt = at + 16 * room + IM_GAP_BYTES;
    return {
      re: new Float64Array(buffer, at, size),
      im: new Float64Array(buffer, at + 8 * room + IM_GAP_BYTES, size),
      table: new Uint32Array(buffer, tableAt, TILE_TABLE_BYTES / 4),
    };
  }
  if (!plainTile) {
    plainTile = { re: new Float64Array(room), im: new Float64Array(room), table: null };
  }
  return {
    re: plainTile.re.subarray(0, size),
    im: plainTile.im.subarray(0, size),
    table: null,
  };
}

/** Deposits the bits of `value` into the positions `bits` (ascending), lowest first. */
function deposit(value: number, bits: readonly number[]): number {
  let out = 0;
  for (let j = 0; j < bits.length; j++) if ((value >>> j) & 1) out += 2 ** bits[j];
  return out;
}

/** Copies `runs` runs of `len` doubles: run r from src + from[r] to dst + r·len (or back). */
function copyRuns(
  a: Float64Array,
  aAt: Float64Array,
  b: Float64Array,
  len: number,
  toTile: boolean,
): void {
  for (let r = 0, o = 0; r < aAt.length; r++, o += len) {
    const s = aAt[r];
    if (toTile) for (let j = 0; j < len; j++) b[o + j] = a[s + j];
    else for (let j = 0; j < len; j++) a[s + j] = b[o + j];
  }
}

/**
 * Applies a stage to tiles `from` … `to − 1` of the n-qubit state (re, im), using tile buffer
 * `slot` (one per engine thread). Tiles are numbered by the bits outside the stage's tile
 * bits, in index order.
 */
export function applyStageTiles(
  re: Float64Array,
  im: Float64Array,
  n: number,
  stage: Stage,
  from: number,
  to: number,
  slot = 0,
): void {
  const { tileBits, gates } = stage;
  const size = 2 ** tileBits.length;
  let runBits = 0;
  while (runBits < tileBits.length && tileBits[runBits] === runBits) runBits++;
  if (runBits === tileBits.length) {
    // the tile bits are the lowest ones: tile t is the contiguous slice t, updated in place
    for (let t = from; t < to; t++) {
      const r = re.subarray(t * size, (t + 1) * size);
      const i = im.subarray(t * size, (t + 1) * size);
      for (const g of gates) applyWithShape(r, i, g.bits, g.matrix, g.shape);
    }
    return;
  }
  const outerBits: number[] = [];
  const inTile = new Set(tileBits);
  for (let b = 0; b < n; b++) if (!inTile.has(b)) outerBits.push(b);
  const runLen = 2 ** runBits;
  const highBits = tileBits.slice(runBits);
  const runs = size / runLen;
  const runAt = new Float64Array(runs);
  for (let r = 0; r < runs; r++) runAt[r] = deposit(r, highBits);
  const tile = tileBuffer(re, im, n, slot, size);
  const w = tile.table ? wasmBinding(re, im) : undefined;
  if (w && tile.table && runs <= tile.table.length) {
    for (let r = 0; r < runs; r++) tile.table[r] = 8 * runAt[r];
    const runBytes = 8 * runLen;
    const tr = tile.re.byteOffset;
    const ti = tile.im.byteOffset;
    const tab = tile.table.byteOffset;
    for (let t = from; t < to; t++) {
      const base = 8 * deposit(t, outerBits);
      const r0 = re.byteOffset + base;
      const i0 = im.byteOffset + base;
      w.k.copyTile(r0, i0, tr, ti, tab, runs, runBytes, 1);
      for (const g of gates) applyWithShape(tile.re, tile.im, g.bits, g.matrix, g.shape);
      w.k.copyTile(r0, i0, tr, ti, tab, runs, runBytes, 0);
    }
    return;
  }
  const at = new Float64Array(runs);
  for (let t = from; t < to; t++) {
    const base = deposit(t, outerBits);
    for (let r = 0; r < runs; r++) at[r] = base + runAt[r];
    copyRuns(re, at, tile.re, runLen, true);
    copyRuns(im, at, tile.im, runLen, true);
    for (const g of gates) applyWithShape(tile.re, tile.im, g.bits, g.matrix, g.shape);
    copyRuns(re, at, tile.re, runLen, false);
    copyRuns(im, at, tile.im, runLen, false);
  }
}

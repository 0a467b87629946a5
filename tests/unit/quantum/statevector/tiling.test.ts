/**
 * Cache tiling (statevector/tiling.ts): a gate sequence applied stage by stage, tile by tile,
 * gives bit-identical amplitudes to the same gates applied one by one over the whole state —
 * in a kernel memory (WebAssembly kernels and gathers) and in plain arrays (JavaScript), for
 * contiguous tiles and gathered ones, in one go or split into tile ranges (as engine threads
 * split them). The reference is the engine's own gate-by-gate path, itself checked against
 * dense matrices in reference.test.ts.
 */
import { describe, expect, it } from "vitest";
import { applyToAmplitudes } from "@/lib/quantum/statevector/dispatch";
import {
  MAX_STAGE_GATE_QUBITS,
  MAX_STAGE_GATES,
  MIN_RUN_BITS,
  TILE_QUBITS,
  applyStageTiles,
  planSteps,
  tileCount,
  tileTailBytes,
  type Step,
} from "@/lib/quantum/statevector/tiling";
import type { GateApplication } from "@/lib/quantum/types";
import {
  bindMemory,
  createKernelMemory,
  stateViews,
  wasmBinding,
} from "@/lib/quantum/wasm/runtime";
import { makeRng, randomGate, type Rng } from "./support/random-gates";

type State = { re: Float64Array; im: Float64Array };

function fillRandom(s: State, rng: Rng): State {
  for (let i = 0; i < s.re.length; i++) {
    s.re[i] = rng.float() - 0.5;
    s.im[i] = rng.float() - 0.5;
  }
  return s;
}

function kernelState(n: number): State {
  const memory = createKernelMemory(n, tileTailBytes(n, 1));
  if (!memory || !bindMemory(memory, 0)) throw new Error("WebAssembly kernels unavailable");
  const s = stateViews(memory, n);
  expect(wasmBinding(s.re, s.im)).toBeDefined();
  return s;
}

const plainState = (n: number): State => ({
  re: new Float64Array(2 ** n),
  im: new Float64Array(2 ** n),
});

function copyOf(s: State, make: (n: number) => State, n: number): State {
  const c = make(n);
  c.re.set(s.re);
  c.im.set(s.im);
  return c;
}

function runSteps(s: State, n: number, steps: Step[], parts = 1): void {
  for (const step of steps) {
    if ("gate" in step) {
      applyToAmplitudes(s.re, s.im, step.gate.qubits, step.gate.matrix);
      continue;
    }
    const tiles = tileCount(n, step.stage);
    for (let p = 0; p < parts; p++) {
      const from = Math.floor((tiles * p) / parts);
      const to = Math.floor((tiles * (p + 1)) / parts);
      applyStageTiles(s.re, s.im, n, step.stage, from, to);
    }
  }
}

function identical(a: State, b: State): boolean {
  for (let i = 0; i < a.re.length; i++)
    if (a.re[i] !== b.re[i] || a.im[i] !== b.im[i]) return false;
  return true;
}

/** Random gates biased towards the top qubits (the ones a tile must gather). */
function randomGates(rng: Rng, n: number, count: number, maxK = 3): GateApplication[] {
  return Array.from({ length: count }, () => randomGate(rng, n, maxK));
}

describe("planSteps", () => {
  const rng = makeRng(515);
  const n = 20;
  const gates = randomGates(rng, n, 300, 4);
  const steps = planSteps(gates, n);

  it("keeps every gate once, in order, and each stage's gates on its tile bits", () => {
    const flat: GateApplication[] = [];
    let i = 0;
    for (const step of steps) {
      if ("gate" in step) {
        expect(step.gate).toBe(gates[i++]);
        flat.push(step.gate);
        continue;
      }
      expect(step.count).toBe(step.stage.gates.length);
      for (const g of step.stage.gates) {
        const src = gates[i++];
        expect(g.bits.map((b) => step.stage.tileBits[b])).toEqual(src.qubits);
        expect(g.matrix).toBe(src.matrix);
        flat.push(src);
      }
    }
    expect(flat).toEqual(gates);
  });

  it("stages: TILE_QUBITS ascending tile bits with the low run bits, ≤ MAX_STAGE_GATES small gates", () => {
    let stages = 0;
    for (const step of steps) {
      if ("gate" in step) continue;
      stages++;
      const { tileBits, gates: sg } = step.stage;
      expect(tileBits).toHaveLength(TILE_QUBITS);
      expect([...tileBits].sort((a, b) => a - b)).toEqual(tileBits);
      for (let b = 0; b < MIN_RUN_BITS; b++) expect(tileBits).toContain(b);
      expect(sg.length).toBeGreaterThan(1);
      expect(sg.length).toBeLessThanOrEqual(MAX_STAGE_GATES);
      for (const g of sg) expect(g.bits.length).toBeLessThanOrEqual(MAX_STAGE_GATE_QUBITS);
    }
    expect(stages).toBeGreaterThan(5);
    // 4-qubit gates never join a stage
    for (const step of steps)
      if ("gate" in step && step.gate.qubits.length > 3) expect(step.count).toBe(1);
  });

  it("without tiling, or for states of one tile, every gate is its own step", () => {
    expect(planSteps(gates, n, false).every((s) => "gate" in s)).toBe(true);
    const small = randomGates(rng, TILE_QUBITS, 20);
    expect(planSteps(small, TILE_QUBITS).every((s) => "gate" in s)).toBe(true);
  });
});

describe("applyStageTiles", () => {
  it(
    "equals gate-by-gate application exactly: kernel memory and plain arrays, whole and in parts",
    { timeout: 60_000 },
    () => {
      const rng = makeRng(9041);
      const n = TILE_QUBITS + 2;
      // first gates on the lowest TILE_QUBITS qubits only (a tile in place), then anywhere
      const gates = [...randomGates(rng, TILE_QUBITS, 30), ...randomGates(rng, n, 100)];
      const steps = planSteps(gates, n);
      // both kinds of stage occur: tiles of the lowest bits (in place) and gathered tiles
      const stageBits = steps.flatMap((s) => ("stage" in s ? [s.stage.tileBits] : []));
      expect(stageBits.some((b) => b[b.length - 1] === b.length - 1)).toBe(true);
      expect(stageBits.some((b) => b[b.length - 1] > b.length - 1)).toBe(true);
      const start = fillRandom(plainState(n), rng);
      for (const make of [kernelState, plainState]) {
        const ref = copyOf(start, make, n);
        for (const g of gates) applyToAmplitudes(ref.re, ref.im, g.qubits, g.matrix);
        for (const parts of [1, 3]) {
          const tiled = copyOf(start, make, n);
          runSteps(tiled, n, steps, parts);
          expect(identical(tiled, ref)).toBe(true);
        }
      }
    },
  );

  it("small tiles (8 bits) on a 12-qubit state: every gather shape, bit-identical", () => {
    const rng = makeRng(33);
    const n = 12;
    for (let trial = 0; trial < 4; trial++) {
      const gates = randomGates(rng, n, 60);
      const steps = planSteps(gates, n, true, 8);
      expect(steps.some((s) => "stage" in s)).toBe(true);
      const start = fillRandom(plainState(n), rng);
      const ref = copyOf(start, plainState, n);
      for (const g of gates) applyToAmplitudes(ref.re, ref.im, g.qubits, g.matrix);
      const tiled = copyOf(start, plainState, n);
      runSteps(tiled, n, steps, 2);
      expect(identical(tiled, ref)).toBe(true);
    }
  });
});

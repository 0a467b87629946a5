/**
 * The Pauli-sum expectation on engine threads: the mask groups dealt to 2 and 4 threads give
 * the same per-term values as one thread, bit for bit (each term is computed whole by one
 * thread with the single-thread code), for states in a kernel memory (WebAssembly passes), in
 * SharedArrayBuffers (JavaScript passes), with many terms on one mask (transforms) too; the
 * deal balances the passes.
 */
import { afterAll, describe, expect, it } from "vitest";
import { PARALLEL_MIN_QUBITS, closeKernelPool, kernelPoolStatus } from "@/lib/quantum/parallel";
import { pauliExpectationsOnState } from "@/lib/quantum/observable/pauli-expectation";
import { parsePauliSum } from "@/lib/quantum/observable/pauli-parse";
import { dealGroups, groupCost, type MaskGroup } from "@/lib/quantum/observable/pauli-threads";
import { padPauliSum } from "@/lib/quantum/observable/pauli-word";
import { simulateStatevector } from "@/lib/quantum/statevector/simulate";
import type { StateVector } from "@/lib/quantum/types";
import { makeRng, randomCircuit } from "../statevector/support/random-gates";
import { mulberry32, randomPauliText } from "./random-states";

afterAll(() => closeKernelPool());

const n = PARALLEL_MIN_QUBITS;

function sharedCopy(s: StateVector): StateVector {
  const re = new Float64Array(new SharedArrayBuffer(8 * s.re.length));
  const im = new Float64Array(new SharedArrayBuffer(8 * s.im.length));
  re.set(s.re);
  im.set(s.im);
  return { n: s.n, re, im };
}

describe("Pauli expectation on engine threads", () => {
  const state = simulateStatevector(randomCircuit(makeRng(4242), n, 60), { threads: 1 });
  const rand = mulberry32(99);
  // 400 random words (≈ one mask each) plus 80 words sharing one mask (the transform path)
  const shared = Array.from({ length: 80 }, (_, i) => {
    const z = i.toString(2).padStart(7, "0").replace(/0/g, "I").replace(/1/g, "Z");
    return `${(0.01 * (i + 1)).toFixed(2)} XXYY${z}IIIII`;
  });
  const text = [randomPauliText(n, 400, rand), ...shared].join(" + ");
  const sum = padPauliSum(parsePauliSum(text), n);

  it("2 and 4 threads equal 1 thread exactly (kernel memory and SharedArrayBuffers)", () => {
    for (const s of [state, sharedCopy(state)]) {
      const one = pauliExpectationsOnState(s, sum, undefined, 1);
      for (const threads of [2, 4]) {
        const many = pauliExpectationsOnState(s, sum, undefined, threads);
        expect(Array.from(many)).toEqual(Array.from(one));
      }
    }
    expect(kernelPoolStatus()).toMatchObject({ broken: false });
    expect(kernelPoolStatus().helpers).toBeGreaterThanOrEqual(3);
  });

  it("deals every group once, in order per thread, balancing the passes", () => {
    const groups: MaskGroup[] = Array.from({ length: 50 }, (_, i) => [
      i + 1,
      Array.from({ length: 1 + (i % 9) }, (_, t) => ({ index: 10 * i + t, z: t, k: 0 })),
    ]);
    const dealt = dealGroups(groups, 4, 48);
    const flat = dealt.flat();
    expect(flat).toHaveLength(groups.length);
    expect(new Set(flat).size).toBe(groups.length);
    for (const part of dealt) {
      const idx = part.map((g) => groups.indexOf(g));
      expect(idx).toEqual([...idx].sort((a, b) => a - b));
    }
    const loads = dealt.map((p) => p.reduce((a, g) => a + groupCost(g[1], 48), 0));
    expect(Math.max(...loads) - Math.min(...loads)).toBeLessThanOrEqual(3);
  });

  it("sends every transform group (state-sized scratch arrays) to the calling thread", () => {
    const big = (x: number): MaskGroup => [
      x,
      Array.from({ length: 60 }, (_, t) => ({ index: 100 * x + t, z: t, k: 0 })),
    ];
    const small = (x: number): MaskGroup => [x, [{ index: 100 * x, z: 0, k: 0 }]];
    const groups = [big(1), small(2), big(3), small(4), small(5), big(6), small(7)];
    const dealt = dealGroups(groups, 2, 48);
    expect(dealt[0].filter((g) => g[1].length > 48).map((g) => g[0])).toEqual([1, 3, 6]);
    expect(dealt[1].every((g) => g[1].length <= 48)).toBe(true);
    expect(dealt.flat()).toHaveLength(groups.length);
  });

  it("keeps two single terms that share a pass (same highest bit and bit 0) on one thread", () => {
    // single-term masks 8…63: keys pair e.g. 8 with 10, 9 with 11 (highest bit 3, bit 0 equal)
    const groups: MaskGroup[] = Array.from({ length: 56 }, (_, i) => [
      i + 8,
      [{ index: i, z: i, k: 0 }],
    ]);
    const dealt = dealGroups(groups, 4, 48);
    expect(dealt.flat()).toHaveLength(groups.length);
    const threadOf = new Map<number, number>();
    dealt.forEach((part, t) => part.forEach(([x]) => threadOf.set(x, t)));
    const byKey = new Map<number, number[]>();
    for (const [x] of groups) {
      const key = ((31 - Math.clz32(x)) << 1) | (x & 1);
      byKey.set(key, [...(byKey.get(key) ?? []), x]);
    }
    for (const xs of byKey.values())
      for (let j = 0; j + 1 < xs.length; j += 2)
        expect(threadOf.get(xs[j])).toBe(threadOf.get(xs[j + 1]));
    const counts = dealt.map((p) => p.length);
    expect(Math.max(...counts) - Math.min(...counts)).toBeLessThanOrEqual(2);
  });
});

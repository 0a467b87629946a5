/**
 * Histograms pass a chi-square goodness-of-fit test at α = 0.001.
 * Critical values: NIST/SEMATECH e-Handbook of Statistical Methods, table 1.3.6.7.4
 * (df 1: 10.828, 3: 16.266, 7: 24.322, 15: 37.697 — typed from memory) cross-checked
 * with jstat's chi-square inverse CDF. Seeds are fixed (a correct sampler still fails
 * one run in 1,000 at this α). Expected probabilities come from an independent mathjs
 * computation |⟨b|U|ψ⟩|² with U = ⊗ (H for X, H·S† for Y, 1 for Z).
 */
import * as math from "mathjs";
import { describe, expect, it } from "vitest";
import { bitstringToIndex } from "@/lib/quantum/observable/bits";
import {
  IntervalAssigner,
  cumulative,
  drawSortedOutcomes,
} from "@/lib/quantum/sampling/multinomial";
import { createRng } from "@/lib/quantum/sampling/rng";
import { sampleObservable } from "@/lib/quantum/sampling/sample-observable";
import { mulberry32, randomState } from "../observable/random-states";
import { chiSquare, chiSquareInv, options, pauliObservable } from "./sampling-helpers";

const NIST_CRITICAL: Record<number, number> = { 1: 10.828, 3: 16.266, 7: 24.322, 15: 37.697 };

function rotation(letter: string): math.Matrix {
  const s = Math.SQRT1_2;
  if (letter === "X")
    return math.matrix([
      [s, s],
      [s, -s],
    ]);
  if (letter === "Y")
    return math.matrix([
      [math.complex(s, 0), math.complex(0, -s)],
      [math.complex(s, 0), math.complex(0, s)],
    ]);
  return math.identity(2) as math.Matrix;
}

describe("chi-square critical values (NIST table vs jstat)", () => {
  it.each(Object.entries(NIST_CRITICAL))("df %s", (df, v) => {
    expect(chiSquareInv(0.999, Number(df))).toBeCloseTo(v, 2);
  });
});

describe("goodness of fit of sampled histograms (critical values above)", () => {
  const cases: [string, number][] = [
    ["Y", 101],
    ["XY", 202],
    ["ZXY", 303],
    ["YZXZ", 404],
  ];
  it.each(cases)("setting %s (seed %i)", async (bases, seed) => {
    const n = bases.length;
    const df = 2 ** n - 1;
    const state = randomState(n, mulberry32(seed));
    // expected law from mathjs: U = kron(U_{n−1}, …, U_0) in the engine's index order
    let u: math.Matrix = math.matrix([[1]]);
    for (let q = 0; q < n; q++) u = math.kron(rotation(bases[q]), u) as math.Matrix;
    const psi = math.matrix(Array.from(state.re, (r, i) => [math.complex(r, state.im[i])]));
    const phi = (math.multiply(u, psi) as math.Matrix).toArray() as unknown as math.Complex[][];
    const probs = phi.map(([z]) => (typeof z === "number" ? z * z : z.re * z.re + z.im * z.im));
    const word = bases
      .split("")
      .map((b, q) => `${b}${q}`)
      .join(" ");
    const shots = 20_000;
    const out = await sampleObservable(
      { kind: "statevector", state },
      pauliObservable(word, n),
      options({ shots, seed }),
    );
    const counts = new Array<number>(2 ** n).fill(0);
    for (const [bits, c] of Object.entries(out.groups[0].counts!))
      counts[bitstringToIndex(bits)] = c;
    expect(out.groups[0].bases).toBe(bases);
    expect(chiSquare(counts, probs, shots)).toBeLessThan(NIST_CRITICAL[df]);
  });

  it("sorted multinomial draws fit a skewed 16-outcome law (df 15) and come out ascending", () => {
    const w = Float64Array.from({ length: 16 }, (_, i) => 1 + i * i);
    const tot = w.reduce((a, b) => a + b, 0);
    const rng = createRng(12345);
    const shots = 50_000;
    const out = new Int32Array(shots);
    drawSortedOutcomes(cumulative(w), shots, rng, out, new Float64Array(shots));
    const counts = new Array<number>(16).fill(0);
    for (let s = 0; s < shots; s++) {
      counts[out[s]]++;
      if (s > 0) expect(out[s]).toBeGreaterThanOrEqual(out[s - 1]);
    }
    expect(
      chiSquare(
        counts,
        Array.from(w, (x) => x / tot),
        shots,
      ),
    ).toBeLessThan(NIST_CRITICAL[15]);
  });

  it("a law over 2^18 outcomes with few shots (galloping search) fits too (df 15 on 16 bins)", () => {
    const k = 1 << 18;
    const w = Float64Array.from({ length: k }, (_, i) => (i % 7) + (i >> 14));
    const bins = new Array<number>(16).fill(0);
    w.forEach((x, i) => (bins[i >> 14] += x));
    const tot = bins.reduce((a, b) => a + b, 0);
    const shots = 3_000;
    const out = new Int32Array(shots);
    drawSortedOutcomes(cumulative(w), shots, createRng(99), out, new Float64Array(shots));
    const counts = new Array<number>(16).fill(0);
    out.forEach((b) => counts[b >> 14]++);
    expect(
      chiSquare(
        counts,
        bins.map((x) => x / tot),
        shots,
      ),
    ).toBeLessThan(NIST_CRITICAL[15]);
  });

  it("zero-probability outcomes are never drawn", () => {
    const out = new Int32Array(10_000);
    drawSortedOutcomes(
      cumulative(new Float64Array([0, 0.5, 0, 0.5, 0])),
      10_000,
      createRng(3),
      out,
      new Float64Array(10_000),
    );
    expect([...new Set(out)].sort()).toEqual([1, 3]);
  });

  it("interval dealing equals a random permutation: 3 items into intervals of sizes 1, 2 — each item first with p = 1/3 (df 2 < 13.816, NIST α = 0.001)", () => {
    // 13.816 typed from memory, checked against jstat
    expect(chiSquareInv(0.999, 2)).toBeCloseTo(13.816, 2);
    const rng = createRng(8);
    const first = [0, 0, 0];
    const trials = 30_000;
    for (let t = 0; t < trials; t++) {
      const deal = new IntervalAssigner([1, 2], rng);
      const slots = [deal.next(), deal.next(), deal.next()];
      expect(slots.filter((s) => s === 0).length).toBe(1);
      first[slots.indexOf(0)]++;
    }
    expect(chiSquare(first, [1 / 3, 1 / 3, 1 / 3], trials)).toBeLessThan(13.816);
  });
});

/**
 * The WebAssembly Pauli flip-mask pass against the JavaScript pass (per term, 1e-12) and,
 * on small registers, against a dense mathjs computation (reference: mathjs kron/multiply,
 * ⟨ψ|A|ψ⟩ with A built from Kronecker products of the Pauli matrices). Sums mix diagonal
 * words, masks below 4 (lane permutations only) and higher masks, single terms and groups
 * of terms sharing a mask. Every kernel (one term, four terms, two masks in one pass) must give
 * a term the same bits, so results do not depend on how terms were grouped or dealt to threads.
 */
import { describe, expect, it } from "vitest";
import { parsePauliSum } from "@/lib/quantum/observable/pauli-parse";
import {
  pauliExpectationsOnState,
  weightedTotal,
} from "@/lib/quantum/observable/pauli-expectation";
import { padPauliSum } from "@/lib/quantum/observable/pauli-word";
import { wasmBinding } from "@/lib/quantum/wasm/runtime";
import { denseExpectation, sumMatrix } from "../observable/dense-reference";
import { mulberry32, randomPauliText } from "../observable/random-states";
import { randomKernelState } from "./support";

/** Words sharing flip masks: every Z/Y pattern over the given X/Y letters. */
function sharedMaskText(n: number): string {
  const words: string[] = [];
  for (const a of ["X", "Y"])
    for (const b of ["I", "Z"])
      for (const c of ["X", "Y"]) {
        const w = Array.from({ length: n }, () => "I");
        w[0] = a;
        w[Math.min(1, n - 1)] = b === "I" ? w[Math.min(1, n - 1)] : b;
        w[n - 1] = c;
        words.push(w.join(""));
      }
  return words.map((w, i) => `${(0.1 * (i + 1)).toFixed(1)} ${w}`).join(" + ");
}

function check(n: number, termCount: number, seed: number): void {
  const rand = mulberry32(seed);
  const text = `${randomPauliText(n, termCount, rand)} + ${sharedMaskText(n)} + 0.5 ${"Z".repeat(n)}`;
  const sum = padPauliSum(parsePauliSum(text), n);
  const w = randomKernelState(n, seed);
  const state = { n, re: w.re, im: w.im };
  expect(wasmBinding(state.re, state.im)).toBeDefined();
  const js = { n, re: w.re.slice(), im: w.im.slice() };
  const a = pauliExpectationsOnState(state, sum);
  const b = pauliExpectationsOnState(js, sum);
  let diff = 0;
  for (let i = 0; i < a.length; i++) diff = Math.max(diff, Math.abs(a[i] - b[i]));
  expect(diff).toBeLessThan(1e-12);
  if (n <= 6) {
    // reference: mathjs kron/multiply
    expect(weightedTotal(sum, a)).toBeCloseTo(denseExpectation(sumMatrix(sum.terms, n), js), 10);
  }
}

describe("WebAssembly Pauli pass", () => {
  it("matches the JavaScript pass and mathjs on 2–6 qubits", () => {
    for (const n of [2, 3, 4, 6]) check(n, 40, 900 + n);
  });

  it("matches the JavaScript pass on 11 and 14 qubits (hundreds of masks)", () => {
    check(11, 300, 77);
    check(14, 200, 78);
  });

  it("gives every term the same bits alone as paired with another mask in one pass", () => {
    const n = 12;
    // random words: distinct masks, most of them paired (same highest bit and bit 0)
    const sum = padPauliSum(parsePauliSum(randomPauliText(n, 120, mulberry32(5))), n);
    const w = randomKernelState(n, 6);
    const state = { n, re: w.re, im: w.im };
    const together = pauliExpectationsOnState(state, sum, undefined, 1);
    sum.terms.forEach((t, i) => {
      const alone = pauliExpectationsOnState(state, { ...sum, terms: [t] }, undefined, 1);
      expect(Object.is(alone[0], together[i])).toBe(true);
    });
  });
});

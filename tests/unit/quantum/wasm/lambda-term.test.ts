/**
 * λ = A·ψ with the SIMD per-term pass (wasm/lambda.ts), used when λ and ψ share a kernel
 * memory (the gradient's companion state): against the dense mathjs product on 5 qubits
 * (reference: mathjs kron/multiply of the Pauli matrices) and against the JavaScript
 * per-mask pass on plain copies on 10 qubits (1e-12), over sums mixing X, Y and Z letters,
 * masks with lane swaps (bit 0) and permutations (bits 1–2), diagonal terms and masks
 * shared by up to four terms and by more (the JavaScript tables); and on output ranges.
 */
import * as math from "mathjs";
import { describe, expect, it } from "vitest";
import { prepareObservable } from "@/lib/quantum/estimate/prepare-observable";
import { applyObservableInto, pauliLambdaRange } from "@/lib/quantum/gradient/apply-observable";
import {
  bindMemory,
  companionOf,
  createKernelMemory,
  stateViews,
} from "@/lib/quantum/wasm/runtime";
import { stateColumn, sumMatrix } from "../observable/dense-reference";
import { mulberry32 } from "../observable/random-states";

function kernelPair(n: number, rand: () => number) {
  const memory = createKernelMemory(n, 0, true);
  if (!memory || !bindMemory(memory, 0)) throw new Error("WebAssembly kernels unavailable");
  const psi = { n, ...stateViews(memory, n) };
  const lambda = companionOf(psi.re);
  if (!lambda) throw new Error("no companion state");
  for (let i = 0; i < psi.re.length; i++) {
    psi.re[i] = rand() - 0.5;
    psi.im[i] = rand() - 0.5;
  }
  lambda.re.fill(0);
  lambda.im.fill(0);
  return { psi, lambda };
}

function randomTerms(n: number, count: number, rand: () => number) {
  const terms: { coefficient: number; word: string }[] = [];
  for (let t = 0; t < count; t++) {
    let word = "";
    for (let q = 0; q < n; q++) word += "IXYZ"[Math.floor(rand() * 4)];
    terms.push({ coefficient: Number((rand() * 2 - 1).toFixed(6)), word });
  }
  // a mask shared by six terms (JavaScript tables) and one by three (SIMD per term)
  for (const z of ["IZIIZ", "ZIIII", "IIZZI", "ZZZZZ", "IIIIZ", "IZZII"])
    terms.push({ coefficient: 0.25, word: ("XY" + z.slice(2)).padEnd(n, "I") });
  for (const z of ["IIZ", "ZII", "IZI"])
    terms.push({ coefficient: -0.5, word: ("IY" + z).padEnd(n, "I") });
  return terms;
}

const text = (terms: { coefficient: number; word: string }[]) =>
  terms
    .map((t) => `${t.coefficient} ${t.word}`)
    .join(" + ")
    .replace(/\+ -/g, "- ");

describe("λ = A·ψ in a kernel memory (SIMD per-term pass)", () => {
  it("equals the dense mathjs product on 5 qubits (seed 91)", () => {
    const rand = mulberry32(91);
    const n = 5;
    const terms = randomTerms(n, 14, rand);
    const obs = prepareObservable({ format: "pauli", terms: text(terms) }, n);
    const { psi, lambda } = kernelPair(n, rand);
    applyObservableInto(obs, psi, lambda.re, lambda.im);
    const want = math.multiply(sumMatrix(terms, n), stateColumn(psi)) as math.Matrix;
    for (let i = 0; i < 2 ** n; i++) {
      const z = want.get([i, 0]) as math.Complex;
      expect(Math.abs(lambda.re[i] - z.re)).toBeLessThan(1e-12);
      expect(Math.abs(lambda.im[i] - z.im)).toBeLessThan(1e-12);
    }
  });

  it("equals the JavaScript pass on 10 qubits, whole and by output ranges (seed 92)", () => {
    const rand = mulberry32(92);
    const n = 10;
    const obs = prepareObservable({ format: "pauli", terms: text(randomTerms(n, 60, rand)) }, n);
    if (obs.kind !== "pauli") throw new Error("expected a Pauli sum");
    const { psi, lambda } = kernelPair(n, rand);
    const plain = { n, re: psi.re.slice(), im: psi.im.slice() };
    const want = { re: new Float64Array(2 ** n), im: new Float64Array(2 ** n) };
    pauliLambdaRange(obs.sum.terms, plain, want.re, want.im, 0, 2 ** n);
    for (const cuts of [
      [0, 1024],
      [0, 256, 512, 1024],
      [0, 8, 1000, 1024],
    ]) {
      lambda.re.fill(0);
      lambda.im.fill(0);
      for (let c = 0; c + 1 < cuts.length; c++)
        pauliLambdaRange(obs.sum.terms, psi, lambda.re, lambda.im, cuts[c], cuts[c + 1]);
      for (let i = 0; i < 2 ** n; i++) {
        expect(Math.abs(lambda.re[i] - want.re[i])).toBeLessThan(1e-12);
        expect(Math.abs(lambda.im[i] - want.im[i])).toBeLessThan(1e-12);
      }
    }
  });
});

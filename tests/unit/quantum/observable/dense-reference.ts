/**
 * Independent dense reference computations with mathjs (complex dense
 * matrices, Kronecker products). Index convention of the engine's STATE:
 * basis index bit k = qubit k, so the matrix of a dense word P0 P1 … P(n−1) in state
 * index order is kron(P(n−1), …, P1, P0) (qubit 0 is the least significant factor).
 * Matrix observables as users WRITE them use the textbook order instead:
 * kron(A0, A1, …) with qubit 0 the leftmost factor; `writtenOrderState` turns an
 * engine state into that order (index digits read as a binary string, reversed).
 */
import * as math from "mathjs";
import type { DensityMatrix, StateVector } from "@/lib/quantum/types";

type M = math.Matrix;

const C = (re: number, im = 0): math.Complex => math.complex(re, im);

export const PAULI: Record<string, M> = {
  I: math.matrix([
    [C(1), C(0)],
    [C(0), C(1)],
  ]),
  X: math.matrix([
    [C(0), C(1)],
    [C(1), C(0)],
  ]),
  Y: math.matrix([
    [C(0), C(0, -1)],
    [C(0, 1), C(0)],
  ]),
  Z: math.matrix([
    [C(1), C(0)],
    [C(0), C(-1)],
  ]),
};

/** Dense matrix of a dense Pauli word (qubit 0 first in the word). */
export function wordMatrix(word: string): M {
  let m: M = math.matrix([[C(1)]]);
  for (let q = 0; q < word.length; q++) m = math.kron(PAULI[word[q]], m) as M;
  return m;
}

export function sumMatrix(terms: { coefficient: number; word: string }[], n: number): M {
  const d = 2 ** n;
  let m: M = math.zeros(d, d) as M;
  for (const t of terms)
    m = math.add(m, math.multiply(t.coefficient, wordMatrix(t.word.padEnd(n, "I")))) as M;
  return m;
}

export function stateColumn(s: StateVector): M {
  return math.matrix(Array.from(s.re, (r, i) => [C(r, s.im[i])]));
}

export function densityMatrixOf(rho: DensityMatrix): M {
  const d = 2 ** rho.n;
  const rows: math.Complex[][] = [];
  for (let i = 0; i < d; i++)
    rows.push(Array.from({ length: d }, (_, j) => C(rho.re[i * d + j], rho.im[i * d + j])));
  return math.matrix(rows);
}

/** ⟨ψ|A|ψ⟩ (real part). */
export function denseExpectation(a: M, s: StateVector): number {
  const v = stateColumn(s);
  const r = math.multiply(math.ctranspose(v), math.multiply(a, v)) as M;
  const z = r.get([0, 0]) as math.Complex | number;
  return typeof z === "number" ? z : z.re;
}

/** Tr(ρA) (real part). */
export function denseTrace(a: M, rho: DensityMatrix): number {
  const z = math.trace(math.multiply(densityMatrixOf(rho), a) as M) as unknown as
    math.Complex | number;
  return typeof z === "number" ? z : z.re;
}

export function complexToArrays(m: M): { real: number[][]; imag: number[][] } {
  const arr = m.toArray() as unknown as math.Complex[][];
  return {
    real: arr.map((row) => row.map((z) => (typeof z === "number" ? z : z.re))),
    imag: arr.map((row) => row.map((z) => (typeof z === "number" ? 0 : z.im))),
  };
}

/** Index i of the state (bit k = qubit k) in the written order: its n binary digits reversed. */
export function writtenIndex(i: number, n: number): number {
  return parseInt(i.toString(2).padStart(n, "0").split("").reverse().join(""), 2);
}

/** The same state with amplitudes in written (textbook, qubit 0 most significant) order. */
export function writtenOrderState(s: StateVector): StateVector {
  const d = 2 ** s.n;
  const re = new Float64Array(d);
  const im = new Float64Array(d);
  for (let i = 0; i < d; i++) {
    re[writtenIndex(i, s.n)] = s.re[i];
    im[writtenIndex(i, s.n)] = s.im[i];
  }
  return { n: s.n, re, im };
}

/** The same density matrix with rows and columns in written order. */
export function writtenOrderDensity(rho: DensityMatrix): DensityMatrix {
  const d = 2 ** rho.n;
  const re = new Float64Array(d * d);
  const im = new Float64Array(d * d);
  for (let i = 0; i < d; i++) {
    for (let j = 0; j < d; j++) {
      const k = writtenIndex(i, rho.n) * d + writtenIndex(j, rho.n);
      re[k] = rho.re[i * d + j];
      im[k] = rho.im[i * d + j];
    }
  }
  return { n: rho.n, re, im };
}

/** Matrix of a dense word as users write matrices: kron(P0, P1, …), qubit 0 leftmost. */
export function writtenWordMatrix(word: string): M {
  let m: M = math.matrix([[C(1)]]);
  for (let q = 0; q < word.length; q++) m = math.kron(m, PAULI[word[q]]) as M;
  return m;
}

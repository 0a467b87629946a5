/**
 * Matrix observables: validation, Hermiticity message, exact expectation vs mathjs,
 * and the eigendecomposition rebuilding its input (mljs-style property check).
 */
import * as math from "mathjs";
import { describe, expect, it } from "vitest";
import { EngineError } from "@/lib/quantum/errors";
import { hermitianEigen } from "@/lib/quantum/observable/hermitian-eigen";
import {
  matrixExpectationOnDensity,
  matrixExpectationOnState,
} from "@/lib/quantum/observable/matrix-expectation";
import { parseMatrixObservable } from "@/lib/quantum/observable/matrix-observable";
import {
  complexToArrays,
  denseExpectation,
  denseTrace,
  sumMatrix,
  writtenOrderDensity,
  writtenOrderState,
} from "./dense-reference";
import { mulberry32, randomDensity, randomState } from "./random-states";

function randomHermitian(n: number, rand: () => number): { real: number[][]; imag: number[][] } {
  const d = 2 ** n;
  const real = Array.from({ length: d }, () => new Array<number>(d).fill(0));
  const imag = Array.from({ length: d }, () => new Array<number>(d).fill(0));
  for (let i = 0; i < d; i++) {
    real[i][i] = rand() * 4 - 2;
    for (let j = i + 1; j < d; j++) {
      real[i][j] = real[j][i] = rand() * 2 - 1;
      imag[i][j] = rand() * 2 - 1;
      imag[j][i] = -imag[i][j];
    }
  }
  return { real, imag };
}

function errorOf(f: () => unknown): EngineError {
  try {
    f();
  } catch (e) {
    if (e instanceof EngineError) return e;
    throw e;
  }
  throw new Error("expected an EngineError");
}

describe("matrix observable validation", () => {
  it("names the worst non-Hermitian entry pair and its mismatch", () => {
    const e = errorOf(() =>
      parseMatrixObservable({
        real: [
          [1, 0.5],
          [0.5, -1],
        ],
        imag: [
          [0, 0.2],
          [0.1, 0],
        ],
      }),
    );
    expect(e.code).toBe("not_hermitian");
    expect(e.message).toBe(
      "the matrix is not Hermitian: entry (0,1) = 0.5+0.2i but conjugate of entry (1,0) = 0.5\u22120.1i; mismatch 0.3",
    );
    expect(e.issues[0].path).toEqual(["observable", "imag", 0, 1]);
  });

  it("a complex diagonal entry breaks Hermiticity", () => {
    const e = errorOf(() =>
      parseMatrixObservable({
        real: [
          [1, 0],
          [0, 2],
        ],
        imag: [
          [0, 0],
          [0, 0.1],
        ],
      }),
    );
    expect(e.message).toMatch(
      /entry \(1,1\) = 2\+0\.1i but conjugate of entry \(1,1\) = 2\u22120\.1i; mismatch 0\.2/,
    );
  });

  it("accepts round-off within the relative tolerance 1e-10 and symmetrises", () => {
    const h = parseMatrixObservable({
      real: [
        [1e6, 2e6],
        [2e6 + 1e-5, 0],
      ],
    });
    expect(h.re[1]).toBeCloseTo(2e6 + 5e-6, 6);
    expect(() =>
      parseMatrixObservable({
        real: [
          [1, 2],
          [2 + 1e-8, 0],
        ],
      }),
    ).toThrow(/not Hermitian/);
  });

  it("dimension, shape and finiteness errors", () => {
    expect(
      errorOf(() =>
        parseMatrixObservable({
          real: [
            [1, 0, 0],
            [0, 1, 0],
            [0, 0, 1],
          ],
        }),
      ).message,
    ).toMatch(/dimension must be 2\^n/);
    expect(errorOf(() => parseMatrixObservable({ real: [[1, 0], [0]] })).message).toMatch(
      /row 1 of "real" must have 2 entries/,
    );
    expect(
      errorOf(() =>
        parseMatrixObservable({
          real: [
            [1, Number.NaN],
            [0, 1],
          ],
        }),
      ).issues[0].path,
    ).toEqual(["observable", "real", 0, 1]);
    expect(
      errorOf(() =>
        parseMatrixObservable({
          real: [
            [1, 0],
            [0, 1],
          ],
          imag: [[0, 0]],
        }),
      ).message,
    ).toMatch(/"imag" has 1 rows/);
    expect(
      errorOf(() =>
        parseMatrixObservable(
          {
            real: [
              [1, 0],
              [0, 1],
            ],
          },
          3,
        ),
      ).message,
    ).toBe("the matrix is 2×2 (1 qubit) but the circuit has 3 qubits; it must be 8×8");
    expect(
      errorOf(() =>
        parseMatrixObservable({ real: Array.from({ length: 512 }, () => new Array(512).fill(0)) }),
      ).code,
    ).toBe("too_large");
  });
});

describe("exact expectation vs mathjs dense computation (random Hermitian, 1–4 qubits)", () => {
  it("statevector and density matrix agree to 1e-10", () => {
    const rand = mulberry32(99);
    for (let trial = 0; trial < 24; trial++) {
      const n = 1 + (trial % 4);
      const input = randomHermitian(n, rand);
      const h = parseMatrixObservable(input, n);
      const ref = math.add(
        math.matrix(input.real),
        math.multiply(math.complex(0, 1), math.matrix(input.imag)),
      ) as math.Matrix;
      const s = randomState(n, rand);
      // the matrix is written in textbook order (qubit 0 the leftmost factor); the engine's
      // state has index bit k = qubit k, so the reference reads the state in written order
      expect(
        Math.abs(matrixExpectationOnState(s, h) - denseExpectation(ref, writtenOrderState(s))),
      ).toBeLessThan(1e-10);
      const rho = randomDensity(n, rand);
      expect(
        Math.abs(matrixExpectationOnDensity(rho, h) - denseTrace(ref, writtenOrderDensity(rho))),
      ).toBeLessThan(1e-10);
    }
  });
});

describe("Hermitian eigendecomposition (ml-matrix, real symmetric embedding)", () => {
  function rebuildError(input: { real: number[][]; imag?: number[][] }): {
    err: number;
    orth: number;
    sorted: boolean;
  } {
    const h = parseMatrixObservable(input);
    const e = hermitianEigen(h);
    const d = h.dim;
    let err = 0;
    let orth = 0;
    for (let i = 0; i < d; i++) {
      for (let j = 0; j < d; j++) {
        let re = 0;
        let im = 0;
        let gr = 0;
        let gi = 0;
        for (let k = 0; k < d; k++) {
          // Σ_k λ_k v_k[i] conj(v_k[j])
          const ar = e.vecRe[k * d + i],
            ai = e.vecIm[k * d + i];
          const br = e.vecRe[k * d + j],
            bi = -e.vecIm[k * d + j];
          re += e.values[k] * (ar * br - ai * bi);
          im += e.values[k] * (ar * bi + ai * br);
          // Gram matrix of eigenvectors: ⟨v_i|v_j⟩
          const xr = e.vecRe[i * d + k],
            xi = -e.vecIm[i * d + k];
          const yr = e.vecRe[j * d + k],
            yi = e.vecIm[j * d + k];
          gr += xr * yr - xi * yi;
          gi += xr * yi + xi * yr;
        }
        err = Math.max(err, Math.hypot(re - h.re[i * d + j], im - h.im[i * d + j]));
        orth = Math.max(orth, Math.hypot(gr - (i === j ? 1 : 0), gi));
      }
    }
    const sorted = e.values.every((v, k) => k === 0 || v >= e.values[k - 1] - 1e-12);
    return { err, orth, sorted };
  }

  it("V diag(λ) V† rebuilds random Hermitian matrices (1–4 qubits) and V is unitary", () => {
    const rand = mulberry32(3);
    for (let n = 1; n <= 4; n++) {
      const r = rebuildError(randomHermitian(n, rand));
      expect(r.err).toBeLessThan(1e-10);
      expect(r.orth).toBeLessThan(1e-10);
      expect(r.sorted).toBe(true);
    }
  });

  it("handles degenerate complex spectra: a Pauli sum with Y terms (mathjs-built matrix)", () => {
    const m = sumMatrix(
      [
        { coefficient: 1, word: "YZY" },
        { coefficient: 0.5, word: "XYI" },
        { coefficient: 2, word: "III" },
      ],
      3,
    );
    const r = rebuildError(complexToArrays(m));
    expect(r.err).toBeLessThan(1e-10);
    expect(r.orth).toBeLessThan(1e-10);
  });

  it("eigenvalues match mathjs eigs of the same matrix", () => {
    const input = randomHermitian(3, mulberry32(8));
    const e = hermitianEigen(parseMatrixObservable(input));
    const ref = math.add(
      math.matrix(input.real),
      math.multiply(math.complex(0, 1), math.matrix(input.imag)),
    ) as math.Matrix;
    const vals = (math.eigs(ref).values as math.Matrix)
      .toArray()
      .map((z) => (typeof z === "number" ? z : (z as math.Complex).re))
      .sort((a, b) => (a as number) - (b as number));
    vals.forEach((v, k) => expect(e.values[k]).toBeCloseTo(v as number, 9));
  });

  it("real symmetric input uses the direct path and still rebuilds", () => {
    const r = rebuildError({
      real: [
        [2, 1, 0, 0],
        [1, 2, 0, 0],
        [0, 0, 2, 1],
        [0, 0, 1, 2],
      ],
    });
    expect(r.err).toBeLessThan(1e-12);
  });
});

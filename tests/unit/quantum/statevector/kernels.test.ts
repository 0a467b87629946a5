/**
 * Kernel specialisations vs the dense path (fast-check, fixed seed), and the structure
 * detection on textbook gates (matrices from Nielsen & Chuang §4.2–4.3, values from memory).
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { applyDense, applyToAmplitudes } from "@/lib/quantum/statevector/dispatch";
import { classifyMatrix } from "@/lib/quantum/statevector/matrix-classify";
import { applyUnitaryDM, conjugateMatrix } from "@/lib/quantum/density-matrix/kernels";
import { densityFromState } from "@/lib/quantum/density-matrix/state";
import { GATE_KINDS, makeRng, randomMatrix, randomQubits, type Rng } from "./support/random-gates";

function randomAmplitudes(rng: Rng, n: number): { re: Float64Array; im: Float64Array } {
  const re = new Float64Array(2 ** n).map(() => rng.float() - 0.5);
  const im = new Float64Array(2 ** n).map(() => rng.float() - 0.5);
  return { re, im };
}

function maxDiff(a: Float64Array, b: Float64Array): number {
  let m = 0;
  for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i] - b[i]));
  return m;
}

const f64 = (...v: number[]): Float64Array => Float64Array.from(v);
const s = Math.SQRT1_2;
const H = f64(s, 0, s, 0, s, 0, -s, 0);
const X = f64(0, 0, 1, 0, 1, 0, 0, 0);
const T = f64(1, 0, 0, 0, 0, 0, s, s);
/** 4×4 from a list of [row, col, re, im]. */
function m4(entries: [number, number, number, number][]): Float64Array {
  const m = new Float64Array(32);
  for (const [r, c, re, im] of entries) {
    m[2 * (4 * r + c)] = re;
    m[2 * (4 * r + c) + 1] = im;
  }
  return m;
}
const CX = m4([
  [0, 0, 1, 0],
  [1, 1, 1, 0],
  [2, 3, 1, 0],
  [3, 2, 1, 0],
]);
const CZ = m4([
  [0, 0, 1, 0],
  [1, 1, 1, 0],
  [2, 2, 1, 0],
  [3, 3, -1, 0],
]);
const SWAP = m4([
  [0, 0, 1, 0],
  [1, 2, 1, 0],
  [2, 1, 1, 0],
  [3, 3, 1, 0],
]);

describe("structure detection (textbook gates, N&C §4.2–4.3)", () => {
  it("classifies x, h, t, cx, cz, swap", () => {
    expect(classifyMatrix(X, 2)).toMatchObject({
      permutation: true,
      diagonal: false,
      active: [0, 1],
    });
    expect(classifyMatrix(H, 2)).toMatchObject({ permutation: false, diagonal: false, real: true });
    expect(classifyMatrix(T, 2)).toMatchObject({ diagonal: true, active: [1] });
    expect(classifyMatrix(CX, 4)).toMatchObject({ permutation: true, active: [2, 3] }); // control=1 subspace only
    expect(classifyMatrix(CZ, 4)).toMatchObject({ diagonal: true, active: [3] });
    expect(classifyMatrix(SWAP, 4)).toMatchObject({ permutation: true, active: [1, 2] });
  });

  it("recognises a cx fused with a gate on its target as block-diagonal in the control's basis", () => {
    // cx·(I ⊗ H) = |0⟩⟨0| ⊗ H + |1⟩⟨1| ⊗ XH
    const m = m4([
      [0, 0, s, 0],
      [0, 1, s, 0],
      [1, 0, s, 0],
      [1, 1, -s, 0],
      [2, 2, s, 0],
      [2, 3, -s, 0],
      [3, 2, s, 0],
      [3, 3, s, 0],
    ]);
    expect(classifyMatrix(m, 4).blockOperand).toBe(0);
    // the same with the operands swapped: block-diagonal in the SECOND operand's basis
    const swapped = m4([
      [0, 0, s, 0],
      [2, 0, s, 0],
      [0, 2, s, 0],
      [2, 2, -s, 0],
      [1, 1, s, 0],
      [1, 3, -s, 0],
      [3, 1, s, 0],
      [3, 3, s, 0],
    ]);
    expect(classifyMatrix(swapped, 4).blockOperand).toBe(1);
    expect(classifyMatrix(CX, 4).blockOperand).toBe(0);
  });
});

describe("specialised kernels agree with the dense path (fast-check, seed 20240611)", () => {
  it("every gate kind, 1–3 qubits, random operand order, 1–9-qubit registers", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 2 ** 30 }),
        fc.constantFrom(...GATE_KINDS),
        (seed, kind) => {
          const rng = makeRng(seed);
          const n = rng.int(1, 9);
          const k = rng.int(1, Math.min(3, n));
          const qubits = randomQubits(rng, n, k);
          const m = randomMatrix(rng, 1 << k, kind);
          const a = randomAmplitudes(rng, n);
          const b = { re: a.re.slice(), im: a.im.slice() };
          applyToAmplitudes(a.re, a.im, qubits, m);
          applyDense(b.re, b.im, qubits, m);
          expect(maxDiff(a.re, b.re)).toBeLessThan(1e-12);
          expect(maxDiff(a.im, b.im)).toBeLessThan(1e-12);
        },
      ),
      { seed: 20240611, numRuns: 400 },
    );
  });

  it("the one-pass 1-qubit DM kernel (U ⊗ conj U) equals the two-pass form, and UρU† of a pure state is |Uψ⟩⟨Uψ|", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 2 ** 30 }),
        fc.constantFrom(...GATE_KINDS),
        (seed, kind) => {
          const rng = makeRng(seed);
          const n = rng.int(1, 4);
          const k = rng.int(1, Math.min(2, n));
          const qubits = randomQubits(rng, n, k);
          const m = randomMatrix(rng, 1 << k, kind);
          const psi = randomAmplitudes(rng, n);
          const rho = densityFromState({ n, ...psi });
          applyUnitaryDM(rho, qubits, m);
          // two passes by hand on the vectorised ρ: U on the row bits, conj(U) on the column bits
          const two = densityFromState({ n, ...psi });
          applyDense(
            two.re,
            two.im,
            qubits.map((q) => q + n),
            m,
          );
          applyDense(two.re, two.im, qubits, conjugateMatrix(m));
          applyDense(psi.re, psi.im, qubits, m);
          const pure = densityFromState({ n, ...psi });
          expect(maxDiff(rho.re, two.re)).toBeLessThan(1e-12);
          expect(maxDiff(rho.im, two.im)).toBeLessThan(1e-12);
          expect(maxDiff(rho.re, pure.re)).toBeLessThan(1e-12);
          expect(maxDiff(rho.im, pure.im)).toBeLessThan(1e-12);
        },
      ),
      { seed: 77, numRuns: 150 },
    );
  });
});

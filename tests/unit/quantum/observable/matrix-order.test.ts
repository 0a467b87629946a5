/**
 * One qubit order for matrix observables: the matrix is that of A0 ⊗ A1 ⊗ … with qubit 0
 * the leftmost Kronecker factor (textbook tensor order, Nielsen & Chuang §2.1.7), the same
 * operator as the dense Pauli word A0 A1 …. References: mathjs `kron` in written order
 * (mathjs docs: kron(A, B) puts A's indices most significant), mathjs/ml-matrix dense
 * eigenvalues, and the textbook value ⟨Z⟩ = −1 on |1⟩.
 */
import * as math from "mathjs";
import { describe, expect, it } from "vitest";
import { estimate } from "@/lib/quantum";
import { parseMatrixObservable, writtenMatrix } from "@/lib/quantum/observable/matrix-observable";
import { pauliDecomposition } from "@/lib/quantum/observable/pauli-decomposition";
import {
  expectationOf,
  randomCircuit,
  referenceState,
  toQasm2,
  writtenOrder,
} from "../estimate/circuit-reference";
import { complexToArrays, writtenWordMatrix } from "./dense-reference";
import { mulberry32 } from "./random-states";

const qasm2 = (n: number, body: string) =>
  `OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[${n}];\n${body}\n`;
const LETTERS = ["I", "X", "Y", "Z"];

function randomWord(n: number, rand: () => number): string {
  let w = "";
  for (let q = 0; q < n; q++) w += LETTERS[Math.floor(rand() * 4)];
  return w;
}

describe("the reported case: kron(Z, I) is Z on qubit 0", () => {
  it("x q[0] then diag(1, 1, −1, −1) = kron(Z, I) gives −1, the same as the Pauli word Z0 (textbook ⟨1|Z|1⟩ = −1)", async () => {
    const source = qasm2(2, "x q[0];");
    const m = await estimate({
      circuit: { format: "qasm2", source },
      observable: {
        format: "matrix",
        real: [
          [1, 0, 0, 0],
          [0, 1, 0, 0],
          [0, 0, -1, 0],
          [0, 0, 0, -1],
        ],
      },
    });
    const p = await estimate({
      circuit: { format: "qasm2", source },
      observable: { format: "pauli", terms: "Z0" },
    });
    expect(m.exact.value).toBe(-1);
    expect(p.exact.value).toBe(-1);
    // the decomposition shows how the matrix was read
    expect(m.pauliDecomposition).toEqual({
      terms: [{ pauli: "ZI", label: "Z0", coefficient: 1 }],
      omitted: 0,
    });
  });

  it("eigenbasis count keys read outcome k in binary, most significant digit first", async () => {
    // diag(3, 1, 2, 0) = written order |00⟩,|01⟩,|10⟩,|11⟩; x q[0] prepares |10⟩ (qubit 0 first) → value 2,
    // the third smallest eigenvalue, outcome k = 2 → key "10"
    const r = await estimate({
      circuit: { format: "qasm2", source: qasm2(2, "x q[0];") },
      observable: {
        format: "matrix",
        real: [
          [3, 0, 0, 0],
          [0, 1, 0, 0],
          [0, 0, 2, 0],
          [0, 0, 0, 0],
        ],
      },
      shots: 20,
      seed: 3,
    });
    expect(r.exact.value).toBe(2);
    expect(r.groups[0].eigenvalues).toEqual([0, 1, 2, 3]);
    expect(r.groups[0].counts).toEqual({ "10": 20 });
  });
});

describe("matrix kron(W) and Pauli text W are the same operator (random words, random circuits)", () => {
  it(
    "same exact value (1e-12), same spectrum, same decomposition; sampled means agree within 4 combined σ",
    { timeout: 60_000 },
    async () => {
      const rand = mulberry32(909);
      for (let trial = 0; trial < 24; trial++) {
        const n = 1 + (trial % 4);
        const word = randomWord(n, rand);
        const coefficient = 0.25 + rand();
        const source = toQasm2(n, randomCircuit(n, 3 + 2 * n, rand));
        const matrix = complexToArrays(
          math.multiply(coefficient, writtenWordMatrix(word)) as math.Matrix,
        );
        const seed = 1000 + trial;
        const m = await estimate({
          circuit: { format: "qasm2", source },
          observable: { format: "matrix", ...matrix },
          shots: 4000,
          seed,
        });
        const p = await estimate({
          circuit: { format: "qasm2", source },
          observable: { format: "pauli", terms: `${coefficient} ${word}` },
          shots: 4000,
          seed,
        });
        expect(Math.abs(m.exact.value - p.exact.value)).toBeLessThan(1e-12);
        const isIdentity = /^I+$/.test(word);
        expect(m.spectrum!.min).toBeCloseTo(isIdentity ? coefficient : -coefficient, 9);
        expect(p.spectrum!.min).toBeCloseTo(m.spectrum!.min, 9);
        expect(p.spectrum!.max).toBeCloseTo(m.spectrum!.max, 9);
        expect(m.pauliDecomposition!.terms).toHaveLength(1);
        expect(m.pauliDecomposition!.terms[0].pauli).toBe(word);
        expect(m.pauliDecomposition!.terms[0].coefficient).toBeCloseTo(coefficient, 12);
        // The two forms measure in different bases (eigenbasis vs the word's own), so the draws
        // differ; both are unbiased estimates of the same value.
        const sigma = Math.hypot(m.sampled!.stdErr, p.sampled!.stdErr);
        expect(Math.abs(m.sampled!.mean - p.sampled!.mean)).toBeLessThanOrEqual(4 * sigma + 1e-12);
      }
    },
  );

  it("the same seed reproduces the matrix form's sampled figures exactly", async () => {
    const source = qasm2(3, "ry(0.7) q[0];\ncx q[0],q[2];\nrx(0.3) q[1];");
    const observable = { format: "matrix" as const, ...complexToArrays(writtenWordMatrix("ZXY")) };
    const a = await estimate({
      circuit: { format: "qasm2", source },
      observable,
      shots: 5000,
      seed: 11,
    });
    const b = await estimate({
      circuit: { format: "qasm2", source },
      observable,
      shots: 5000,
      seed: 11,
    });
    expect(a.sampled).toEqual(b.sampled);
    expect(a.groups[0].counts).toEqual(b.groups[0].counts);
  });
});

describe("an asymmetric 3-qubit matrix against mathjs in written order", () => {
  it("a random non-product Hermitian 8×8 and a product of three different factors: ⟨ψ|A|ψ⟩ to 1e-12", async () => {
    const rand = mulberry32(77);
    const gates = randomCircuit(3, 12, rand);
    const source = toQasm2(3, gates);
    const psi = writtenOrder(referenceState(3, gates), 3);
    // three different Hermitian one-qubit factors: a kron in written order
    const f = (a: number, b: number, c: number, d: number) =>
      math.matrix([
        [math.complex(a, 0), math.complex(b, -c)],
        [math.complex(b, c), math.complex(d, 0)],
      ]);
    const product = math.kron(
      math.kron(f(1, 0.3, 0.2, -0.5), f(0, 1, 0, 0.4)),
      f(2, -0.1, 0.7, 0.5),
    ) as math.Matrix;
    const random = math.matrix(
      Array.from({ length: 8 }, () => Array.from({ length: 8 }, () => math.complex(0, 0))),
    );
    for (let i = 0; i < 8; i++) {
      random.set([i, i], math.complex(rand() * 2 - 1, 0));
      for (let j = i + 1; j < 8; j++) {
        const z = math.complex(rand() - 0.5, rand() - 0.5);
        random.set([i, j], z);
        random.set([j, i], math.conj(z));
      }
    }
    for (const a of [product, random]) {
      const r = await estimate({
        circuit: { format: "qasm2", source },
        observable: { format: "matrix", ...complexToArrays(a) },
        method: "density_matrix",
      });
      const expected = expectationOf(a, psi);
      expect(Math.abs(r.exact.value - expected)).toBeLessThan(1e-12);
      // the round trip written → state order → written returns the matrix (up to the symmetrisation's rounding)
      const back = writtenMatrix(parseMatrixObservable(complexToArrays(a)));
      const orig = complexToArrays(a);
      back.real.forEach((row, i) =>
        row.forEach((v, j) =>
          expect(
            Math.abs(v - orig.real[i][j]) + Math.abs(back.imag[i][j] - orig.imag[i][j]),
          ).toBeLessThan(1e-15),
        ),
      );
    }
    // swapping the first and last factor changes the value (the matrix is not symmetric under qubit exchange)
    const swapped = math.kron(
      math.kron(f(2, -0.1, 0.7, 0.5), f(0, 1, 0, 0.4)),
      f(1, 0.3, 0.2, -0.5),
    ) as math.Matrix;
    expect(Math.abs(expectationOf(swapped, psi) - expectationOf(product, psi))).toBeGreaterThan(
      1e-3,
    );
  });
});

describe("Pauli decomposition of a matrix, c_P = Tr(P·A)/2ⁿ (Hilbert–Schmidt orthogonality of Pauli words)", () => {
  it("recovers a random 3-qubit Pauli sum built with mathjs kron in written order, largest first", () => {
    const rand = mulberry32(5);
    const terms = Array.from({ length: 6 }, () => ({
      word: randomWord(3, rand),
      coefficient: Math.round((rand() * 2 - 1) * 1000) / 1000,
    }));
    const merged = new Map<string, number>();
    for (const t of terms) merged.set(t.word, (merged.get(t.word) ?? 0) + t.coefficient);
    let a = math.zeros(8, 8) as math.Matrix;
    for (const [w, c] of merged)
      a = math.add(a, math.multiply(c, writtenWordMatrix(w))) as math.Matrix;
    const d = pauliDecomposition(parseMatrixObservable(complexToArrays(a)))!;
    const expected = [...merged]
      .filter(([, c]) => c !== 0)
      .sort((x, y) => Math.abs(y[1]) - Math.abs(x[1]));
    expect(d.terms.map((t) => t.pauli)).toEqual(expected.map(([w]) => w));
    d.terms.forEach((t, k) => expect(t.coefficient).toBeCloseTo(expected[k][1], 12));
  });

  it("is withheld above 6 qubits", () => {
    const d = 2 ** 7;
    const real = Array.from({ length: d }, (_, i) =>
      Array.from({ length: d }, (_, j) => (i === j ? 1 : 0)),
    );
    expect(pauliDecomposition(parseMatrixObservable({ real }))).toBeNull();
  });
});

/**
 * Independent dense reference for random circuits, built with mathjs only:
 * single-qubit gates from their textbook matrices (Nielsen & Chuang §4.2) or as
 * exponentials expm(−iθP/2) (rotations), U(θ,φ,λ) from the OpenQASM 2.0 paper's
 * matrix (arXiv:1707.03429 §2), and two-qubit gates as sums of Kronecker products
 * (CX = |0⟩⟨0|⊗I + |1⟩⟨1|⊗X, CZ likewise, SWAP = (II + XX + YY + ZZ)/2), so no
 * index-permutation code is shared with the engine. Qubit 0 is the least significant
 * Kronecker factor (the engine's index bit k = qubit k).
 *
 * A factor G on qubit q acts on ψ reshaped (mathjs, row-major) to [2^(n−q−1)·2, 2^q]:
 * for each high index h the 2 × 2^q block of rows (2h, 2h+1) is replaced by G · block,
 * which is (I ⊗ G ⊗ I)ψ without forming the 2^n × 2^n matrix.
 */
import * as math from "mathjs";
import { PAULI } from "../observable/dense-reference";

type M = math.Matrix;
const C = (re: number, im = 0): math.Complex => math.complex(re, im);
const mat = (rows: (number | math.Complex)[][]): M =>
  math.matrix(rows.map((r) => r.map((x) => (typeof x === "number" ? C(x) : x))));
const expi = (a: number): math.Complex => C(Math.cos(a), Math.sin(a));
const P0 = mat([
  [1, 0],
  [0, 0],
]);
const P1 = mat([
  [0, 0],
  [0, 1],
]);

function rotation(p: "X" | "Y" | "Z", theta: number): M {
  return math.expm(math.multiply(C(0, -theta / 2), PAULI[p]) as M) as M;
}

export const ONE_QUBIT: Record<string, (t: number[]) => M> = {
  h: () =>
    mat([
      [Math.SQRT1_2, Math.SQRT1_2],
      [Math.SQRT1_2, -Math.SQRT1_2],
    ]),
  x: () => PAULI.X,
  y: () => PAULI.Y,
  z: () => PAULI.Z,
  s: () =>
    mat([
      [1, 0],
      [0, C(0, 1)],
    ]),
  sdg: () =>
    mat([
      [1, 0],
      [0, C(0, -1)],
    ]),
  t: () =>
    mat([
      [1, 0],
      [0, expi(Math.PI / 4)],
    ]),
  tdg: () =>
    mat([
      [1, 0],
      [0, expi(-Math.PI / 4)],
    ]),
  rx: ([a]) => rotation("X", a),
  ry: ([a]) => rotation("Y", a),
  rz: ([a]) => rotation("Z", a),
  // U(θ,φ,λ) = [[cos θ/2, −e^{iλ} sin θ/2], [e^{iφ} sin θ/2, e^{i(φ+λ)} cos θ/2]]
  u3: ([th, ph, la]) =>
    mat([
      [Math.cos(th / 2), math.multiply(-Math.sin(th / 2), expi(la)) as math.Complex],
      [
        math.multiply(Math.sin(th / 2), expi(ph)) as math.Complex,
        math.multiply(Math.cos(th / 2), expi(ph + la)) as math.Complex,
      ],
    ]),
};

export interface RandomGate {
  name: string;
  qubits: number[];
  params: number[];
}

export function randomCircuit(n: number, length: number, rand: () => number): RandomGate[] {
  const one = Object.keys(ONE_QUBIT);
  const gates: RandomGate[] = [];
  for (let k = 0; k < length; k++) {
    if (n >= 2 && rand() < 0.35) {
      const a = Math.floor(rand() * n);
      let b = Math.floor(rand() * (n - 1));
      if (b >= a) b++;
      gates.push({
        name: ["cx", "cz", "swap"][Math.floor(rand() * 3)],
        qubits: [a, b],
        params: [],
      });
    } else {
      const name = one[Math.floor(rand() * one.length)];
      const count = name === "u3" ? 3 : name.startsWith("r") ? 1 : 0;
      gates.push({
        name,
        qubits: [Math.floor(rand() * n)],
        params: Array.from({ length: count }, () => (rand() * 2 - 1) * Math.PI),
      });
    }
  }
  return gates;
}

export function toQasm2(n: number, gates: RandomGate[]): string {
  const lines = ["OPENQASM 2.0;", 'include "qelib1.inc";', `qreg q[${n}];`];
  for (const g of gates) {
    const params = g.params.length ? `(${g.params.map((p) => p.toPrecision(17)).join(",")})` : "";
    lines.push(`${g.name}${params} ${g.qubits.map((q) => `q[${q}]`).join(",")};`);
  }
  return lines.join("\n");
}

/** Applies the product of `ops` (operator per qubit) to a column state ψ (2^n × 1). */
export function applyProduct(n: number, psi: M, ops: Record<number, M>): M {
  let v = psi;
  for (const [qs, g] of Object.entries(ops)) {
    const q = Number(qs);
    const low = 2 ** q;
    const high = 2 ** (n - q - 1);
    let t = math.reshape(v, [2 * high, low]) as M;
    for (let h = 0; h < high; h++) {
      const idx = math.index([2 * h, 2 * h + 1], math.range(0, low));
      t = math.subset(t, idx, math.multiply(g, math.subset(t, idx) as M) as M) as M;
    }
    v = math.reshape(t, [2 ** n, 1]) as M;
  }
  return v;
}

/** Final state column vector of the circuit from |0…0⟩. */
export function referenceState(n: number, gates: RandomGate[]): M {
  let psi: M = math.matrix(Array.from({ length: 2 ** n }, (_, i) => [C(i === 0 ? 1 : 0)]));
  for (const g of gates) {
    const [a, b] = g.qubits;
    if (g.name === "swap") {
      const parts = ["I", "X", "Y", "Z"].map((p) =>
        applyProduct(n, psi, { [a]: PAULI[p], [b]: PAULI[p] }),
      );
      psi = math.multiply(
        0.5,
        math.add(math.add(parts[0], parts[1]), math.add(parts[2], parts[3])),
      ) as M;
    } else if (g.name === "cx" || g.name === "cz") {
      psi = math.add(
        applyProduct(n, psi, { [a]: P0 }),
        applyProduct(n, psi, { [a]: P1, [b]: g.name === "cx" ? PAULI.X : PAULI.Z }),
      ) as M;
    } else {
      psi = applyProduct(n, psi, { [a]: ONE_QUBIT[g.name](g.params) });
    }
  }
  return psi;
}

/** ⟨ψ|P|ψ⟩ of a dense Pauli word (qubit 0 first) through applyProduct. */
export function pauliExpectationOf(word: string, n: number, psi: M): number {
  const ops: Record<number, M> = {};
  for (let q = 0; q < word.length; q++) if (word[q] !== "I") ops[q] = PAULI[word[q]];
  return expectationOf(null, psi, applyProduct(n, psi, ops));
}

/** ⟨ψ|A|ψ⟩ for a dense A, or ⟨ψ|φ⟩ when φ = Aψ is given. */
export function expectationOf(a: M | null, psi: M, applied?: M): number {
  const z = (
    math.multiply(math.ctranspose(psi), applied ?? (math.multiply(a!, psi) as M)) as M
  ).get([0, 0]) as math.Complex | number;
  return typeof z === "number" ? z : z.re;
}

/**
 * ψ with its amplitudes in the order users write matrices in (kron(A0, A1, …), qubit 0
 * the most significant digit): index digits reversed as a binary string.
 */
export function writtenOrder(psi: M, n: number): M {
  const amps = (psi.toArray() as unknown as (math.Complex | number)[][]).map((row) => row[0]);
  const out = new Array<math.Complex | number>(amps.length);
  amps.forEach((a, i) => {
    out[parseInt(i.toString(2).padStart(n, "0").split("").reverse().join(""), 2)] = a;
  });
  return math.matrix(out.map((a) => [typeof a === "number" ? C(a) : a]));
}

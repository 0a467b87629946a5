/**
 * Exact gradients (`gradient: true`) against two independent references, for random
 * circuits whose inputs appear in several gates and inside affine and non-linear angle
 * expressions:
 * - central differences of the engine's own exact value (4-point, O(h⁴); common practice);
 * - central differences of a dense mathjs reference built from textbook matrices (see
 *   ../estimate/circuit-reference.ts; controlled rotations as |0⟩⟨0|⊗I + |1⟩⟨1|⊗R).
 * Agreement to 1e-7. Adjoint method: Jones & Gacon 2020 (arXiv:2009.02823).
 */
import * as math from "mathjs";
import { describe, expect, it } from "vitest";
import { estimate } from "@/lib/quantum";
import { ONE_QUBIT, applyProduct, pauliExpectationOf } from "../estimate/circuit-reference";
import { PAULI } from "../observable/dense-reference";

type M = math.Matrix;
const P0 = math.matrix([
  [math.complex(1, 0), math.complex(0, 0)],
  [math.complex(0, 0), math.complex(0, 0)],
]);
const P1 = math.matrix([
  [math.complex(0, 0), math.complex(0, 0)],
  [math.complex(0, 0), math.complex(1, 0)],
]);

function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** An angle as OpenQASM text and as a function of the inputs. */
interface Angle {
  text: string;
  value: (x: number[]) => number;
}

function randomAngle(rand: () => number, inputs: number): Angle {
  const i = Math.floor(rand() * inputs);
  const j = Math.floor(rand() * inputs);
  const a = Number((rand() * 2 - 1).toFixed(3));
  const b = Number((rand() * 2 - 1).toFixed(3));
  const kinds: Angle[] = [
    { text: `t${i}`, value: (x) => x[i] },
    { text: `${a}*t${i}+${b}`, value: (x) => a * x[i] + b },
    { text: `sin(t${i})`, value: (x) => Math.sin(x[i]) },
    { text: `t${i}*t${j}`, value: (x) => x[i] * x[j] },
    { text: `cos(t${i}-t${j})/2`, value: (x) => Math.cos(x[i] - x[j]) / 2 },
    { text: `exp(${a}*t${i})`, value: (x) => Math.exp(a * x[i]) },
    { text: `t${i}**2`, value: (x) => x[i] ** 2 },
    { text: `${b}`, value: () => b },
  ];
  return kinds[Math.floor(rand() * kinds.length)];
}

interface Gate {
  name: string;
  qubits: number[];
  angles: Angle[];
}

const ROT = ["rx", "ry", "rz"] as const;

function randomGates(n: number, length: number, inputs: number, rand: () => number): Gate[] {
  const gates: Gate[] = [];
  for (let k = 0; k < length; k++) {
    const r = rand();
    const a = Math.floor(rand() * n);
    let b = Math.floor(rand() * (n - 1));
    if (b >= a) b++;
    if (r < 0.2) gates.push({ name: rand() < 0.5 ? "cx" : "cz", qubits: [a, b], angles: [] });
    else if (r < 0.4)
      gates.push({
        name: ["crx", "cry", "crz"][Math.floor(rand() * 3)],
        qubits: [a, b],
        angles: [randomAngle(rand, inputs)],
      });
    else if (r < 0.5)
      gates.push({
        name: "u3",
        qubits: [a],
        angles: [0, 1, 2].map(() => randomAngle(rand, inputs)),
      });
    else if (r < 0.6) gates.push({ name: "h", qubits: [a], angles: [] });
    else
      gates.push({
        name: ROT[Math.floor(rand() * 3)],
        qubits: [a],
        angles: [randomAngle(rand, inputs)],
      });
  }
  return gates;
}

function qasm3(n: number, inputs: number, gates: Gate[]): string {
  const lines = ["OPENQASM 3.0;", 'include "stdgates.inc";', `qubit[${n}] q;`];
  for (let i = 0; i < inputs; i++) lines.push(`input float t${i};`);
  for (const g of gates) {
    const params = g.angles.length ? `(${g.angles.map((a) => a.text).join(", ")})` : "";
    lines.push(`${g.name}${params} ${g.qubits.map((q) => `q[${q}]`).join(", ")};`);
  }
  return lines.join("\n");
}

/** The mathjs reference value ⟨ψ(x)|A|ψ(x)⟩. */
function referenceValue(
  n: number,
  gates: Gate[],
  terms: { c: number; word: string }[],
  x: number[],
): number {
  let psi: M = math.matrix(
    Array.from({ length: 2 ** n }, (_, i) => [math.complex(i === 0 ? 1 : 0, 0)]),
  );
  for (const g of gates) {
    const [a, b] = g.qubits;
    const p = g.angles.map((t) => t.value(x));
    if (g.name === "cx" || g.name === "cz") {
      psi = math.add(
        applyProduct(n, psi, { [a]: P0 }),
        applyProduct(n, psi, { [a]: P1, [b]: g.name === "cx" ? PAULI.X : PAULI.Z }),
      ) as M;
    } else if (g.name.startsWith("cr")) {
      psi = math.add(
        applyProduct(n, psi, { [a]: P0 }),
        applyProduct(n, psi, { [a]: P1, [b]: ONE_QUBIT[g.name.slice(1)](p) }),
      ) as M;
    } else {
      psi = applyProduct(n, psi, { [a]: ONE_QUBIT[g.name](p) });
    }
  }
  return terms.reduce((s, t) => s + t.c * pauliExpectationOf(t.word, n, psi), 0);
}

/** 4-point central difference, error O(h⁴) (common practice). */
function centralDifference(f: (x: number[]) => number, x: number[], i: number, h = 1e-3): number {
  const at = (d: number) => f(x.map((v, k) => (k === i ? v + d : v)));
  return (8 * (at(h) - at(-h)) - (at(2 * h) - at(-2 * h))) / (12 * h);
}

describe("exact gradient against central differences of the engine and of a mathjs reference", () => {
  for (const seed of [1, 2, 3, 4]) {
    it(
      `random 3-qubit circuit #${seed}: inputs in several gates and in affine and non-linear expressions agree to 1e-7`,
      { timeout: 60_000 },
      async () => {
        const rand = mulberry32(seed);
        const n = 3;
        const inputs = 3;
        const gates = randomGates(n, 14, inputs, rand);
        const terms = [
          { c: 0.7, word: "ZZI" },
          { c: -0.4, word: "XIY" },
          { c: 0.25, word: "IYX" },
        ];
        const source = qasm3(n, inputs, gates);
        const x = Array.from({ length: inputs }, () => rand() * 2 - 1);
        const parameters = Object.fromEntries(x.map((v, i) => [`t${i}`, v]));
        const observable = {
          format: "pauli" as const,
          terms: terms.map((t) => `${t.c} ${t.word}`).join(" + "),
        };
        const r = await estimate({
          circuit: { format: "qasm3", source },
          observable,
          parameters,
          gradient: true,
        });
        const engineValue = async (y: number[]) =>
          (
            await estimate({
              circuit: { format: "qasm3", source },
              observable,
              parameters: Object.fromEntries(y.map((v, i) => [`t${i}`, v])),
            })
          ).exact.value;
        for (let i = 0; i < inputs; i++) {
          const exact = r.gradient![`t${i}`].exact;
          const ref = centralDifference((y) => referenceValue(n, gates, terms, y), x, i);
          expect(Math.abs(exact - ref)).toBeLessThan(1e-7);
          const h = 1e-3;
          const at = async (d: number) => engineValue(x.map((v, k) => (k === i ? v + d : v)));
          const engineFd =
            (8 * ((await at(h)) - (await at(-h))) - ((await at(2 * h)) - (await at(-2 * h)))) /
            (12 * h);
          expect(Math.abs(exact - engineFd)).toBeLessThan(1e-7);
        }
      },
    );
  }
});

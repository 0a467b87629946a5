/**
 * The adjoint gradient sweeps fused blocks (one cross matrix per block, derivative
 * matrices S·∂G·P per member). Checked against the textbook per-gate sweep written out
 * here (Jones & Gacon 2020, arXiv:2009.02823, Algorithm 1: φ ← U†φ, ∂θ = 2·Re⟨λ|∂U|φ⟩,
 * λ ← U†λ, gate by gate with the dense reference kernel and a plain inner product), on
 * random circuits that mix rotations, controlled rotations, phases, swaps, 3-qubit gates
 * and constant gates, to 1e-10. λ = A·ψ (apply-observable.ts, split term tables) against
 * the dense mathjs matrix of the Pauli sum (../observable/dense-reference.ts) to 1e-12.
 */
import * as math from "mathjs";
import { afterAll, describe, expect, it } from "vitest";
import { parseProgram } from "@/lib/quantum/circuit";
import { closeKernelPool, kernelPoolStatus } from "@/lib/quantum/parallel";
import { prepareObservable } from "@/lib/quantum/estimate/prepare-observable";
import { adjointGradient, GRADIENT_MIN_PARALLEL_QUBITS } from "@/lib/quantum/gradient/adjoint";
import { applyObservable } from "@/lib/quantum/gradient/apply-observable";
import { matrixDerivative } from "@/lib/quantum/gradient/shift-rules";
import { buildTape, dagger, type Tape } from "@/lib/quantum/gradient/tape";
import { applyDense } from "@/lib/quantum/statevector/dispatch";
import { companionOf } from "@/lib/quantum/wasm/runtime";
import { engineWasm } from "@/lib/quantum/parallel/config";
import { simulateStatevector } from "@/lib/quantum/statevector/simulate";
import type { PreparedObservable } from "@/lib/quantum/sampling/sample-observable";
import type { StateVector } from "@/lib/quantum/types";
import { stateColumn, sumMatrix } from "../observable/dense-reference";
import { mulberry32, randomState } from "../observable/random-states";

/** Re⟨λ|(D on bits)|φ⟩ by building D·φ on a copy (no shortcuts). */
function realInner(l: StateVector, phi: StateVector, bits: number[], d: Float64Array): number {
  const re = phi.re.slice();
  const im = phi.im.slice();
  applyDense(re, im, bits, d);
  let acc = 0;
  for (let i = 0; i < re.length; i++) acc += l.re[i] * re[i] + l.im[i] * im[i];
  return acc;
}

function perGateGradient(tape: Tape, psi: StateVector, obs: PreparedObservable): Float64Array {
  const grad = new Float64Array(tape.numInputs);
  const lambda = applyObservable(obs, psi);
  const phi = { n: psi.n, re: psi.re.slice(), im: psi.im.slice() };
  const parts = tape.ops.flatMap((op) => (op.kind === "gate" ? op.parts : []));
  for (let i = parts.length - 1; i >= 0; i--) {
    const part = parts[i];
    const udag = dagger(part.matrix);
    applyDense(phi.re, phi.im, part.qubits, udag);
    for (const angle of part.angles) {
      const du = matrixDerivative((p) => part.gate.matrix(p), part.values, angle.k);
      angle.expr.grad(tape.x, grad, 2 * realInner(lambda, phi, part.qubits, du));
    }
    applyDense(lambda.re, lambda.im, part.qubits, udag);
  }
  return grad;
}

function randomSource(n: number, length: number, inputs: number, rand: () => number): string {
  const lines = ["OPENQASM 3.0;", 'include "stdgates.inc";', `qubit[${n}] q;`];
  for (let i = 0; i < inputs; i++) lines.push(`input float t${i};`);
  const angle = () => {
    const i = Math.floor(rand() * inputs);
    const forms = [`t${i}`, `0.7*t${i}-0.2`, `sin(t${i})`, `t${i}*t${(i + 1) % inputs}`, "0.4"];
    return forms[Math.floor(rand() * forms.length)];
  };
  const pick = () => Math.floor(rand() * n);
  for (let g = 0; g < length; g++) {
    const a = pick();
    let b = pick();
    while (b === a) b = pick();
    let c = pick();
    while (c === a || c === b) c = pick();
    const r = rand();
    if (r < 0.3)
      lines.push(`${["rx", "ry", "rz", "p"][Math.floor(rand() * 4)]}(${angle()}) q[${a}];`);
    else if (r < 0.4) lines.push(`u3(${angle()}, ${angle()}, ${angle()}) q[${a}];`);
    else if (r < 0.5) lines.push(`${["h", "s", "t", "x"][Math.floor(rand() * 4)]} q[${a}];`);
    else if (r < 0.7)
      lines.push(`${["cx", "cz", "swap"][Math.floor(rand() * 3)]} q[${a}], q[${b}];`);
    else if (r < 0.9)
      lines.push(
        `${["crx", "cry", "crz", "cp"][Math.floor(rand() * 4)]}(${angle()}) q[${a}], q[${b}];`,
      );
    else lines.push(`${rand() < 0.5 ? "ccx" : "cswap"} q[${a}], q[${b}], q[${c}];`);
  }
  return lines.join("\n");
}

describe("fused adjoint gradient", () => {
  // n = 11: states in a WebAssembly kernel memory when the engine uses them (other sweep path)
  // companion: λ in the state's own kernel memory (the SIMD cross-matrix pass)
  it.each([
    [5, 30, false],
    [11, 4, false],
    [11, 4, true],
  ])(
    "equals the per-gate sweep on random %i-qubit circuits (%i, λ as companion: %s) to 1e-10 (seed 1207)",
    (n, circuits, companion) => {
      const rand = mulberry32(1207);
      const obs = prepareObservable(
        { format: "pauli", terms: "0.8 Z0 Z1 + 0.5 X2 - 0.3 Y3 Y4 + 0.2 X0 Y1 Z4" },
        n,
      );
      for (let k = 0; k < circuits; k++) {
        const inputs = 1 + Math.floor(rand() * 4);
        const program = parseProgram("qasm3", randomSource(n, 40, inputs, rand));
        const params = Object.fromEntries(
          Array.from({ length: inputs }, (_, i) => [`t${i}`, rand() * 4 - 2]),
        );
        const tape = buildTape(program, params);
        const want = perGateGradient(tape, simulateStatevector(program.bind(params)), obs);
        const psi = simulateStatevector(program.bind(params), { companion });
        expect(companionOf(psi.re) !== undefined).toBe(companion && engineWasm()); // none on plain arrays
        const got = adjointGradient(tape, psi, obs);
        expect(got.length).toBe(inputs);
        for (let i = 0; i < inputs; i++) expect(Math.abs(got[i] - want[i])).toBeLessThan(1e-10);
      }
    },
  );
});

describe("adjoint gradient on engine threads", () => {
  afterAll(() => closeKernelPool());

  it(
    "2 and 4 threads agree with 1 thread to 1e-12 (slices of λ and φ, partial cross matrices summed)",
    { timeout: 120_000 },
    () => {
      const n = GRADIENT_MIN_PARALLEL_QUBITS;
      const rand = mulberry32(4711);
      const obs = prepareObservable(
        { format: "pauli", terms: "0.8 Z0 Z17 + 0.5 X2 X14 - 0.3 Y3 Y9 + 0.2 X0 Y1 Z17 + 0.1 Z7" },
        n,
      );
      const inputs = 3;
      const program = parseProgram("qasm3", randomSource(n, 60, inputs, rand));
      const params = { t0: 0.3, t1: -1.1, t2: 0.7 };
      const tape = buildTape(program, params);
      // the state as a threaded run has it (bit-identical for any thread count; shared memory)
      const state = (threads: number) =>
        simulateStatevector(program.bind(params), { threads, companion: true });
      const one = adjointGradient(tape, state(1), obs, { threads: 1 });
      const scale = Math.max(...Array.from(one, Math.abs));
      expect(scale).toBeGreaterThan(1e-3); // a gradient that is not trivially zero
      for (const threads of [2, 4]) {
        const many = adjointGradient(tape, state(threads), obs, { threads });
        for (let i = 0; i < inputs; i++) expect(Math.abs(many[i] - one[i])).toBeLessThan(1e-12);
      }
      expect(kernelPoolStatus()).toMatchObject({ broken: false });
      expect(kernelPoolStatus().helpers).toBeGreaterThanOrEqual(3);
    },
  );
});

describe("λ = A·ψ", () => {
  it("equals the dense mathjs product for random Pauli sums on 1–7 qubits (seed 77)", () => {
    const rand = mulberry32(77);
    for (let n = 1; n <= 7; n++) {
      const terms: { coefficient: number; word: string }[] = [];
      for (let t = 0; t < 12; t++) {
        // half the words diagonal (one shared flip mask), the rest random
        const letters = t % 2 === 0 ? "IZ" : "IXYZ";
        let word = "";
        for (let q = 0; q < n; q++) word += letters[Math.floor(rand() * letters.length)];
        terms.push({ coefficient: Number((rand() * 2 - 1).toFixed(6)), word });
      }
      const text = terms
        .map((t) => `${t.coefficient} ${t.word}`)
        .join(" + ")
        .replace(/\+ -/g, "- ");
      const obs = prepareObservable({ format: "pauli", terms: text }, n);
      const psi = randomState(n, rand);
      const got = applyObservable(obs, psi);
      const want = math.multiply(sumMatrix(terms, n), stateColumn(psi)) as math.Matrix;
      for (let i = 0; i < 2 ** n; i++) {
        const z = want.get([i, 0]) as math.Complex;
        expect(Math.abs(got.re[i] - z.re)).toBeLessThan(1e-12);
        expect(Math.abs(got.im[i] - z.im)).toBeLessThan(1e-12);
      }
    }
  });
});

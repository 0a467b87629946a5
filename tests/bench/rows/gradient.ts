/**
 * Gradient rows: the full exact gradient (forward simulation + adjoint backward sweep,
 * lib/quantum/gradient/adjoint.ts) against ONE forward evaluation (bind + simulate +
 * exact ⟨A⟩), for P = 2…40 inputs on the same 16-qubit, 10-layer ry/rz + cx-ladder
 * ansatz (320 input-dependent angles, inputs assigned round-robin, half of them inside
 * affine and half inside sin(·) expressions). Observable: Σ Z_i Z_{i+1} + 0.5 Σ X_i.
 * Target (adjoint differentiation, Jones & Gacon 2020): ≤ 4 forward evaluations whatever
 * P is; central differences would cost 2P.
 */
import { parseProgram } from "@/lib/quantum/circuit";
import { prepareObservable } from "@/lib/quantum/estimate/prepare-observable";
import { adjointGradient } from "@/lib/quantum/gradient/adjoint";
import { buildTape } from "@/lib/quantum/gradient/tape";
import {
  pauliExpectationsOnState,
  weightedTotal,
} from "@/lib/quantum/observable/pauli-expectation";
import type { PreparedObservable } from "@/lib/quantum/sampling/sample-observable";
import { simulateStatevector } from "@/lib/quantum/statevector/simulate";
import { type BenchRow, fmtClocks, paired, ratioResult } from "../bench-kit";

const N = 16;
const LAYERS = 10;
const PS = [2, 5, 10, 20, 40];
/** The cost ratio is a single-thread figure (the threads rows time the gradient on several). */
const ONE = { threads: 1 };
/** As a run with a gradient simulates: λ reserved as the state's companion (one SIMD cross pass). */
const ONE_WITH_LAMBDA = { threads: 1, companion: true };

export function source(p: number, n = N): string {
  const lines = ["OPENQASM 3.0;", 'include "stdgates.inc";', `qubit[${n}] q;`];
  for (let k = 0; k < p; k++) lines.push(`input float t${k};`);
  let g = 0;
  for (let l = 0; l < LAYERS; l++) {
    for (const gate of ["ry", "rz"]) {
      for (let q = 0; q < n; q++, g++) {
        const t = `t${g % p}`;
        lines.push(`${gate}(${g % 2 === 0 ? `0.5*${t}+0.1` : `sin(${t})`}) q[${q}];`);
      }
    }
    for (let q = 0; q + 1 < n; q++) lines.push(`cx q[${q}], q[${q + 1}];`);
  }
  return lines.join("\n");
}

/** Σ Z_i Z_{i+1} + 0.5 Σ X_i on n qubits. */
export function benchObservable(n = N): PreparedObservable {
  const terms = [
    ...Array.from({ length: n - 1 }, (_, i) => `Z${i} Z${i + 1}`),
    ...Array.from({ length: n }, (_, i) => `0.5 X${i}`),
  ].join(" + ");
  return prepareObservable({ format: "pauli", terms }, n);
}

export const gradientRows: BenchRow = () => {
  const obs = benchObservable();
  if (obs.kind !== "pauli") throw new Error("expected a Pauli sum");
  return PS.map((p) => {
    const program = parseProgram("qasm3", source(p));
    const params = Object.fromEntries(
      Array.from({ length: p }, (_, k) => [`t${k}`, 0.1 + 0.03 * k]),
    );
    const forward = () => {
      const psi = simulateStatevector(program.bind(params), ONE);
      return weightedTotal(obs.sum, pauliExpectationsOnState(psi, obs.sum, undefined, 1));
    };
    const gradient = () => {
      const psi = simulateStatevector(program.bind(params), ONE_WITH_LAMBDA);
      return adjointGradient(buildTape(program, params), psi, obs, ONE);
    };
    // Paired repetitions: gradient ÷ forward per repetition, median and range (bench-kit.ts).
    const pr = paired(
      () => void gradient(),
      () => void forward(),
    );
    return ratioResult(
      pr,
      `gradient P=${p} (n=${N}, ${LAYERS * 2 * N} angles): forward + adjoint ÷ one forward evaluation`,
      `${fmtClocks(pr.row)} vs ${fmtClocks(pr.base)}`,
      "≤ 4",
      (r) => r <= 4,
    );
  });
};

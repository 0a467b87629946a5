/**
 * Engine-thread rows: the 22-qubit ansatz (6 layers) on 1, 2 and all engine threads, wall
 * time (CPU time adds the threads up), as one thread ÷ T threads — the speed-up. On a
 * machine shared with other jobs the figure is capped by the cores actually free, so the
 * load average printed with the table matters here more than anywhere.
 */
import { availableParallelism } from "node:os";
import { closeKernelPool } from "@/lib/quantum/parallel";
import { simulateStatevector } from "@/lib/quantum/statevector/simulate";
import {
  pauliExpectationsOnState,
  weightedTotal,
} from "@/lib/quantum/observable/pauli-expectation";
import { parsePauliSum } from "@/lib/quantum/observable/pauli-parse";
import { padPauliSum } from "@/lib/quantum/observable/pauli-word";
import { parseProgram } from "@/lib/quantum/circuit";
import { simulateDensityMatrix } from "@/lib/quantum/density-matrix/simulate";
import { adjointGradient } from "@/lib/quantum/gradient/adjoint";
import { buildTape } from "@/lib/quantum/gradient/tape";
import { layeredAnsatz } from "../ansatz";
import { BENCH_NOISE, noisyCircuit } from "./density";
import { benchObservable, source } from "./gradient";
import { randomPauliText, randomState } from "./observables";
import { type BenchRow, type RowResult, fmtClocks, paired, ratioResult } from "../bench-kit";

const N = 22;
const PAULI_N = 20;
const PAULI_TERMS = 1000;

/** The gradient rows' ansatz at 20 qubits, P = 10: forward + adjoint, one thread ÷ all, wall time. */
function gradientThreadsRow(all: number): RowResult {
  const n = 20;
  const program = parseProgram("qasm3", source(10, n));
  const params = Object.fromEntries(
    Array.from({ length: 10 }, (_, k) => [`t${k}`, 0.1 + 0.03 * k]),
  );
  const obs = benchObservable(n);
  const tape = buildTape(program, params);
  const run = (threads: number) => (): void =>
    void adjointGradient(
      tape,
      simulateStatevector(program.bind(params), { threads, companion: true }),
      obs,
      { threads },
    );
  const p = paired(run(all), run(1), { clock: "wall" });
  return ratioResult(
    p,
    `one engine thread ÷ all = ${all} threads, gradient n=${n} P=10 (forward + adjoint), wall time`,
    `${all} threads ${fmtClocks(p.row)}; 1 thread ${fmtClocks(p.base)}`,
    "",
    undefined,
    true,
  );
}

/** The density-matrix row's circuit (10 qubits, 100 noisy gates): one thread ÷ all, wall time. */
function densityThreadsRow(all: number): RowResult {
  const circuit = noisyCircuit();
  const run = (threads: number) => (): void =>
    void simulateDensityMatrix(circuit, BENCH_NOISE, { threads });
  const p = paired(run(all), run(1), { clock: "wall" });
  return ratioResult(
    p,
    `one engine thread ÷ all = ${all} threads, density matrix n=10, 100 noisy gates, wall time`,
    `${all} threads ${fmtClocks(p.row)}; 1 thread ${fmtClocks(p.base)}`,
    "",
    undefined,
    true,
  );
}

/** Exact ⟨A⟩ of a random 1,000-term Pauli sum on a 20-qubit state: one thread ÷ all, wall time. */
function pauliThreadsRow(all: number): RowResult {
  const state = randomState(PAULI_N, 1);
  const sum = padPauliSum(parsePauliSum(randomPauliText(PAULI_N, PAULI_TERMS, 2)), PAULI_N);
  const run = (threads: number) => (): void =>
    void weightedTotal(sum, pauliExpectationsOnState(state, sum, undefined, threads));
  const p = paired(run(all), run(1), { clock: "wall" });
  return ratioResult(
    p,
    `one engine thread ÷ all = ${all} threads, exact ⟨A⟩ of ${PAULI_TERMS} Pauli terms, n=${PAULI_N}, wall time`,
    `${all} threads ${fmtClocks(p.row)}; 1 thread ${fmtClocks(p.base)}`,
    "",
    undefined,
    true,
  );
}
const LAYERS = 6;

export const threadRows: BenchRow = async () => {
  const circuit = layeredAnsatz(N, LAYERS);
  const one = (): void => void simulateStatevector(circuit, { threads: 1 });
  const all = 2 ** Math.floor(Math.log2(availableParallelism()));
  const out: RowResult[] = [];
  for (const threads of [...new Set([2, all])]) {
    const many = (): void => void simulateStatevector(circuit, { threads });
    const p = paired(many, one, { clock: "wall" });
    const label = threads === all ? `all = ${threads}` : `${threads}`;
    const target = threads === 2 ? "≥ 1.7" : "";
    out.push(
      ratioResult(
        p,
        `one engine thread ÷ ${label} threads, n=${N} ansatz (${LAYERS} layers), wall time`,
        `${threads} threads ${fmtClocks(p.row)}; 1 thread ${fmtClocks(p.base)}`,
        target,
        threads === 2 ? (r) => r >= 1.7 : undefined,
        true,
      ),
    );
  }
  out.push(pauliThreadsRow(all), densityThreadsRow(all), gradientThreadsRow(all));
  await closeKernelPool();
  return out;
};

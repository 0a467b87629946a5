/**
 * Rotation into a measurement setting: each measured qubit is turned
 * so that its Pauli becomes Z — X: H; Y: S† then H (U = H·S†, U Y U† = Z); Z and I:
 * nothing. Works on a COPY of the state (statevector: the simulation's gate loop; density
 * matrix: `applyUnitaryDM`); the result's Born probabilities are the setting's outcome law.
 * (Sampling from a density matrix uses the cheaper density-diagonal.ts, checked against
 * `rotateDensityCopy` in the tests.)
 */
import { applyUnitaryDM } from "../density-matrix/kernels";
import { runGates } from "../statevector/run-gates";
import { allocateAmplitudes } from "../statevector/state";
import type { DensityMatrix, GateApplication, StateVector } from "../types";

const S = Math.SQRT1_2;
/** H, interleaved re/im, row-major. */
export const HADAMARD = new Float64Array([S, 0, S, 0, S, 0, -S, 0]);
/** H·S† = (1/√2)[[1, −i], [1, i]]. */
export const H_SDG = new Float64Array([S, 0, 0, -S, S, 0, 0, S]);

function rotationFor(letter: string): Float64Array | null {
  if (letter === "X") return HADAMARD;
  if (letter === "Y") return H_SDG;
  return null;
}

/**
 * A copy of ψ rotated so that measuring Z on every qubit measures `bases` (qubit 0 first).
 * The copy is allocated like a state (a kernel memory: SIMD kernels) and the rotation layer
 * goes through the simulation's loop (run-gates.ts: tiled from 22 qubits, not fused);
 * bit-identical to rotating qubit by qubit with the JavaScript kernels. One thread: with
 * engine threads the copy and the fresh pages dominate (22 qubits: 99 ms on one thread,
 * 93 ms on two; the JavaScript qubit-by-qubit rotation took 174 ms).
 */
export function rotateStateCopy(state: StateVector, bases: string): StateVector {
  const n = state.n;
  const copy: StateVector = { n, ...allocateAmplitudes(n, false, 1, false) };
  copy.re.set(state.re);
  copy.im.set(state.im);
  const gates: GateApplication[] = [];
  for (let q = 0; q < bases.length; q++) {
    const matrix = rotationFor(bases[q]);
    if (matrix) gates.push({ name: bases[q] === "X" ? "h" : "h·sdg", qubits: [q], matrix });
  }
  runGates(copy, gates, null);
  return copy;
}

/** The same for a density matrix: ρ → U ρ U†. */
export function rotateDensityCopy(rho: DensityMatrix, bases: string): DensityMatrix {
  const copy: DensityMatrix = { n: rho.n, re: rho.re.slice(), im: rho.im.slice() };
  for (let q = 0; q < bases.length; q++) {
    const m = rotationFor(bases[q]);
    if (m) applyUnitaryDM(copy, [q], m);
  }
  return copy;
}

/** Born probabilities of a statevector: |ψ_b|². */
export function stateProbabilities(state: StateVector): Float64Array {
  const p = new Float64Array(state.re.length);
  for (let b = 0; b < p.length; b++) p[b] = state.re[b] * state.re[b] + state.im[b] * state.im[b];
  return p;
}

/** Diagonal of ρ (clamped at 0 against round-off). */
export function densityProbabilities(rho: DensityMatrix): Float64Array {
  const d = 2 ** rho.n;
  const p = new Float64Array(d);
  for (let b = 0; b < d; b++) p[b] = Math.max(0, rho.re[b * d + b]);
  return p;
}

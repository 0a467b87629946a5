/**
 * Shared data shapes of the Ketwise engine (`lib/quantum`). Pure data, no I/O.
 *
 * Conventions (fixed; also in DEVELOPERS.md):
 * - Qubit 0 is written first in bitstrings and dense Pauli words (textbook tensor
 *   order P0 ⊗ P1 ⊗ …).
 * - Internally, amplitude index bit k is qubit k (little-endian in the index). This
 *   is hidden from users: conversion to bitstrings happens at the edges.
 * - A gate's local matrix on operands (q_0, …, q_{k−1}) uses the textbook order:
 *   local basis index i = Σ_j b_j · 2^(k−1−j), i.e. the FIRST operand is the most
 *   significant bit. So `cx c,t` is [[1,0,0,0],[0,1,0,0],[0,0,0,1],[0,0,1,0]].
 * - Complex matrices are row-major, interleaved (re, im) in one Float64Array of
 *   length 2·d², d = 2^k.
 */

/** A unitary acting on `qubits` (k = qubits.length, k ≥ 1). */
export interface GateApplication {
  /** Lower-case gate name as the primitive is known (e.g. "u", "cx", "rz", "fused"). */
  name: string;
  /** Circuit qubit indices (0-based, all distinct). */
  qubits: number[];
  /** 2^k × 2^k unitary, row-major, interleaved re/im (length 2·4^k). */
  matrix: Float64Array;
}

/**
 * One operation as written at the top level of the circuit. A call of `ccx` or of a
 * user `gate` is ONE op (noise is applied once after it, on all its qubits), whose
 * `parts` are the primitive applications that realise it, in order.
 */
export type CircuitOp =
  | {
      kind: "gate";
      name: string;
      qubits: number[];
      params: number[];
      parts: GateApplication[];
      line: number;
    }
  | { kind: "measure"; qubit: number; clbit: number; line: number }
  | { kind: "reset"; qubit: number; line: number }
  | { kind: "barrier"; qubits: number[]; line: number };

/** A circuit with every parameter bound to a number. */
export interface Circuit {
  numQubits: number;
  numClbits: number;
  ops: CircuitOp[];
  /** Display labels of the flattened qubits, e.g. ["q[0]", "q[1]", "anc[0]"]. */
  qubitLabels: string[];
  /**
   * True when a `measure` or `reset` is followed (on any path) by a gate, reset or
   * measure acting on the same qubit — only the density-matrix method accepts that.
   */
  hasMidCircuitMeasurement: boolean;
  hasReset: boolean;
}

/** Statevector: split real/imaginary parts, length 2^n, index bit k = qubit k. */
export interface StateVector {
  n: number;
  re: Float64Array;
  im: Float64Array;
}

/** Density matrix: row-major d×d (d = 2^n), split re/im, index bit k = qubit k. */
export interface DensityMatrix {
  n: number;
  re: Float64Array;
  im: Float64Array;
}

/**
 * One Pauli term c·P. `xMask`/`zMask` bit k refers to qubit k (X: x=1,z=0; Y: x=1,z=1;
 * Z: x=0,z=1). `word` is the dense word, qubit 0 first, length = the sum's numQubits.
 */
export interface PauliTerm {
  coefficient: number;
  xMask: number;
  zMask: number;
  word: string;
}

export interface PauliSum {
  /** Highest qubit index used + 1 (or the dense word length); may be padded to the circuit. */
  numQubits: number;
  /** Distinct words (duplicates summed), identity included as an all-"I" word. */
  terms: PauliTerm[];
}

/** Noise model (probabilities in [0, 1]); semantics in DEVELOPERS.md, "Noise model". */
export interface NoiseModel {
  depolarizing1q?: number;
  depolarizing2q?: number;
  amplitudeDamping?: number;
  phaseDamping?: number;
  /** Readout error; `qubits["3"]` overrides the two rates for qubit 3. */
  readout?: {
    p1Given0?: number;
    p0Given1?: number;
    qubits?: Record<string, { p1Given0?: number; p0Given1?: number }>;
  };
  /** Overrides by gate name as written ("cx", "mygate", "ctrl @ x"); unset fields keep the defaults. */
  gates?: Record<
    string,
    { depolarizing?: number; amplitudeDamping?: number; phaseDamping?: number }
  >;
  /** Noise on every qubit a gate does NOT touch, after that gate (off unless given). */
  idle?: { depolarizing?: number; amplitudeDamping?: number; phaseDamping?: number };
}

/** Progress report: fraction in [0, 1] and a short phase label. */
export type ProgressFn = (fraction: number, phase: string) => void;

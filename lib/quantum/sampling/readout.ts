/**
 * Readout (assignment) error, acting on sampled outcomes only: e0 = p(read 1 | 0) =
 * `p1Given0`, e1 = p(read 0 | 1) = `p0Given1`, the same for every qubit unless a qubit has
 * its own rates (`noise.readout.qubits`; then A^{⊗n} below is A_0 ⊗ A_1 ⊗ … and every
 * factor f, A^{-1} is that of the qubit concerned). The assignment
 * matrix A = [[1−e0, e1], [e0, 1−e1]] maps true to read probabilities (columns: true
 * 0, 1). Independent per-qubit flips act on a distribution as A^{⊗n}, so drawing
 * from A^{⊗n}p is the same law as drawing from p and flipping each sampled bit.
 *
 * Mitigation (tensored inverse, common practice): the unbiased per-shot estimate of a
 * Z parity over qubit set S is Π_{q∈S} f(b_q) with (f(0), f(1)) = (1, −1)·A^{-1} =
 * ((1 + e0 − e1), −(1 − e0 + e1)) / (1 − e0 − e1); then
 * E[f] = (⟨Z⟩_read − (e1 − e0)) / (1 − e0 − e1) = ⟨Z⟩, inverting
 * ⟨Z⟩_read = (e1 − e0) + (1 − e0 − e1)⟨Z⟩.
 */
import { EngineError } from "../errors";

export interface Readout {
  e0: number;
  e1: number;
  /** Rates of qubit q when they differ from (e0, e1) (index = qubit; holes use the defaults). */
  qubits?: readonly ({ e0: number; e1: number } | undefined)[];
}

/** The rates of qubit q. */
export function qubitReadout(r: Readout, q: number): { e0: number; e1: number } {
  return r.qubits?.[q] ?? r;
}

export function hasReadoutError(r: Readout): boolean {
  return (
    r.e0 > 0 || r.e1 > 0 || (r.qubits ?? []).some((x) => x !== undefined && (x.e0 > 0 || x.e1 > 0))
  );
}

/**
 * Which qubit index bit `b` (bit value 1 << b) of an outcome stands for: bit k = qubit k for
 * Pauli settings; for eigenbasis outcomes (index written qubit 0 first, most significant
 * digit first) bit b = qubit n−1−b.
 */
export type BitQubit = (b: number) => number;
const SAME: BitQubit = (b) => b;

/** p ← (⊗ A_q) p in place (n = log2 p.length). */
export function convolveReadout(p: Float64Array, r: Readout, bitQubit: BitQubit = SAME): void {
  if (!hasReadoutError(r)) return;
  const d = p.length;
  for (let bit = 1, b = 0; bit < d; bit <<= 1, b++) {
    const { e0, e1 } = qubitReadout(r, bitQubit(b));
    for (let i = 0; i < d; i += bit << 1) {
      for (let b = i; b < i + bit; b++) {
        const p0 = p[b];
        const p1 = p[b + bit];
        p[b] = (1 - e0) * p0 + e1 * p1;
        p[b + bit] = e0 * p0 + (1 - e1) * p1;
      }
    }
  }
}

export interface MitigationFactors {
  /** f(0), f(1): per-qubit estimate of Z for a read 0 / read 1. */
  f0: number;
  f1: number;
  /** A^{-1} entries (row-major 2×2) for transforming value tables. */
  inv: [number, number, number, number];
  /** Factors of qubit q when its rates differ from the defaults (holes use the fields above). */
  qubits?: (MitigationFactors | undefined)[];
}

export function mitigationFactors(r: Readout): MitigationFactors {
  const base = factorsOf(r, null);
  if (!r.qubits) return base;
  return {
    ...base,
    qubits: r.qubits.map((x, q) => (x === undefined ? undefined : factorsOf(x, q))),
  };
}

function factorsOf(r: { e0: number; e1: number }, qubit: number | null): MitigationFactors {
  const det = 1 - r.e0 - r.e1;
  if (Math.abs(det) < 1e-9) {
    const which =
      qubit === null ? "p1Given0 + p0Given1 = 1" : `p1Given0 + p0Given1 = 1 on qubit ${qubit}`;
    const message = `readout mitigation is impossible when ${which} (the readout carries no information)`;
    throw new EngineError("invalid_request", message, [{ path: ["mitigateReadout"], message }]);
  }
  return {
    f0: (1 + r.e0 - r.e1) / det,
    f1: -(1 - r.e0 + r.e1) / det,
    inv: [(1 - r.e1) / det, -r.e1 / det, -r.e0 / det, (1 - r.e0) / det],
  };
}

/**
 * Row vector m = λ·(A^{-1})^{⊗n} in place: the mitigated per-shot value of outcome b
 * for an observable whose true-outcome value is λ (E[m(read)] = Σ_k λ_k p_true(k)).
 */
export function mitigateValueTable(
  values: Float64Array,
  f: MitigationFactors,
  bitQubit: BitQubit = SAME,
): void {
  const n = values.length;
  for (let bit = 1, q = 0; bit < n; bit <<= 1, q++) {
    const [a, b, c, d] = (f.qubits?.[bitQubit(q)] ?? f).inv; // A^{-1} = [[a, b], [c, d]]; m_new[j] = Σ_k λ_k inv[k][j]
    for (let i = 0; i < n; i += bit << 1) {
      for (let k = i; k < i + bit; k++) {
        const l0 = values[k];
        const l1 = values[k + bit];
        values[k] = l0 * a + l1 * c;
        values[k + bit] = l0 * b + l1 * d;
      }
    }
  }
}

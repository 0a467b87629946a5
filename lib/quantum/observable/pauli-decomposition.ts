/**
 * Pauli decomposition of a matrix observable, A = Σ_P c_P·P with c_P = Tr(P·A)/2ⁿ
 * (the Pauli words are an orthogonal basis of the 2ⁿ×2ⁿ matrices under the
 * Hilbert–Schmidt product Tr(P†Q) = 2ⁿ·δ_PQ; Nielsen & Chuang, §2.1.7 / exercise 2.35
 * for one qubit). Shown for matrices of up to MAX_DECOMPOSITION_QUBITS qubits so the
 * user sees how the matrix was read (which factor is qubit 0).
 *
 * For P = X^x Z^z (Y where both bits are set) P|k⟩ = i^{#Y}·(−1)^{|k ∧ z|}·|k ⊕ x⟩, so
 * P_{k⊕x,k} is the only non-zero entry of column k and Tr(P·A) = Σ_k P_{k⊕x,k}·A_{k,k⊕x}
 * = i^{#Y}·Σ_k (−1)^{|k∧z|}·A_{k,k⊕x} — 2ⁿ work per word, 8ⁿ in all (262,144 for n = 6).
 * A is Hermitian, so every c_P is real.
 */
import { popcount } from "./bits";
import type { HermitianMatrix } from "./matrix-observable";
import { masksToWord, sparseLabel } from "./pauli-word";

export const MAX_DECOMPOSITION_QUBITS = 6;

export interface PauliComponent {
  /** Dense word, qubit 0 first. */
  pauli: string;
  label: string;
  coefficient: number;
}

export interface PauliDecomposition {
  /** Non-zero components (|c| > 1e-12·max|c|), largest |c| first (ties: word order). */
  terms: PauliComponent[];
  /** Components left out of `terms` because of `limit`. */
  omitted: number;
}

/**
 * The decomposition of `h` (state order, index bit k = qubit k), or null above
 * MAX_DECOMPOSITION_QUBITS. At most `limit` components are listed.
 */
export function pauliDecomposition(h: HermitianMatrix, limit = 256): PauliDecomposition | null {
  const n = h.n;
  if (n > MAX_DECOMPOSITION_QUBITS) return null;
  const d = h.dim;
  const all: PauliComponent[] = [];
  let largest = 0;
  for (let x = 0; x < d; x++) {
    for (let z = 0; z < d; z++) {
      const ys = popcount(x & z);
      let sr = 0;
      let si = 0;
      for (let k = 0; k < d; k++) {
        const sign = popcount(k & z) & 1 ? -1 : 1;
        sr += sign * h.re[k * d + (k ^ x)];
        si += sign * h.im[k * d + (k ^ x)];
      }
      // real part of i^{#Y}·(sr + i·si); the imaginary part vanishes for Hermitian A
      const re = ys % 4 === 0 ? sr : ys % 4 === 1 ? -si : ys % 4 === 2 ? -sr : si;
      const c = re / d;
      largest = Math.max(largest, Math.abs(c));
      all.push({ pauli: masksToWord(x, z, n), label: sparseLabel(x, z), coefficient: c });
    }
  }
  const kept = all.filter((t) => Math.abs(t.coefficient) > 1e-12 * largest);
  kept.sort(
    (a, b) => Math.abs(b.coefficient) - Math.abs(a.coefficient) || (a.pauli < b.pauli ? -1 : 1),
  );
  return { terms: kept.slice(0, limit), omitted: Math.max(0, kept.length - limit) };
}

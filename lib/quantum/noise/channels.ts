/**
 * Noise channels as in-place kernels on a density matrix (no superoperator of the whole
 * space is ever formed). Storage: row-major ρ, entry index (r << n) | c, so column qubit q
 * is index bit q and row qubit q is bit q + n (density-matrix/state.ts).
 *
 * For a single qubit q, write ρ in 2×2 blocks over q's row/column bit:
 * ρ = [[ρ00, ρ01], [ρ10, ρ11]] (each block an operator on the other qubits). Sources:
 * M. A. Nielsen & I. L. Chuang, "Quantum Computation and Quantum Information", ch. 8
 * (§8.3.4 depolarizing, §8.3.5 amplitude damping, §8.3.6 phase damping).
 */
import type { DensityMatrix } from "../types";

/** Index-bit offsets of the 2^k local states on the row bits and on the column bits. */
function rowColOffsets(
  n: number,
  qubits: readonly number[],
): { row: Int32Array; col: Int32Array; mask: number } {
  const k = qubits.length;
  const d = 1 << k;
  const row = new Int32Array(d);
  const col = new Int32Array(d);
  for (let s = 0; s < d; s++) {
    let r = 0,
      c = 0;
    for (let j = 0; j < k; j++) {
      if ((s >> (k - 1 - j)) & 1) {
        c |= 1 << qubits[j];
        r |= 1 << (qubits[j] + n);
      }
    }
    row[s] = r;
    col[s] = c;
  }
  return { row, col, mask: row[d - 1] | col[d - 1] };
}

/**
 * Depolarizing channel on the 2^k-dimensional space of `qubits` (N&C §8.3.4, eq. 8.100 form
 * generalised to k qubits): ρ → (1−p)·ρ + p·(I/2^k ⊗ Tr_qubits ρ).
 * Block-wise: for every pair of "rest" row/column indices, the 2^k×2^k block B becomes
 * (1−p)·B + p·(Tr B)·I/2^k. For one qubit this shrinks the Bloch vector by (1−p).
 */
export function depolarize(rho: DensityMatrix, qubits: readonly number[], p: number): void {
  if (p === 0) return;
  const { re, im } = rho;
  const { row, col, mask } = rowColOffsets(rho.n, qubits);
  const d = row.length;
  const keep = 1 - p;
  const mix = p / d;
  const notMask = ~mask;
  const count = re.length / (d * d);
  if (d === 2) {
    const r1 = row[1],
      c1 = col[1],
      rc = r1 | c1;
    for (let t = 0, b = 0; t < count; t++, b = ((b | mask) + 1) & notMask) {
      const tr = re[b] + re[b | rc];
      const ti = im[b] + im[b | rc];
      re[b] = keep * re[b] + mix * tr;
      im[b] = keep * im[b] + mix * ti;
      re[b | rc] = keep * re[b | rc] + mix * tr;
      im[b | rc] = keep * im[b | rc] + mix * ti;
      re[b | c1] *= keep;
      im[b | c1] *= keep;
      re[b | r1] *= keep;
      im[b | r1] *= keep;
    }
    return;
  }
  for (let t = 0, b = 0; t < count; t++, b = ((b | mask) + 1) & notMask) {
    let tr = 0,
      ti = 0;
    for (let s = 0; s < d; s++) {
      tr += re[b | row[s] | col[s]];
      ti += im[b | row[s] | col[s]];
    }
    for (let s = 0; s < d; s++) {
      const rb = b | row[s];
      for (let u = 0; u < d; u++) {
        const i = rb | col[u];
        re[i] *= keep;
        im[i] *= keep;
      }
      re[rb | col[s]] += mix * tr;
      im[rb | col[s]] += mix * ti;
    }
  }
}

/**
 * Amplitude damping with γ followed by phase damping with λ on qubit q, in one pass.
 * Amplitude damping (N&C §8.3.5): Kraus K0 = [[1,0],[0,√(1−γ)]], K1 = [[0,√γ],[0,0]], so
 *   ρ00 → ρ00 + γ·ρ11, ρ11 → (1−γ)·ρ11, ρ01, ρ10 → √(1−γ)·ρ01, √(1−γ)·ρ10.
 * Phase damping (N&C §8.3.6): K0 = [[1,0],[0,√(1−λ)]], K1 = [[0,0],[0,√λ]], so
 *   ρ00, ρ11 unchanged, ρ01, ρ10 → √(1−λ)·ρ01, √(1−λ)·ρ10.
 * The composition (damping, then dephasing) scales coherences by √(1−γ)·√(1−λ).
 */
export function dampQubit(rho: DensityMatrix, q: number, gamma: number, lambda: number): void {
  if (gamma === 0 && lambda === 0) return;
  const { re, im } = rho;
  const c1 = 1 << q;
  const r1 = 1 << (q + rho.n);
  const rc = r1 | c1;
  const notMask = ~rc;
  const coh = Math.sqrt(1 - gamma) * Math.sqrt(1 - lambda);
  const pop = 1 - gamma;
  const count = re.length >>> 2;
  for (let t = 0, b = 0; t < count; t++, b = ((b | rc) + 1) & notMask) {
    const i11 = b | rc;
    re[b] += gamma * re[i11];
    im[b] += gamma * im[i11];
    re[i11] *= pop;
    im[i11] *= pop;
    re[b | c1] *= coh;
    im[b | c1] *= coh;
    re[b | r1] *= coh;
    im[b | r1] *= coh;
  }
}

/**
 * The full noise after a 1-qubit gate in ONE pass: depolarizing p (as `depolarize`), then
 * amplitude damping γ and phase damping λ (as `dampQubit`) on qubit q. Per 2×2 block
 * [[a, b], [c, e]] over q: a' = (1−p)a + p(a+e)/2, e' = (1−p)e + p(a+e)/2, b' = (1−p)b,
 * c' = (1−p)c; then a'' = a' + γe', e'' = (1−γ)e', b'' = √(1−γ)√(1−λ)·b', likewise c''.
 */
export function noiseAfter1q(
  rho: DensityMatrix,
  q: number,
  p: number,
  gamma: number,
  lambda: number,
): void {
  if (p === 0 && gamma === 0 && lambda === 0) return;
  const { re, im } = rho;
  const c1 = 1 << q;
  const r1 = 1 << (q + rho.n);
  const rc = r1 | c1;
  const notMask = ~rc;
  const keep = 1 - p;
  const mix = p / 2;
  const coh = keep * Math.sqrt(1 - gamma) * Math.sqrt(1 - lambda);
  const pop = 1 - gamma;
  const count = re.length >>> 2;
  for (let t = 0, b = 0; t < count; t++, b = ((b | rc) + 1) & notMask) {
    const i11 = b | rc;
    const ar = re[b],
      ai = im[b],
      er = re[i11],
      ei = im[i11];
    const tr = mix * (ar + er),
      ti = mix * (ai + ei);
    const er1 = keep * er + tr,
      ei1 = keep * ei + ti;
    re[b] = keep * ar + tr + gamma * er1;
    im[b] = keep * ai + ti + gamma * ei1;
    re[i11] = pop * er1;
    im[i11] = pop * ei1;
    re[b | c1] *= coh;
    im[b | c1] *= coh;
    re[b | r1] *= coh;
    im[b | r1] *= coh;
  }
}

/** Amplitude damping with γ on qubit q (N&C §8.3.5; formula in dampQubit). */
export function amplitudeDamp(rho: DensityMatrix, q: number, gamma: number): void {
  dampQubit(rho, q, gamma, 0);
}

/** Phase damping with λ on qubit q (N&C §8.3.6; formula in dampQubit). */
export function phaseDamp(rho: DensityMatrix, q: number, lambda: number): void {
  dampQubit(rho, q, 0, lambda);
}

/**
 * Non-selective projective measurement of qubit q in the Z basis (N&C §2.4.2 / §8.2):
 * ρ → P0 ρ P0 + P1 ρ P1 — the coherences ρ01, ρ10 vanish, populations stay.
 */
export function measureNonSelective(rho: DensityMatrix, q: number): void {
  dampQubit(rho, q, 0, 1);
}

/**
 * Reset of qubit q to |0⟩: ρ → |0⟩⟨0|_q ⊗ Tr_q ρ, i.e. ρ00 → ρ00 + ρ11, and ρ01, ρ10, ρ11 → 0
 * (the Kraus pair |0⟩⟨0|, |0⟩⟨1|; equivalently amplitude damping with γ = 1).
 */
export function resetQubit(rho: DensityMatrix, q: number): void {
  dampQubit(rho, q, 1, 0);
}

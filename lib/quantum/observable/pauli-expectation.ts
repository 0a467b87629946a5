/**
 * Exact expectation values of Pauli terms without forming 2^n × 2^n matrices.
 *
 * A Pauli word with masks (x, z) and k = popcount(x & z) Y factors is
 * P = i^k · X^x Z^z (per qubit Y = iXZ), so P|b⟩ = i^k (−1)^{|b & z|} |b ⊕ x⟩.
 * - Statevector: ⟨ψ|P|ψ⟩ = Σ_b conj(ψ_{b⊕x}) · i^k (−1)^{|b&z|} · ψ_b. Pairing b with
 *   b' = b ⊕ x (s_{b'} = (−1)^k s_b) gives, over the half b with bit h(x) = 0:
 *   k even: (−1)^{k/2} · 2 Σ s_b Re(conj(ψ_{b'}) ψ_b);  k odd: −(−1)^{(k−1)/2} · 2 Σ s_b Im(conj(ψ_{b'}) ψ_b).
 * - Density matrix: Tr(ρP) = Σ_b ρ_{b, b⊕x} · i^k (−1)^{|b&z|}; the same pairing with
 *   ρ_{b',b} = conj(ρ_{b,b'}) gives 2 Σ s_b Re ρ_{b,b'} (k even) or 2 Σ s_b Im ρ_{b,b'} (k odd).
 * - Diagonal terms (x = 0) come from the probabilities p_b: ⟨Z_z⟩ = Σ_b p_b (−1)^{|b&z|},
 *   all of them from one pass over p (few terms) or one Walsh–Hadamard transform (many).
 * On a statevector every flip mask x costs one pass over the amplitudes, shared by all terms
 * with that mask (pauli-mask-pass.ts); on ρ each off-diagonal term reads its band ρ_{b,b⊕x}
 * (2^n entries of 4^n). Results are per term, in the order of `sum.terms`.
 */
import type { DensityMatrix, PauliSum, StateVector } from "../types";
import { POPCOUNT16 } from "./bits";
import { LOW_BITS, type MaskTerm, SignTables, maskPassOnState, yCount } from "./pauli-mask-pass";
import { walshHadamardInPlace } from "./walsh-hadamard";
import { pairKey, pairable, wasmMaskPass, wasmPairPass } from "../wasm/pauli";
import { wasmBinding } from "../wasm/runtime";
import { engineThreads, threadsFor } from "../parallel/config";
import { ParallelState } from "../parallel/kernel-pool";
import { dealGroups, type MaskGroup } from "./pauli-threads";

/**
 * Per-term ⟨P_i⟩ on a normalised statevector: terms grouped by flip mask x, one pass over
 * the state per mask (pauli-mask-pass.ts); a mask shared by many terms (and the diagonal
 * group when large) goes through Walsh–Hadamard transforms instead (maskByTransform).
 * On engine threads (`threads`, default engineThreads(); states from PARALLEL_MIN_QUBITS in
 * shared memory) the mask groups are dealt to the threads (pauli-threads.ts): bit-identical.
 * `lowBits` sets the block split (tests exercise small values).
 */
export function pauliExpectationsOnState(
  state: StateVector,
  sum: PauliSum,
  lowBits = LOW_BITS,
  threads = engineThreads(),
): Float64Array {
  const n = state.n;
  const groups = [...groupByMask(sum)];
  const parts = Math.min(threadsFor(n, threads), groups.length);
  if (parts > 1) {
    const shared = new ParallelState(n, pow2Floor(parts), { existing: state });
    try {
      if (shared.parallel) {
        const out = new Float64Array(new SharedArrayBuffer(8 * sum.terms.length));
        const dealt = dealGroups(groups, shared.threads, transformThreshold(n));
        const payloads = dealt.slice(1).map((g) => ({ groups: g, out: out.buffer, lowBits }));
        shared.runJobs("pauli", payloads, () =>
          runMaskGroups(state.re, state.im, n, dealt[0], out, lowBits),
        );
        return out;
      }
    } finally {
      shared.detach();
    }
  }
  const out = new Float64Array(sum.terms.length);
  runMaskGroups(state.re, state.im, n, groups, out, lowBits);
  return out;
}

const pow2Floor = (x: number): number => 2 ** Math.floor(Math.log2(x));

/** ⟨P_t⟩ into out[t.index] for the terms of the given mask groups, one thread. */
export function runMaskGroups(
  re: Float64Array,
  im: Float64Array,
  n: number,
  groups: readonly MaskGroup[],
  out: Float64Array,
  lowBits = LOW_BITS,
): void {
  const signs = new SignTables(Math.min(n, lowBits));
  // amplitudes in a kernel memory: the SIMD pass (WebAssembly), else the JavaScript one
  const w = n >= 3 ? wasmBinding(re, im) : undefined;
  // single terms waiting for a partner mask (same pairKey): two of them share one pass
  const waiting = new Map<number, [number, MaskTerm]>();
  for (const [x, terms] of groups) {
    if (terms.length > transformThreshold(n)) maskByTransform(re, im, x, terms, out);
    else if (w && terms.length === 1 && pairable(x)) {
      const key = pairKey(x);
      const other = waiting.get(key);
      if (other) {
        waiting.delete(key);
        wasmPairPass(w, re, im, other[0], other[1], x, terms[0], out);
      } else waiting.set(key, [x, terms[0]]);
    } else if (w) wasmMaskPass(w, re, im, x, terms, out);
    else maskPassOnState(re, im, x, terms, signs, out);
  }
  if (w) for (const [x, t] of waiting.values()) wasmMaskPass(w, re, im, x, [t], out);
}

/** Terms by flip mask x (insertion order), with their Y count. */
export function groupByMask(sum: PauliSum): Map<number, MaskTerm[]> {
  const groups = new Map<number, MaskTerm[]>();
  sum.terms.forEach((t, index) => {
    let g = groups.get(t.xMask);
    if (!g) groups.set(t.xMask, (g = []));
    g.push({ index, z: t.zMask, k: yCount(t.xMask, t.zMask) });
  });
  return groups;
}

/**
 * Above this many terms per mask, two Walsh–Hadamard transforms (≈ 2n passes of adds) beat
 * the per-term block accumulation (≈ ½ pass each); measured break-even ≈ 3n, rounded.
 */
const transformThreshold = (n: number): number => Math.max(8, 3 * n);

/**
 * All terms of mask x from transforms: g(b) = Re f(b) (and Im f(b)) on the half b with bit h
 * clear, zero elsewhere; WHT(g)[z] = Σ_b s_z(b) g(b) is the half-sum A of every z at once.
 */
function maskByTransform(
  re: Float64Array,
  im: Float64Array,
  x: number,
  terms: readonly MaskTerm[],
  out: Float64Array,
): void {
  const d = re.length;
  if (x === 0) {
    const w = new Float64Array(d);
    for (let b = 0; b < d; b++) w[b] = re[b] * re[b] + im[b] * im[b];
    walshHadamardInPlace(w);
    for (const t of terms) out[t.index] = w[t.z];
    return;
  }
  const h = 31 - Math.clz32(x);
  const needRe = terms.some((t) => (t.k & 1) === 0);
  const needIm = terms.some((t) => (t.k & 1) === 1);
  const wr = needRe ? new Float64Array(d) : null;
  const wi = needIm ? new Float64Array(d) : null;
  for (let b = 0; b < d; b++) {
    if ((b >>> h) & 1) continue;
    const c = b ^ x;
    if (wr) wr[b] = re[c] * re[b] + im[c] * im[b];
    if (wi) wi[b] = re[c] * im[b] - im[c] * re[b];
  }
  if (wr) walshHadamardInPlace(wr);
  if (wi) walshHadamardInPlace(wi);
  for (const t of terms) {
    const a = (t.k & 1) === 0 ? (wr as Float64Array)[t.z] : (wi as Float64Array)[t.z];
    out[t.index] = t.k === 0 || t.k === 3 ? 2 * a : -2 * a;
  }
}

/** Per-term Tr(ρ P_i) on a density matrix of unit trace. */
export function pauliExpectationsOnDensity(rho: DensityMatrix, sum: PauliSum): Float64Array {
  const out = new Float64Array(sum.terms.length);
  const d = 2 ** rho.n;
  const diag: number[] = [];
  sum.terms.forEach((t, i) => {
    if (t.xMask === 0) diag.push(i);
    else out[i] = offDiagonalOnDensity(rho, d, t.xMask, t.zMask);
  });
  if (diag.length > 0) {
    const p = new Float64Array(d);
    for (let b = 0; b < d; b++) p[b] = rho.re[b * d + b];
    fillDiagonal(p, sum, diag, out);
  }
  return out;
}

/** Σ_i c_i v_i. */
export function weightedTotal(sum: PauliSum, values: ArrayLike<number>): number {
  let s = 0;
  sum.terms.forEach((t, i) => (s += t.coefficient * values[i]));
  return s;
}

/**
 * ⟨Z_z⟩ for the listed diagonal terms from probabilities p. Few terms (≤ n): one pass
 * over p accumulating every term; more: one Walsh–Hadamard transform of a copy of p.
 */
export function fillDiagonal(
  p: Float64Array,
  sum: PauliSum,
  diag: number[],
  out: Float64Array,
): void {
  const n = Math.round(Math.log2(p.length));
  if (diag.length > Math.max(n, 1)) {
    const w = p.slice();
    walshHadamardInPlace(w);
    for (const i of diag) out[i] = w[sum.terms[i].zMask];
    return;
  }
  const masks = Int32Array.from(diag, (i) => sum.terms[i].zMask);
  const acc = new Float64Array(diag.length);
  for (let b = 0; b < p.length; b++) {
    const pb = p[b];
    if (pb === 0) continue;
    for (let t = 0; t < masks.length; t++) {
      const v = b & masks[t];
      acc[t] += (POPCOUNT16[v & 0xffff] + POPCOUNT16[v >>> 16]) & 1 ? -pb : pb;
    }
  }
  diag.forEach((i, t) => (out[i] = acc[t]));
}

function offDiagonalOnDensity(rho: DensityMatrix, d: number, x: number, z: number): number {
  const k = (POPCOUNT16[x & z & 0xffff] + POPCOUNT16[(x & z) >>> 16]) & 3;
  const h = 31 - Math.clz32(x);
  const low = (1 << h) - 1;
  const half = d >>> 1;
  const part = (k & 1) === 0 ? rho.re : rho.im;
  let acc = 0;
  for (let i = 0; i < half; i++) {
    const b = ((i >>> h) << (h + 1)) | (i & low);
    const v = part[b * d + (b ^ x)];
    const m = b & z;
    acc += (POPCOUNT16[m & 0xffff] + POPCOUNT16[m >>> 16]) & 1 ? -v : v;
  }
  // i^k · (ρ_{bb'} + (−1)^k conj ρ_{bb'}): k=0: 2Re, k=2: −2Re, k=1: i·2i·Im = −2Im, k=3: −i·2i·Im = 2Im.
  return k === 0 || k === 3 ? 2 * acc : -2 * acc;
}

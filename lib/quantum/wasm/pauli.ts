/**
 * The Pauli flip-mask pass (observable/pauli-mask-pass.ts) on amplitudes bound to a kernel
 * memory: SIMD passes with signs from i32.popcnt parities, one pass per mask for a single
 * term and one per four terms sharing a mask (pauliTerms4 computes f = conj(ψ_c) ψ_b once
 * for all four), and one pass for two single terms whose masks share the highest bit and
 * bit 0 (pauliPair: ψ_b read once for both). Every kernel gives a term the same bits.
 * Terms go through the memory's Pauli table (runtime.ts).
 */
import type { MaskTerm } from "../observable/pauli-mask-pass";
import { PAULI_OUT, PAULI_PAIR, type WasmBinding } from "./runtime";

interface PauliViews {
  table: Int32Array;
  sums: Float64Array;
  pairSums: Float64Array;
}
const views = new WeakMap<WasmBinding, PauliViews>();

function viewsOf(w: WasmBinding): PauliViews {
  let v = views.get(w);
  if (!v) {
    v = {
      table: new Int32Array(w.buffer, w.pauliAt, 8),
      sums: new Float64Array(w.buffer, w.pauliAt + PAULI_OUT, 4),
      pairSums: new Float64Array(w.buffer, w.pauliAt + PAULI_PAIR, 2),
    };
    views.set(w, v);
  }
  return v;
}

/** Writes ⟨P_t⟩ into out[t.index] for every term t with flip mask x (state of ≥ 8 amplitudes). */
export function wasmMaskPass(
  w: WasmBinding,
  re: Float64Array,
  im: Float64Array,
  x: number,
  terms: readonly MaskTerm[],
  out: Float64Array,
): void {
  const len = re.length;
  const h = x === 0 ? -1 : 31 - Math.clz32(x);
  // h ≥ 3: visit the half with bit h clear (each pair once, doubled below); else every b
  const half = h >= 3;
  const run = half ? 2 ** h : len;
  const stride = half ? 2 ** (h + 1) : len;
  const put = (t: MaskTerm, sum: number): void => putTerm(out, x, half, t, sum);
  const a = re.byteOffset;
  const b = im.byteOffset;
  const { table, sums } = viewsOf(w);
  let i = 0;
  while (terms.length - i >= 2) {
    const g = Math.min(4, terms.length - i);
    for (let t = 0; t < 4; t++) {
      const term = terms[i + Math.min(t, g - 1)]; // 2 or 3 terms: the last one repeated
      table[2 * t] = term.z;
      table[2 * t + 1] = term.k & 1;
    }
    w.k.pauliTerms4(a, b, x, run, stride, len, w.pauliAt, w.pauliAt + PAULI_OUT);
    for (let t = 0; t < g; t++) put(terms[i + t], sums[t]);
    i += g;
  }
  if (i < terms.length) {
    const t = terms[i];
    put(
      t,
      x === 0
        ? w.k.pauliDiagonal(a, b, len, t.z)
        : w.k.pauliTerm(a, b, x, run, stride, len, t.z, t.k & 1),
    );
  }
}

/** ⟨P⟩ from a kernel's sum: doubled for a half pass, signed by i^k. */
function putTerm(out: Float64Array, x: number, half: boolean, t: MaskTerm, sum: number): void {
  const sign = x === 0 || t.k === 0 || t.k === 3 ? 1 : -1;
  out[t.index] = (half ? 2 : 1) * sign * sum;
}

/** Key under which single terms pair up (pairKey(xA) = pairKey(xB)): the highest bit and bit 0. */
export const pairKey = (x: number): number => ((31 - Math.clz32(x)) << 1) | (x & 1);

/** Masks a pair pass takes: highest bit ≥ 3 (half passes over whole groups of eight). */
export const pairable = (x: number): boolean => x >= 8;

/** ⟨P_A⟩ and ⟨P_B⟩ of two single terms (pairKey(xA) = pairKey(xB), both pairable) in one pass. */
export function wasmPairPass(
  w: WasmBinding,
  re: Float64Array,
  im: Float64Array,
  xA: number,
  tA: MaskTerm,
  xB: number,
  tB: MaskTerm,
  out: Float64Array,
): void {
  const h = 31 - Math.clz32(xA);
  const { pairSums } = viewsOf(w);
  w.k.pauliPair(
    re.byteOffset,
    im.byteOffset,
    xA,
    xB,
    2 ** h,
    2 ** (h + 1),
    re.length,
    tA.z,
    tB.z,
    tA.k & 1,
    tB.k & 1,
    w.pauliAt + PAULI_PAIR,
  );
  putTerm(out, xA, true, tA, pairSums[0]);
  putTerm(out, xB, true, tB, pairSums[1]);
}

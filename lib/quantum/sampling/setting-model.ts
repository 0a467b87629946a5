/**
 * What one measurement setting reports for an outcome b (n bits, bit k = qubit k,
 * after rotation into the setting's basis and after readout error):
 * - Pauli setting with terms c_i P_i (support mask s_i): term value (−1)^{|b & s_i|},
 *   setting value O(b) = Σ c_i (−1)^{|b & s_i|}; readout-mitigated term value
 *   f0^{|s_i| − h} f1^{h} with h = |b & s_i| (readout.ts).
 * - Matrix observable measured in its eigenbasis: outcome b is eigenvector b (ascending
 *   eigenvalues), O(b) = λ_b; mitigated value m = λ·(A^{-1})^{⊗n}.
 * Value ranges (for the interval's pseudo-shots, interval.ts): a Pauli setting's O(b) lies in
 * ±Σ|c_i| and its mitigated value in Σ_i c_i·[min_h, max_h] f0^{|s_i|−h} f1^h (per-term extremes
 * exact; their sum a bound, attained for disjoint supports); a matrix observable's in [λ_min, λ_max] and [min m, max m] (exact).
 */
import { POPCOUNT16 } from "../observable/bits";
import type { PauliSum } from "../types";
import { mitigateValueTable, type MitigationFactors } from "./readout";

export interface SettingModel {
  /** Number of Pauli terms this setting estimates (0 for a matrix observable). */
  termCount: number;
  /** Bounds [lo, hi] on the per-shot value O(b) (interval.ts puts its pseudo-shots there). */
  range: [number, number];
  /** Bounds on the mitigated per-shot value, when mitigation is on. */
  mitigatedRange: [number, number] | null;
  /** Per term (setting order): smallest and largest mitigated term value (±1 without mitigation). */
  termMitigatedRange: [number, number][];
  value(b: number): number;
  /** Present when readout mitigation is on. */
  mitigated: ((b: number) => number) | null;
  /** raw[i] += w·v_i(b); mit[i] += w·v̂_i(b); mitSq[i] += w·v̂_i(b)². */
  accumulateTerms(
    b: number,
    w: number,
    raw: Float64Array,
    mit: Float64Array | null,
    mitSq: Float64Array | null,
  ): void;
}

function pc(v: number): number {
  return POPCOUNT16[v & 0xffff] + POPCOUNT16[v >>> 16];
}

export function pauliSettingModel(
  sum: PauliSum,
  termIndices: number[],
  mitigation: MitigationFactors | null,
): SettingModel {
  const k = termIndices.length;
  const c = Float64Array.from(termIndices, (i) => sum.terms[i].coefficient);
  const s = Int32Array.from(termIndices, (i) => sum.terms[i].xMask | sum.terms[i].zMask);
  const size = Int32Array.from(s, (m) => pc(m));
  const n = sum.numQubits;
  const pow0 = new Float64Array(n + 1);
  const pow1 = new Float64Array(n + 1);
  if (mitigation) {
    for (let j = 0; j <= n; j++) {
      pow0[j] = mitigation.f0 ** j;
      pow1[j] = mitigation.f1 ** j;
    }
  }
  // Qubits with their own readout rates (noise.readout.qubits): factors per qubit.
  const own = mitigation?.qubits;
  const fq = (q: number) => own?.[q] ?? (mitigation as MitigationFactors);
  // mitigated term value f0^{w−h}·f1^h over h = 0 … w (w = |s_i|): its extremes, exactly;
  // with per-qubit factors, the product over the support of f0_q or f1_q: the extremes of a
  // product are reached by extremes of the running product times each factor.
  const termRange: [number, number][] = Array.from(size, (w, i) => {
    if (!mitigation) return [-1, 1];
    let lo = Number.POSITIVE_INFINITY;
    let hi = Number.NEGATIVE_INFINITY;
    if (own) {
      lo = 1;
      hi = 1;
      for (let q = 0; q < n; q++) {
        if (!((s[i] >> q) & 1)) continue;
        const { f0, f1 } = fq(q);
        const cands = [lo * f0, lo * f1, hi * f0, hi * f1];
        lo = Math.min(...cands);
        hi = Math.max(...cands);
      }
      return [lo, hi];
    }
    for (let h = 0; h <= w; h++) {
      const v = mitigation.f0 ** (w - h) * mitigation.f1 ** h;
      lo = Math.min(lo, v);
      hi = Math.max(hi, v);
    }
    return [lo, hi];
  });
  let bound = 0;
  const mitRange: [number, number] = [0, 0];
  for (let i = 0; i < k; i++) {
    bound += Math.abs(c[i]);
    const [a, b] = termRange[i];
    mitRange[0] += Math.min(c[i] * a, c[i] * b);
    mitRange[1] += Math.max(c[i] * a, c[i] * b);
  }
  const mitTerm = own
    ? (b: number, i: number): number => {
        let v = 1;
        for (let m = s[i], q = 0; m !== 0; m >>>= 1, q++)
          if (m & 1) v *= (b >> q) & 1 ? fq(q).f1 : fq(q).f0;
        return v;
      }
    : (b: number, i: number): number => {
        const h = pc(b & s[i]);
        return pow0[size[i] - h] * pow1[h];
      };
  return {
    termCount: k,
    range: [-bound, bound],
    mitigatedRange: mitigation ? mitRange : null,
    termMitigatedRange: termRange,
    value(b) {
      let v = 0;
      for (let i = 0; i < k; i++) v += pc(b & s[i]) & 1 ? -c[i] : c[i];
      return v;
    },
    mitigated: mitigation
      ? (b) => {
          let v = 0;
          for (let i = 0; i < k; i++) v += c[i] * mitTerm(b, i);
          return v;
        }
      : null,
    accumulateTerms(b, w, raw, mit, mitSq) {
      for (let i = 0; i < k; i++) {
        raw[i] += pc(b & s[i]) & 1 ? -w : w;
        if (mit && mitSq) {
          const m = mitTerm(b, i);
          mit[i] += w * m;
          mitSq[i] += w * m * m;
        }
      }
    },
  };
}

export function eigenbasisSettingModel(
  eigenvalues: Float64Array,
  mitigation: MitigationFactors | null,
): SettingModel {
  let table: Float64Array | null = null;
  if (mitigation) {
    table = eigenvalues.slice();
    const n = Math.round(Math.log2(eigenvalues.length));
    mitigateValueTable(table, mitigation, (b) => n - 1 - b);
  }
  const t = table;
  return {
    termCount: 0,
    range: [minOf(eigenvalues), maxOf(eigenvalues)],
    mitigatedRange: t ? [minOf(t), maxOf(t)] : null,
    termMitigatedRange: [],
    value: (b) => eigenvalues[b],
    mitigated: t ? (b) => t[b] : null,
    accumulateTerms() {},
  };
}

function minOf(a: Float64Array): number {
  let m = Number.POSITIVE_INFINITY;
  for (const x of a) m = Math.min(m, x);
  return m;
}

function maxOf(a: Float64Array): number {
  let m = Number.NEGATIVE_INFINITY;
  for (const x of a) m = Math.max(m, x);
  return m;
}

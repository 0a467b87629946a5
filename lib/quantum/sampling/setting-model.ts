/**
 * What one measurement setting reports for an outcome b (n bits, bit k = qubit k,
 * after rotation into the setting's basis and after readout error):
 * - Pauli setting with terms c_i P_i (support mask s_i): term value (−1)^{|b & s_i|},
 *   setting value O(b) = Σ c_i (−1)^{|b & s_i|}; readout-mitigated term value
 *   f0^{|s_i| − h} f1^{h} with h = |b & s_i| (readout.ts).
 * - Matrix observable measured in its eigenbasis: outcome b is eigenvector b (ascending
 *   eigenvalues), O(b) = λ_b; mitigated value m = λ·(A^{-1})^{⊗n}.
 */
import { POPCOUNT16 } from "../observable/bits";
import type { PauliSum } from "../types";
import { mitigateValueTable, type MitigationFactors } from "./readout";

export interface SettingModel {
  /** Number of Pauli terms this setting estimates (0 for a matrix observable). */
  termCount: number;
  value(b: number): number;
  /** Present when readout mitigation is on. */
  mitigated: ((b: number) => number) | null;
  /** raw[i] += w·v_i(b); mit[i] += w·v̂_i(b); mitSq[i] += w·v̂_i(b)². */
  accumulateTerms(b: number, w: number, raw: Float64Array, mit: Float64Array | null, mitSq: Float64Array | null): void;
}

function pc(v: number): number {
  return POPCOUNT16[v & 0xffff] + POPCOUNT16[v >>> 16];
}

export function pauliSettingModel(sum: PauliSum, termIndices: number[], mitigation: MitigationFactors | null): SettingModel {
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
  const mitTerm = (b: number, i: number): number => {
    const h = pc(b & s[i]);
    return pow0[size[i] - h] * pow1[h];
  };
  return {
    termCount: k,
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

export function eigenbasisSettingModel(eigenvalues: Float64Array, mitigation: MitigationFactors | null): SettingModel {
  let table: Float64Array | null = null;
  if (mitigation) {
    table = eigenvalues.slice();
    mitigateValueTable(table, mitigation);
  }
  const t = table;
  return {
    termCount: 0,
    value: (b) => eigenvalues[b],
    mitigated: t ? (b) => t[b] : null,
    accumulateTerms() {},
  };
}

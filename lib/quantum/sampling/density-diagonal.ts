/**
 * Outcome law of a measurement setting on a density matrix without rotating all of ρ:
 * p_b = ⟨b| U ρ U† |b⟩ with U = ⊗_q u_q (u = H for X, H·S† for Y, 1 otherwise).
 *
 * Only entries that can reach the diagonal matter. Qubits that are not rotated are
 * restricted to r_q = c_q at once; the rotated qubits are then processed one at a time —
 * apply u on the row bit and conj(u) on the column bit, keep only row bit = column bit
 * (= the outcome t):  W'(…, t) = Σ_{a,a'} u[t][a] · W(r_q = a, c_q = a') · conj(u[t][a']).
 * The working array halves at every step, so the cost is about 2 · 4^m · 2^{n−m} for m
 * rotated qubits instead of m passes over all 4^n entries. Equal (to round-off) to the
 * diagonal of the fully rotated copy (basis-rotation.ts), which the tests check.
 */
import type { DensityMatrix } from "../types";
import { H_SDG, HADAMARD } from "./basis-rotation";

export function rotatedDensityDiagonal(rho: DensityMatrix, bases: string): Float64Array {
  const n = rho.n;
  const d = 2 ** n;
  const rotated: number[] = [];
  const plain: number[] = [];
  for (let q = 0; q < n; q++) (bases[q] === "X" || bases[q] === "Y" ? rotated : plain).push(q);
  let m = rotated.length;
  // finished qubits, in the order of their bits in the diagonal part of the index
  const finished = [...plain];
  let f = plain.length;
  // stage 0: idx = ((rU << m) | cU) << f | bF
  let re = new Float64Array((1 << (2 * m)) * (1 << f));
  let im = new Float64Array(re.length);
  const scatter = (bits: number, qubits: number[]): number => {
    let v = 0;
    for (let j = 0; j < qubits.length; j++) if ((bits >>> j) & 1) v |= 1 << qubits[j];
    return v;
  };
  const plainIdx = Int32Array.from({ length: 1 << f }, (_, b) => scatter(b, plain));
  const rotIdx = Int32Array.from({ length: 1 << m }, (_, b) => scatter(b, rotated));
  for (let ru = 0; ru < 1 << m; ru++) {
    for (let cu = 0; cu < 1 << m; cu++) {
      const base = ((ru << m) | cu) << f;
      for (let bf = 0; bf < 1 << f; bf++) {
        const src = (rotIdx[ru] | plainIdx[bf]) * d + (rotIdx[cu] | plainIdx[bf]);
        re[base + bf] = rho.re[src];
        im[base + bf] = rho.im[src];
      }
    }
  }
  // finish rotated qubits from the highest U bit down
  while (m > 0) {
    const q = rotated[m - 1];
    const u = bases[q] === "X" ? HADAMARD : H_SDG;
    const m2 = m - 1;
    const f2 = f + 1;
    const nre = new Float64Array((1 << (2 * m2)) * (1 << f2));
    const nim = new Float64Array(nre.length);
    for (let ru = 0; ru < 1 << m2; ru++) {
      for (let cu = 0; cu < 1 << m2; cu++) {
        for (let t = 0; t < 2; t++) {
          const dst = (((ru << m2) | cu) << f2) | (t << f);
          for (let a = 0; a < 2; a++) {
            // u[t][a] (interleaved re/im, row-major 2×2)
            const ur = u[2 * (2 * t + a)];
            const ui = u[2 * (2 * t + a) + 1];
            for (let a2 = 0; a2 < 2; a2++) {
              const vr = u[2 * (2 * t + a2)];
              const vi = -u[2 * (2 * t + a2) + 1]; // conj(u[t][a2])
              const kr = ur * vr - ui * vi;
              const ki = ur * vi + ui * vr;
              const src = ((((a << m2) | ru) << m) | ((a2 << m2) | cu)) << f;
              for (let bf = 0; bf < 1 << f; bf++) {
                const wr = re[src + bf];
                const wi = im[src + bf];
                nre[dst + bf] += kr * wr - ki * wi;
                nim[dst + bf] += kr * wi + ki * wr;
              }
            }
          }
        }
      }
    }
    re = nre;
    im = nim;
    finished.push(q);
    m = m2;
    f = f2;
  }
  const p = new Float64Array(d);
  for (let bf = 0; bf < d; bf++) p[scatter(bf, finished)] = Math.max(0, re[bf]);
  return p;
}

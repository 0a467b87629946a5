/** Seeded random test states (deterministic; mulberry32, common practice for tests). */
import type { DensityMatrix, StateVector } from "@/lib/quantum/types";

export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function randomState(n: number, rand: () => number): StateVector {
  const d = 2 ** n;
  const re = new Float64Array(d);
  const im = new Float64Array(d);
  let s = 0;
  for (let i = 0; i < d; i++) {
    re[i] = rand() - 0.5;
    im[i] = rand() - 0.5;
    s += re[i] ** 2 + im[i] ** 2;
  }
  const k = 1 / Math.sqrt(s);
  for (let i = 0; i < d; i++) {
    re[i] *= k;
    im[i] *= k;
  }
  return { n, re, im };
}

/** A random mixed state: Σ_k w_k |ψ_k⟩⟨ψ_k| with random weights. */
export function randomDensity(n: number, rand: () => number, rank = 3): DensityMatrix {
  const d = 2 ** n;
  const re = new Float64Array(d * d);
  const im = new Float64Array(d * d);
  const w = Array.from({ length: rank }, () => rand() + 0.1);
  const tot = w.reduce((a, b) => a + b, 0);
  for (let k = 0; k < rank; k++) {
    const s = randomState(n, rand);
    for (let i = 0; i < d; i++) {
      for (let j = 0; j < d; j++) {
        re[i * d + j] += (w[k] / tot) * (s.re[i] * s.re[j] + s.im[i] * s.im[j]);
        im[i * d + j] += (w[k] / tot) * (s.im[i] * s.re[j] - s.re[i] * s.im[j]);
      }
    }
  }
  return { n, re, im };
}

export function randomPauliText(n: number, terms: number, rand: () => number): string {
  const letters = "IXYZ";
  const parts: string[] = [];
  for (let t = 0; t < terms; t++) {
    let w = "";
    for (let q = 0; q < n; q++) w += letters[Math.floor(rand() * 4)];
    const c = (rand() * 2 - 1).toFixed(6);
    parts.push(`${c} ${w}`);
  }
  return parts.join(" + ").replace(/\+ -/g, "- ");
}

/** Bell state (|00⟩ + |11⟩)/√2. */
export function bellState(): StateVector {
  const re = new Float64Array([Math.SQRT1_2, 0, 0, Math.SQRT1_2]);
  return { n: 2, re, im: new Float64Array(4) };
}

/** Computational basis state |b⟩ with bit k of `index` = qubit k. */
export function basisState(n: number, index: number): StateVector {
  const re = new Float64Array(2 ** n);
  re[index] = 1;
  return { n, re, im: new Float64Array(2 ** n) };
}

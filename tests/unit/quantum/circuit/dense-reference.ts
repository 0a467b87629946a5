/**
 * Test-only dense complex matrices (independent of the engine's code): products,
 * Kronecker products, embedding of a k-qubit gate into n qubits, and comparison up to
 * one global phase. Convention here: qubit 0 is the MOST significant bit of a full
 * index (textbook order), and a gate's first operand is the most significant bit of its
 * local index — the layout types.ts documents for GateApplication matrices.
 */
import type { Circuit, GateApplication } from "@/lib/quantum/types";

export interface CMat {
  d: number;
  re: number[];
  im: number[];
}

export function zeros(d: number): CMat {
  return { d, re: new Array(d * d).fill(0), im: new Array(d * d).fill(0) };
}

export function identity(d: number): CMat {
  const m = zeros(d);
  for (let i = 0; i < d; i++) m.re[i * d + i] = 1;
  return m;
}

/** Builds a matrix from rows of [re, im] pairs. */
export function fromRows(rows: [number, number][][]): CMat {
  const d = rows.length;
  const m = zeros(d);
  rows.forEach((row, r) =>
    row.forEach(([a, b], c) => {
      m.re[r * d + c] = a;
      m.im[r * d + c] = b;
    }),
  );
  return m;
}

export function fromInterleaved(a: Float64Array): CMat {
  const d = Math.round(Math.sqrt(a.length / 2));
  const m = zeros(d);
  for (let k = 0; k < d * d; k++) {
    m.re[k] = a[2 * k];
    m.im[k] = a[2 * k + 1];
  }
  return m;
}

export function mul(a: CMat, b: CMat): CMat {
  const d = a.d;
  const m = zeros(d);
  for (let i = 0; i < d; i++) {
    for (let k = 0; k < d; k++) {
      const ar = a.re[i * d + k];
      const ai = a.im[i * d + k];
      if (ar === 0 && ai === 0) continue;
      for (let j = 0; j < d; j++) {
        m.re[i * d + j] += ar * b.re[k * d + j] - ai * b.im[k * d + j];
        m.im[i * d + j] += ar * b.im[k * d + j] + ai * b.re[k * d + j];
      }
    }
  }
  return m;
}

export function scale(a: CMat, re: number, im: number): CMat {
  return {
    d: a.d,
    re: a.re.map((x, k) => x * re - a.im[k] * im),
    im: a.im.map((y, k) => a.re[k] * im + y * re),
  };
}

export function dagger(a: CMat): CMat {
  const m = zeros(a.d);
  for (let i = 0; i < a.d; i++) {
    for (let j = 0; j < a.d; j++) {
      m.re[j * a.d + i] = a.re[i * a.d + j];
      m.im[j * a.d + i] = -a.im[i * a.d + j];
    }
  }
  return m;
}

/** Block-diagonal [I, V]: control = first (most significant) operand. */
export function controlled(v: CMat): CMat {
  const m = identity(2 * v.d);
  const d = 2 * v.d;
  for (let i = 0; i < v.d; i++) {
    for (let j = 0; j < v.d; j++) {
      m.re[(v.d + i) * d + v.d + j] = v.re[i * v.d + j];
      m.im[(v.d + i) * d + v.d + j] = v.im[i * v.d + j];
    }
  }
  return m;
}

/** The k-qubit gate `g` on `qubits` (first operand = most significant) within n qubits. */
export function embed(g: CMat, qubits: number[], n: number): CMat {
  const D = 1 << n;
  const k = qubits.length;
  const m = zeros(D);
  const bit = (x: number, q: number) => (x >> (n - 1 - q)) & 1;
  let mask = 0;
  for (const q of qubits) mask |= 1 << (n - 1 - q);
  for (let r = 0; r < D; r++) {
    for (let c = 0; c < D; c++) {
      if ((r & ~mask) !== (c & ~mask)) continue;
      let lr = 0;
      let lc = 0;
      for (let j = 0; j < k; j++) {
        lr = (lr << 1) | bit(r, qubits[j]);
        lc = (lc << 1) | bit(c, qubits[j]);
      }
      m.re[r * D + c] = g.re[lr * g.d + lc];
      m.im[r * D + c] = g.im[lr * g.d + lc];
    }
  }
  return m;
}

/** Product (last applied on the left) of gate applications on n qubits. */
export function composeParts(parts: GateApplication[], n: number): CMat {
  let u = identity(1 << n);
  for (const p of parts) u = mul(embed(fromInterleaved(p.matrix), p.qubits, n), u);
  return u;
}

/** Unitary of all gate ops of a bound circuit (measurements, resets and barriers skipped). */
export function circuitUnitary(c: Circuit): CMat {
  return composeParts(
    c.ops.flatMap((op) => (op.kind === "gate" ? op.parts : [])),
    c.numQubits,
  );
}

/**
 * Largest entry-wise deviation between a and e^{iα}·b, with α taken from the largest
 * entry of b (comparison "up to one global phase").
 */
export function phaseDistance(a: CMat, b: CMat): number {
  if (a.d !== b.d) return Infinity;
  let best = 0;
  let k0 = 0;
  b.re.forEach((x, k) => {
    const mag = Math.hypot(x, b.im[k]);
    if (mag > best) {
      best = mag;
      k0 = k;
    }
  });
  // e^{iα} = a[k0] / b[k0], normalised.
  const nr = a.re[k0] * b.re[k0] + a.im[k0] * b.im[k0];
  const ni = a.im[k0] * b.re[k0] - a.re[k0] * b.im[k0];
  const nn = Math.hypot(nr, ni) || 1;
  const pr = nr / nn;
  const pi = ni / nn;
  let dev = 0;
  for (let k = 0; k < a.re.length; k++) {
    const br = b.re[k] * pr - b.im[k] * pi;
    const bi = b.re[k] * pi + b.im[k] * pr;
    dev = Math.max(dev, Math.hypot(a.re[k] - br, a.im[k] - bi));
  }
  return dev;
}

/** First column of U: the state U|0…0⟩ as a d×d matrix is overkill, so return a vector. */
export function applyToZero(u: CMat): { re: number[]; im: number[] } {
  return { re: u.re.filter((_, k) => k % u.d === 0), im: u.im.filter((_, k) => k % u.d === 0) };
}

/** Seeded uniform numbers in [lo, hi) (mulberry32; test-only, common practice). */
export function seededRandom(seed: number): (lo: number, hi: number) => number {
  let a = seed >>> 0;
  return (lo, hi) => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    const u = ((t ^ (t >>> 14)) >>> 0) / 4294967296;
    return lo + (hi - lo) * u;
  };
}

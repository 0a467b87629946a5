/**
 * Seeded random gates and circuits for the reference tests (pure-rand xoroshiro128+).
 * Matrices follow types.ts: 2^k × 2^k, row-major, interleaved re/im, first operand = most
 * significant local bit. Kinds cover every kernel path: dense random unitaries (Gram–Schmidt
 * on a complex Gaussian matrix — common practice), real rotations, diagonal phases,
 * permutations with phases, controlled-U, and the identity.
 */
import { uniformFloat64 } from "pure-rand/distribution/uniformFloat64";
import { uniformInt } from "pure-rand/distribution/uniformInt";
import { xoroshiro128plus } from "pure-rand/generator/xoroshiro128plus";
import type { Circuit, CircuitOp, GateApplication } from "@/lib/quantum/types";

export interface Rng {
  float(): number;
  int(lo: number, hi: number): number;
}

export function makeRng(seed: number): Rng {
  const g = xoroshiro128plus(seed);
  return { float: () => uniformFloat64(g), int: (lo, hi) => uniformInt(g, lo, hi) };
}

function gaussian(rng: Rng): number {
  const u = 1 - rng.float();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * rng.float());
}

/** Random unitary: Gram–Schmidt orthonormalisation of the columns of a complex Gaussian matrix. */
export function randomUnitary(rng: Rng, d: number): Float64Array {
  const cols: Array<{ re: number[]; im: number[] }> = [];
  for (let c = 0; c < d; c++) {
    const re = Array.from({ length: d }, () => gaussian(rng));
    const im = Array.from({ length: d }, () => gaussian(rng));
    for (const prev of cols) {
      // ⟨prev|v⟩ = Σ conj(prev) v
      let pr = 0,
        pi = 0;
      for (let i = 0; i < d; i++) {
        pr += prev.re[i] * re[i] + prev.im[i] * im[i];
        pi += prev.re[i] * im[i] - prev.im[i] * re[i];
      }
      for (let i = 0; i < d; i++) {
        re[i] -= pr * prev.re[i] - pi * prev.im[i];
        im[i] -= pr * prev.im[i] + pi * prev.re[i];
      }
    }
    let norm = 0;
    for (let i = 0; i < d; i++) norm += re[i] * re[i] + im[i] * im[i];
    norm = Math.sqrt(norm);
    cols.push({ re: re.map((x) => x / norm), im: im.map((x) => x / norm) });
  }
  const m = new Float64Array(2 * d * d);
  for (let r = 0; r < d; r++)
    for (let c = 0; c < d; c++) {
      m[2 * (r * d + c)] = cols[c].re[r];
      m[2 * (r * d + c) + 1] = cols[c].im[r];
    }
  return m;
}

function phase(rng: Rng): [number, number] {
  const a = 2 * Math.PI * rng.float();
  return [Math.cos(a), Math.sin(a)];
}

export type GateKind =
  | "dense"
  | "real"
  | "diagonal"
  | "phase1"
  | "permutation"
  | "swap"
  | "controlled"
  | "twoBlock"
  | "identity";
export const GATE_KINDS: GateKind[] = [
  "dense",
  "real",
  "diagonal",
  "phase1",
  "permutation",
  "swap",
  "controlled",
  "twoBlock",
  "identity",
];

/** A random d×d matrix of the given structural kind (always unitary). */
export function randomMatrix(rng: Rng, d: number, kind: GateKind): Float64Array {
  const m = new Float64Array(2 * d * d);
  const set = (r: number, c: number, re: number, im: number): void => {
    m[2 * (r * d + c)] = re;
    m[2 * (r * d + c) + 1] = im;
  };
  switch (kind) {
    case "dense":
      return randomUnitary(rng, d);
    case "real": {
      // a product of real plane rotations (orthogonal)
      for (let i = 0; i < d; i++) set(i, i, 1, 0);
      let out = m;
      for (let s = 0; s < d; s++) {
        const a = rng.int(0, d - 1),
          b = rng.int(0, d - 1);
        if (a === b) continue;
        const t = 2 * Math.PI * rng.float();
        const rot = new Float64Array(2 * d * d);
        for (let i = 0; i < d; i++) rot[2 * (i * d + i)] = 1;
        rot[2 * (a * d + a)] = Math.cos(t);
        rot[2 * (b * d + b)] = Math.cos(t);
        rot[2 * (a * d + b)] = -Math.sin(t);
        rot[2 * (b * d + a)] = Math.sin(t);
        const next = new Float64Array(2 * d * d);
        for (let r = 0; r < d; r++)
          for (let c = 0; c < d; c++) {
            let s2 = 0;
            for (let j = 0; j < d; j++) s2 += rot[2 * (r * d + j)] * out[2 * (j * d + c)];
            next[2 * (r * d + c)] = s2;
          }
        out = next;
      }
      return out;
    }
    case "diagonal":
      for (let i = 0; i < d; i++) set(i, i, ...phase(rng));
      return m;
    case "phase1": {
      for (let i = 0; i < d; i++) set(i, i, 1, 0);
      set(d - 1, d - 1, ...phase(rng));
      return m;
    }
    case "permutation": {
      const perm = Array.from({ length: d }, (_, i) => i);
      for (let i = d - 1; i > 0; i--) {
        const j = rng.int(0, i);
        [perm[i], perm[j]] = [perm[j], perm[i]];
      }
      for (let r = 0; r < d; r++) set(r, perm[r], ...phase(rng));
      return m;
    }
    case "swap": {
      for (let i = 0; i < d; i++) set(i, i, 1, 0);
      const a = rng.int(0, d - 1);
      const b = (a + 1 + rng.int(0, d - 2)) % d;
      if (d === 1 || a === b) return m;
      set(a, a, 0, 0);
      set(b, b, 0, 0);
      set(a, b, 1, 0);
      set(b, a, 1, 0);
      return m;
    }
    case "controlled": {
      // identity except a random unitary block on the last two local states (control bits = 1)
      for (let i = 0; i < d - 2; i++) set(i, i, 1, 0);
      const u = randomUnitary(rng, 2);
      for (let r = 0; r < 2; r++)
        for (let c = 0; c < 2; c++)
          set(d - 2 + r, d - 2 + c, u[2 * (2 * r + c)], u[2 * (2 * r + c) + 1]);
      return m;
    }
    case "twoBlock": {
      // block-diagonal in the basis of one operand (the first, or for d = 4 either):
      // U = |0⟩⟨0| ⊗ A + |1⟩⟨1| ⊗ B with random unitaries A, B on the other operand(s)
      if (d === 2) return randomUnitary(rng, 2);
      const h = d / 2;
      const bit = d === 4 && rng.float() < 0.5 ? 1 : h; // local-index bit of the selector operand
      for (let sel = 0; sel < 2; sel++) {
        const u = randomUnitary(rng, h);
        const rows = Array.from({ length: d }, (_, i) => i).filter(
          (i) => ((i & bit) !== 0) === (sel === 1),
        );
        for (let r = 0; r < h; r++)
          for (let c = 0; c < h; c++)
            set(rows[r], rows[c], u[2 * (r * h + c)], u[2 * (r * h + c) + 1]);
      }
      return m;
    }
    case "identity":
      for (let i = 0; i < d; i++) set(i, i, 1, 0);
      return m;
  }
}

/** k distinct qubits of n, in random order. */
export function randomQubits(rng: Rng, n: number, k: number): number[] {
  const all = Array.from({ length: n }, (_, i) => i);
  for (let i = n - 1; i > 0; i--) {
    const j = rng.int(0, i);
    [all[i], all[j]] = [all[j], all[i]];
  }
  return all.slice(0, k);
}

export function randomGate(rng: Rng, n: number, maxK = 3): GateApplication {
  const k = rng.int(1, Math.min(maxK, n));
  const kind = GATE_KINDS[rng.int(0, GATE_KINDS.length - 1)];
  return { name: kind, qubits: randomQubits(rng, n, k), matrix: randomMatrix(rng, 1 << k, kind) };
}

/**
 * A random circuit: each top-level op acts on 1–3 qubits and has 1–2 parts on subsets of
 * them; with `nonUnitary`, some ops are measurements or resets.
 */
export function randomCircuit(rng: Rng, n: number, opCount: number, nonUnitary = false): Circuit {
  const ops: CircuitOp[] = [];
  for (let i = 0; i < opCount; i++) {
    const line = i + 1;
    const roll = rng.float();
    if (nonUnitary && roll < 0.12) {
      const q = rng.int(0, n - 1);
      ops.push({ kind: "measure", qubit: q, clbit: q, line });
      continue;
    }
    if (nonUnitary && roll < 0.2) {
      ops.push({ kind: "reset", qubit: rng.int(0, n - 1), line });
      continue;
    }
    if (roll > 0.95) {
      ops.push({ kind: "barrier", qubits: randomQubits(rng, n, rng.int(1, n)), line });
      continue;
    }
    const opQubits = randomQubits(rng, n, rng.int(1, Math.min(3, n)));
    const parts: GateApplication[] = [];
    const partCount = rng.int(1, 2);
    for (let p = 0; p < partCount; p++) {
      const sub = randomQubits(rng, opQubits.length, rng.int(1, opQubits.length)).map(
        (j) => opQubits[j],
      );
      const kind = GATE_KINDS[rng.int(0, GATE_KINDS.length - 1)];
      parts.push({ name: kind, qubits: sub, matrix: randomMatrix(rng, 1 << sub.length, kind) });
    }
    ops.push({ kind: "gate", name: `g${i}`, qubits: opQubits, params: [], parts, line });
  }
  return {
    numQubits: n,
    numClbits: n,
    ops,
    qubitLabels: Array.from({ length: n }, (_, i) => `q[${i}]`),
    hasMidCircuitMeasurement: false,
    hasReset: ops.some((o) => o.kind === "reset"),
  };
}

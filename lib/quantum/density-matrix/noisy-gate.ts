/**
 * A noisy gate in ONE pass over ρ: the superoperator of "unitary U, then the gate's noise"
 * restricted to the touched qubits, applied block by block.
 *
 * Storage as in state.ts (entry index (r << n) | c). For k ≤ 2 touched qubits, ρ splits into
 * 2^k × 2^k blocks B over their row and column bits (one block per pair of "rest" indices);
 * the channel maps every block on its own (U, depolarizing and damping act on the touched
 * qubits only), so each block is gathered, transformed and written back:
 *   1. B ← U B U† (U a permutation with phases: a gather; otherwise two small products);
 *   2. depolarizing of the 2^k-dim space (N&C §8.3.4): B ← (1−p) B + p·Tr(B)·I/2^k;
 *   3. per touched qubit j, amplitude damping γ_j (N&C §8.3.5) then phase damping λ_j
 *      (N&C §8.3.6): over that qubit's bit, B00 += γ B11, B11 *= 1−γ, B01, B10 *= √(1−γ)√(1−λ).
 * This is the same channel, in the same order, as the separate kernels of noise/channels.ts.
 * The parameters come with every application (GateNoise), so they may differ per gate and
 * per qubit. Gates on three or more qubits use the separate passes (kernels.ts, channels.ts).
 */
import type { GateNoise } from "../noise/gate-noise";
import type { DensityMatrix } from "../types";
import { classifyMatrix } from "../statevector/matrix-classify";
import { type SparseMap, blockKernel } from "./block-codegen";
import { noisy1qDense } from "./noisy-gate-1q";

export type { GateNoise };

/** Row and column index offsets of the 2^k local states (first operand = most significant). */
function offsets(
  n: number,
  qubits: readonly number[],
): { row: Int32Array; col: Int32Array; mask: number } {
  const k = qubits.length;
  const d = 1 << k;
  const row = new Int32Array(d);
  const col = new Int32Array(d);
  for (let s = 0; s < d; s++) {
    for (let j = 0; j < k; j++) {
      if ((s >> (k - 1 - j)) & 1) {
        col[s] |= 1 << qubits[j];
        row[s] |= 1 << (qubits[j] + n);
      }
    }
  }
  return { row, col, mask: row[d - 1] | col[d - 1] };
}

/**
 * ρ ← N(U ρ U†) on `qubits` (k = 1 or 2) in one pass; `matrix` null means no unitary
 * (noise only). Callers validated qubits and matrix shape.
 *
 * The block map is split as S = N ∘ P: P = U ⊗ conj(U) when U is a permutation with phases
 * (x, cx, swap, …; else the identity), folded with the channel N into one sparse complex
 * map (each output entry reads a few input entries); a dense U is applied as U B U† before
 * it. A dense 1-qubit U has its own straight-line kernel (the common case).
 */
export function applyNoisyGate(
  rho: DensityMatrix,
  qubits: readonly number[],
  matrix: Float64Array | null,
  noise: GateNoise,
): void {
  const k = qubits.length;
  if (k < 1 || k > 2) throw new RangeError(`applyNoisyGate handles 1- or 2-qubit gates (got ${k})`);
  const d = 1 << k;
  const shape = matrix ? classifyMatrix(matrix, d) : null;
  const identity = !matrix || shape?.active.length === 0;
  const dense = !identity && !shape?.permutation;
  if (k === 1 && dense && matrix) {
    noisy1qDense(rho, qubits[0], matrix, noise);
    return;
  }
  const { row, col, mask } = offsets(rho.n, qubits);
  const entries = d * d;
  const idx = new Int32Array(entries);
  for (let r = 0; r < d; r++) for (let c = 0; c < d; c++) idx[r * d + c] = row[r] | col[c];
  const sparse = sparseMap(
    entries,
    identity || dense ? null : prepareUnitary(matrix as Float64Array, d),
    prepareChannel(noise, k),
  );
  let ur: Float64Array | null = null;
  let ui: Float64Array | null = null;
  if (dense && matrix) {
    ur = new Float64Array(entries);
    ui = new Float64Array(entries);
    for (let e = 0; e < entries; e++) {
      ur[e] = matrix[2 * e];
      ui[e] = matrix[2 * e + 1];
    }
  }
  blockKernel(d, sparse, dense)(rho.re, rho.im, mask, rho.re.length / entries, idx, ur, ui);
}

/** The block map N ∘ P as rows of (source entry, complex weight), built from basis blocks. */
function sparseMap(
  entries: number,
  perm: BlockOp | null,
  chan: (br: Float64Array, bi: Float64Array) => void,
): SparseMap {
  const colsRe: Float64Array[] = [];
  const colsIm: Float64Array[] = [];
  const sr = new Float64Array(entries);
  const si = new Float64Array(entries);
  for (let f = 0; f < entries; f++) {
    const br = new Float64Array(entries);
    const bi = new Float64Array(entries);
    br[f] = 1;
    perm?.(br, bi, sr, si);
    chan(br, bi);
    colsRe.push(br);
    colsIm.push(bi);
  }
  const ptr = new Int32Array(entries + 1);
  const src: number[] = [];
  const wr: number[] = [];
  const wi: number[] = [];
  for (let e = 0; e < entries; e++) {
    for (let f = 0; f < entries; f++) {
      if (colsRe[f][e] !== 0 || colsIm[f][e] !== 0) {
        src.push(f);
        wr.push(colsRe[f][e]);
        wi.push(colsIm[f][e]);
      }
    }
    ptr[e + 1] = src.length;
  }
  return { ptr, src: Int32Array.from(src), wr: Float64Array.from(wr), wi: Float64Array.from(wi) };
}

type BlockOp = (br: Float64Array, bi: Float64Array, tr: Float64Array, ti: Float64Array) => void;

/** B ← U B U† on a d×d block for a permutation-type U (row-major, split re/im), tr/ti scratch. */
function prepareUnitary(m: Float64Array, d: number): BlockOp | null {
  const shape = classifyMatrix(m, d);
  if (shape.active.length === 0) return null; // identity
  const entries = d * d;
  if (shape.permutation) {
    // (U B U†)_{rc} = U_{r,π(r)} B_{π(r),π(c)} conj(U_{c,π(c)})
    const src = new Int32Array(entries);
    const pr = new Float64Array(entries);
    const pi = new Float64Array(entries);
    for (let r = 0; r < d; r++) {
      const sr = shape.source[r];
      const ur = m[2 * (r * d + sr)],
        ui = m[2 * (r * d + sr) + 1];
      for (let c = 0; c < d; c++) {
        const sc = shape.source[c];
        const vr = m[2 * (c * d + sc)],
          vi = -m[2 * (c * d + sc) + 1];
        src[r * d + c] = sr * d + sc;
        pr[r * d + c] = ur * vr - ui * vi;
        pi[r * d + c] = ur * vi + ui * vr;
      }
    }
    return (br, bi, tr, ti) => {
      tr.set(br);
      ti.set(bi);
      for (let e = 0; e < entries; e++) {
        const x = tr[src[e]],
          y = ti[src[e]];
        br[e] = pr[e] * x - pi[e] * y;
        bi[e] = pr[e] * y + pi[e] * x;
      }
    };
  }
  throw new RangeError("prepareUnitary expects a permutation-type matrix");
}

/** Depolarizing then damping per operand on one block (identity when every rate is 0). */
function prepareChannel(noise: GateNoise, k: number): (br: Float64Array, bi: Float64Array) => void {
  const d = 1 << k;
  const p = noise.p;
  const keep = 1 - p;
  const mix = p / d;
  const damps: { bit: number; gamma: number; pop: number; coh: number }[] = [];
  for (let j = 0; j < k; j++) {
    const gamma = noise.gamma[j] ?? 0;
    const lambda = noise.lambda[j] ?? 0;
    if (gamma === 0 && lambda === 0) continue;
    damps.push({
      bit: 1 << (k - 1 - j),
      gamma,
      pop: 1 - gamma,
      coh: Math.sqrt(1 - gamma) * Math.sqrt(1 - lambda),
    });
  }
  if (k === 1) {
    const dm = damps[0];
    const gamma = dm ? dm.gamma : 0,
      pop = dm ? dm.pop : 1,
      coh = (dm ? dm.coh : 1) * keep;
    return (br, bi) => {
      const tr = mix * (br[0] + br[3]),
        ti = mix * (bi[0] + bi[3]);
      const er = keep * br[3] + tr,
        ei = keep * bi[3] + ti;
      br[0] = keep * br[0] + tr + gamma * er;
      bi[0] = keep * bi[0] + ti + gamma * ei;
      br[3] = pop * er;
      bi[3] = pop * ei;
      br[1] *= coh;
      bi[1] *= coh;
      br[2] *= coh;
      bi[2] *= coh;
    };
  }
  return (br, bi) => {
    if (p !== 0) {
      let tr = 0,
        ti = 0;
      for (let s = 0; s < d; s++) {
        tr += br[s * d + s];
        ti += bi[s * d + s];
      }
      for (let e = 0; e < d * d; e++) {
        br[e] *= keep;
        bi[e] *= keep;
      }
      for (let s = 0; s < d; s++) {
        br[s * d + s] += mix * tr;
        bi[s * d + s] += mix * ti;
      }
    }
    for (const { bit, gamma, pop, coh } of damps) {
      for (let r = 0; r < d; r++) {
        for (let c = 0; c < d; c++) {
          const e = r * d + c;
          const rb = r & bit,
            cb = c & bit;
          if (rb === 0 && cb === 0) {
            const f = (r | bit) * d + (c | bit);
            br[e] += gamma * br[f];
            bi[e] += gamma * bi[f];
          } else if (rb !== 0 && cb !== 0) {
            br[e] *= pop;
            bi[e] *= pop;
          } else {
            br[e] *= coh;
            bi[e] *= coh;
          }
        }
      }
    }
  };
}

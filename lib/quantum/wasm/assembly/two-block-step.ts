// AssemblyScript (compiled by `npm run build:wasm`): one backward step of the adjoint sweep
// (gradient/sweep-step.ts) for a two-block 2-qubit gate U = |0⟩⟨0|_ctrl ⊗ A + |1⟩⟨1|_ctrl ⊗ B
// (here U = B† of a fused block), both index bits ≥ 1, λ and φ in one memory. Per pair
// (i, i + tgt) of each ctrl sector, from ONE load of both vectors:
//   φ ← U φ;  S_c[a][b] += conj(λ_a)·φ_b (a, b = tgt bit);  λ ← U λ (when asked),
// instead of two kernel passes and a cross-matrix pass. φ and λ get the two-block kernel's
// bits (the same expression per lane, kernels-two-block.ts); `out` receives S_0 then S_1,
// each 2 × 2 interleaved (re, im), row-major.

import { splatAt } from "./kernels-two-block";

// The sector pass for ctrl bit c: pairs (i, i + st) over every index with ctrl = c, tgt = 0.
@inline
function sector(
  lre: usize,
  lim: usize,
  pre: usize,
  pim: usize,
  total: usize,
  sc: usize,
  st: usize,
  c: usize,
  m: usize,
  out: usize,
  lambda: bool,
): void {
  const AR = splatAt(m, 0),
    AI = splatAt(m, 1),
    BR = splatAt(m, 2),
    BI = splatAt(m, 3),
    CR = splatAt(m, 4),
    CI = splatAt(m, 5),
    DR = splatAt(m, 6),
    DI = splatAt(m, 7);
  let s00r = f64x2.splat(0),
    s00i = f64x2.splat(0),
    s01r = f64x2.splat(0),
    s01i = f64x2.splat(0),
    s10r = f64x2.splat(0),
    s10i = f64x2.splat(0),
    s11r = f64x2.splat(0),
    s11i = f64x2.splat(0);
  // runs of lo bytes with both bits clear start at l; ctrl = c adds c·sc, tgt stays 0
  const lo = min(sc, st);
  const hi = max(sc, st);
  const cOff = c * sc;
  for (let h: usize = 0; h < total; h += hi << 1) {
    for (let l = h; l < h + hi; l += lo << 1) {
      const from = l + cOff;
      for (let i = from, e = from + lo; i < e; i += 16) {
        const x0 = v128.load(pre + i),
          y0 = v128.load(pim + i),
          x1 = v128.load(pre + i + st),
          y1 = v128.load(pim + i + st);
        const p0 = f64x2.sub(f64x2.add(f64x2.sub(f64x2.mul(AR, x0), f64x2.mul(AI, y0)), f64x2.mul(BR, x1)), f64x2.mul(BI, y1)),
          q0 = f64x2.add(f64x2.add(f64x2.add(f64x2.mul(AR, y0), f64x2.mul(AI, x0)), f64x2.mul(BR, y1)), f64x2.mul(BI, x1)),
          p1 = f64x2.sub(f64x2.add(f64x2.sub(f64x2.mul(CR, x0), f64x2.mul(CI, y0)), f64x2.mul(DR, x1)), f64x2.mul(DI, y1)),
          q1 = f64x2.add(f64x2.add(f64x2.add(f64x2.mul(CR, y0), f64x2.mul(CI, x0)), f64x2.mul(DR, y1)), f64x2.mul(DI, x1));
        v128.store(pre + i, p0);
        v128.store(pim + i, q0);
        v128.store(pre + i + st, p1);
        v128.store(pim + i + st, q1);
        const a0 = v128.load(lre + i),
          b0 = v128.load(lim + i),
          a1 = v128.load(lre + i + st),
          b1 = v128.load(lim + i + st);
        // conj(λ)·φ = (a·p + b·q) + i(a·q − b·p)
        s00r = f64x2.add(s00r, f64x2.add(f64x2.mul(a0, p0), f64x2.mul(b0, q0)));
        s00i = f64x2.add(s00i, f64x2.sub(f64x2.mul(a0, q0), f64x2.mul(b0, p0)));
        s01r = f64x2.add(s01r, f64x2.add(f64x2.mul(a0, p1), f64x2.mul(b0, q1)));
        s01i = f64x2.add(s01i, f64x2.sub(f64x2.mul(a0, q1), f64x2.mul(b0, p1)));
        s10r = f64x2.add(s10r, f64x2.add(f64x2.mul(a1, p0), f64x2.mul(b1, q0)));
        s10i = f64x2.add(s10i, f64x2.sub(f64x2.mul(a1, q0), f64x2.mul(b1, p0)));
        s11r = f64x2.add(s11r, f64x2.add(f64x2.mul(a1, p1), f64x2.mul(b1, q1)));
        s11i = f64x2.add(s11i, f64x2.sub(f64x2.mul(a1, q1), f64x2.mul(b1, p1)));
        if (lambda) {
          v128.store(lre + i, f64x2.sub(f64x2.add(f64x2.sub(f64x2.mul(AR, a0), f64x2.mul(AI, b0)), f64x2.mul(BR, a1)), f64x2.mul(BI, b1)));
          v128.store(lim + i, f64x2.add(f64x2.add(f64x2.add(f64x2.mul(AR, b0), f64x2.mul(AI, a0)), f64x2.mul(BR, b1)), f64x2.mul(BI, a1)));
          v128.store(lre + i + st, f64x2.sub(f64x2.add(f64x2.sub(f64x2.mul(CR, a0), f64x2.mul(CI, b0)), f64x2.mul(DR, a1)), f64x2.mul(DI, b1)));
          v128.store(lim + i + st, f64x2.add(f64x2.add(f64x2.add(f64x2.mul(CR, b0), f64x2.mul(CI, a0)), f64x2.mul(DR, b1)), f64x2.mul(DI, a1)));
        }
      }
    }
  }
  store<f64>(out, f64x2.extract_lane(s00r, 0) + f64x2.extract_lane(s00r, 1), 0);
  store<f64>(out, f64x2.extract_lane(s00i, 0) + f64x2.extract_lane(s00i, 1), 8);
  store<f64>(out, f64x2.extract_lane(s01r, 0) + f64x2.extract_lane(s01r, 1), 16);
  store<f64>(out, f64x2.extract_lane(s01i, 0) + f64x2.extract_lane(s01i, 1), 24);
  store<f64>(out, f64x2.extract_lane(s10r, 0) + f64x2.extract_lane(s10r, 1), 32);
  store<f64>(out, f64x2.extract_lane(s10i, 0) + f64x2.extract_lane(s10i, 1), 40);
  store<f64>(out, f64x2.extract_lane(s11r, 0) + f64x2.extract_lane(s11r, 1), 48);
  store<f64>(out, f64x2.extract_lane(s11i, 0) + f64x2.extract_lane(s11i, 1), 56);
}

/**
 * The step on index bits ctrl, tgt (both ≥ 1) of len amplitudes per vector; `m` holds A's 8
 * numbers then B's (interleaved 2 × 2), `out` 16 numbers (S_0, S_1). λ is left alone when
 * `lambda` is 0 (the sweep's first block).
 */
export function twoBlockStep(
  lre: usize,
  lim: usize,
  pre: usize,
  pim: usize,
  len: i32,
  ctrl: i32,
  tgt: i32,
  m: usize,
  out: usize,
  lambda: bool,
): void {
  const total = <usize>len << 3;
  const sc = (<usize>1 << ctrl) << 3,
    st = (<usize>1 << tgt) << 3;
  if (lambda) {
    sector(lre, lim, pre, pim, total, sc, st, 0, m, out, true);
    sector(lre, lim, pre, pim, total, sc, st, 1, m + 64, out + 64, true);
  } else {
    sector(lre, lim, pre, pim, total, sc, st, 0, m, out, false);
    sector(lre, lim, pre, pim, total, sc, st, 1, m + 64, out + 64, false);
  }
}

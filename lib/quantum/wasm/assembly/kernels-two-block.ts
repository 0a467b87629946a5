// AssemblyScript (compiled by `npm run build:wasm`): the two-block 2-qubit kernel
// U = |0⟩⟨0|_ctrl ⊗ A + |1⟩⟨1|_ctrl ⊗ B (a cx fused with 1-qubit gates on its target): one
// pass at the cost of a 1-qubit gate. `m` points at A's 8 numbers, then B's. Each lane
// evaluates the JavaScript kernel's expression (kernels-general.ts, applyTwoBlock) in its
// order: bit-identical results.

// Pairs (i, i + half) for the byte range [from, to): the 1-qubit kernel body, matrix
// [[a, b], [c, d]] as vectors (per lane, so lanes may hold different matrices).
@inline
function runPairs(
  re: usize,
  im: usize,
  from: usize,
  to: usize,
  half: usize,
  AR: v128,
  AI: v128,
  BR: v128,
  BI: v128,
  CR: v128,
  CI: v128,
  DR: v128,
  DI: v128,
): void {
  for (let i = from; i < to; i += 16) {
    const pi = re + i,
      qi = im + i,
      pj = pi + half,
      qj = qi + half;
    const x0 = v128.load(pi),
      y0 = v128.load(qi),
      x1 = v128.load(pj),
      y1 = v128.load(qj);
    v128.store(pi, f64x2.sub(f64x2.add(f64x2.sub(f64x2.mul(AR, x0), f64x2.mul(AI, y0)), f64x2.mul(BR, x1)), f64x2.mul(BI, y1)));
    v128.store(qi, f64x2.add(f64x2.add(f64x2.add(f64x2.mul(AR, y0), f64x2.mul(AI, x0)), f64x2.mul(BR, y1)), f64x2.mul(BI, x1)));
    v128.store(pj, f64x2.sub(f64x2.add(f64x2.sub(f64x2.mul(CR, x0), f64x2.mul(CI, y0)), f64x2.mul(DR, x1)), f64x2.mul(DI, y1)));
    v128.store(qj, f64x2.add(f64x2.add(f64x2.add(f64x2.mul(CR, y0), f64x2.mul(CI, x0)), f64x2.mul(DR, y1)), f64x2.mul(DI, x1)));
  }
}

// Pairs inside each vector (target bit 0) over the byte range [from, to); lane constants
// (a, c), (ai, ci), (b, d), (bi, di) as in the 1-qubit kernel.
@inline
function runInVector(re: usize, im: usize, from: usize, to: usize, AC: v128, AICI: v128, BD: v128, BIDI: v128): void {
  for (let i = from; i < to; i += 16) {
    const p = re + i,
      r = im + i;
    const v = v128.load(p),
      w = v128.load(r);
    const x0 = v128.shuffle<f64>(v, v, 0, 0),
      x1 = v128.shuffle<f64>(v, v, 1, 1);
    const y0 = v128.shuffle<f64>(w, w, 0, 0),
      y1 = v128.shuffle<f64>(w, w, 1, 1);
    v128.store(p, f64x2.sub(f64x2.add(f64x2.sub(f64x2.mul(AC, x0), f64x2.mul(AICI, y0)), f64x2.mul(BD, x1)), f64x2.mul(BIDI, y1)));
    v128.store(r, f64x2.add(f64x2.add(f64x2.add(f64x2.mul(AC, y0), f64x2.mul(AICI, x0)), f64x2.mul(BD, y1)), f64x2.mul(BIDI, x1)));
  }
}

/** Entry j of the f64 array at m in both lanes. */
@inline
export function splatAt(m: usize, j: i32): v128 {
  return f64x2.splat(load<f64>(m + (<usize>j << 3)));
}

@inline
function laneAt(m: usize, j0: i32, j1: i32): v128 {
  return f64x2(load<f64>(m + (<usize>j0 << 3)), load<f64>(m + (<usize>j1 << 3)));
}

export function twoBlock(re: usize, im: usize, len: i32, ctrl: i32, tgt: i32, m: usize): void {
  const total = <usize>len << 3;
  const sc = (<usize>1 << ctrl) << 3,
    st = (<usize>1 << tgt) << 3;
  if (ctrl == 0) {
    // lane 0 has ctrl = 0 (matrix A), lane 1 ctrl = 1 (matrix B)
    const AR = laneAt(m, 0, 8),
      AI = laneAt(m, 1, 9),
      BR = laneAt(m, 2, 10),
      BI = laneAt(m, 3, 11);
    const CR = laneAt(m, 4, 12),
      CI = laneAt(m, 5, 13),
      DR = laneAt(m, 6, 14),
      DI = laneAt(m, 7, 15);
    for (let blk: usize = 0; blk < total; blk += st << 1) runPairs(re, im, blk, blk + st, st, AR, AI, BR, BI, CR, CI, DR, DI);
    return;
  }
  if (tgt == 0) {
    const a0 = laneAt(m, 0, 4),
      a1 = laneAt(m, 1, 5),
      a2 = laneAt(m, 2, 6),
      a3 = laneAt(m, 3, 7);
    const b0 = laneAt(m, 8, 12),
      b1 = laneAt(m, 9, 13),
      b2 = laneAt(m, 10, 14),
      b3 = laneAt(m, 11, 15);
    for (let c0: usize = 0; c0 < total; c0 += sc << 1) {
      runInVector(re, im, c0, c0 + sc, a0, a1, a2, a3);
      runInVector(re, im, c0 + sc, c0 + (sc << 1), b0, b1, b2, b3);
    }
    return;
  }
  const AR = splatAt(m, 0),
    AI = splatAt(m, 1),
    BR = splatAt(m, 2),
    BI = splatAt(m, 3);
  const CR = splatAt(m, 4),
    CI = splatAt(m, 5),
    DR = splatAt(m, 6),
    DI = splatAt(m, 7);
  const ER = splatAt(m, 8),
    EI = splatAt(m, 9),
    FR = splatAt(m, 10),
    FI = splatAt(m, 11);
  const GR = splatAt(m, 12),
    GI = splatAt(m, 13),
    HR = splatAt(m, 14),
    HI = splatAt(m, 15);
  if (ctrl > tgt) {
    for (let c0: usize = 0; c0 < total; c0 += sc << 1) {
      for (let blk = c0, e = c0 + sc; blk < e; blk += st << 1) {
        runPairs(re, im, blk, blk + st, st, AR, AI, BR, BI, CR, CI, DR, DI);
        runPairs(re, im, blk + sc, blk + sc + st, st, ER, EI, FR, FI, GR, GI, HR, HI);
      }
    }
    return;
  }
  for (let blk: usize = 0; blk < total; blk += st << 1) {
    for (let r = blk, e = blk + st; r < e; r += sc << 1) {
      runPairs(re, im, r, r + sc, st, AR, AI, BR, BI, CR, CI, DR, DI);
      runPairs(re, im, r + sc, r + (sc << 1), st, ER, EI, FR, FI, GR, GI, HR, HI);
    }
  }
}

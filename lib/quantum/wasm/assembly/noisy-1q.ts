// AssemblyScript (compiled by `npm run build:wasm`): a noisy 1-qubit gate on a density matrix
// in one pass (density-matrix/noisy-gate-1q.ts has the semantics and the JavaScript kernel).
// ρ's entry (r, c) sits at index (r << n) | c; per 2×2 block [[x0, x1], [x2, x3]] over qubit
// q (column bit q, row bit q + n): B ← U B U†, depolarizing, amplitude and phase damping.
// Lanes hold two blocks whose indices differ in bit 0 (q ≥ 1), each lane evaluating the
// JavaScript expression in its order: bit-identical results. `m` holds U (8 numbers,
// interleaved) then keep, mix, γ, pop, coh.

import { splatAt } from "./kernels-two-block";

// the channel after B' = U B U† (y0 … y3), stored at the four members
@inline
function finish(
  re: usize,
  im: usize,
  b: usize,
  c1: usize,
  r1: usize,
  y0r: v128,
  y0i: v128,
  y1r: v128,
  y1i: v128,
  y2r: v128,
  y2i: v128,
  y3r: v128,
  y3i: v128,
  keep: v128,
  mix: v128,
  gamma: v128,
  pop: v128,
  coh: v128,
): void {
  const mr = f64x2.mul(mix, f64x2.add(y0r, y3r)),
    mi = f64x2.mul(mix, f64x2.add(y0i, y3i));
  const e3r = f64x2.add(f64x2.mul(keep, y3r), mr),
    e3i = f64x2.add(f64x2.mul(keep, y3i), mi);
  v128.store(re + b, f64x2.add(f64x2.add(f64x2.mul(keep, y0r), mr), f64x2.mul(gamma, e3r)));
  v128.store(im + b, f64x2.add(f64x2.add(f64x2.mul(keep, y0i), mi), f64x2.mul(gamma, e3i)));
  v128.store(re + (b | c1 | r1), f64x2.mul(pop, e3r));
  v128.store(im + (b | c1 | r1), f64x2.mul(pop, e3i));
  v128.store(re + (b | c1), f64x2.mul(coh, y1r));
  v128.store(im + (b | c1), f64x2.mul(coh, y1i));
  v128.store(re + (b | r1), f64x2.mul(coh, y2r));
  v128.store(im + (b | r1), f64x2.mul(coh, y2i));
}

// a + b + c + d as the JavaScript kernel adds them: ((a + b) + c) + d
@inline
function sum4(a: v128, b: v128, c: v128, d: v128): v128 {
  return f64x2.add(f64x2.add(f64x2.add(a, b), c), d);
}

@inline
function blockDense(re: usize, im: usize, b: usize, c1: usize, r1: usize, m: usize): void {
  const ar = splatAt(m, 0),
    ai = splatAt(m, 1),
    br = splatAt(m, 2),
    bi = splatAt(m, 3),
    cr = splatAt(m, 4),
    ci = splatAt(m, 5),
    er = splatAt(m, 6),
    ei = splatAt(m, 7);
  const x0r = v128.load(re + b),
    x0i = v128.load(im + b),
    x1r = v128.load(re + (b | c1)),
    x1i = v128.load(im + (b | c1)),
    x2r = v128.load(re + (b | r1)),
    x2i = v128.load(im + (b | r1)),
    x3r = v128.load(re + (b | c1 | r1)),
    x3i = v128.load(im + (b | c1 | r1));
  // T = U B: t = u0·x − u0i·xi + u1·y − u1i·yi (re), u0·xi + u0i·x + u1·yi + u1i·y (im)
  const t0r = f64x2.sub(f64x2.add(f64x2.sub(f64x2.mul(ar, x0r), f64x2.mul(ai, x0i)), f64x2.mul(br, x2r)), f64x2.mul(bi, x2i));
  const t0i = sum4(f64x2.mul(ar, x0i), f64x2.mul(ai, x0r), f64x2.mul(br, x2i), f64x2.mul(bi, x2r));
  const t1r = f64x2.sub(f64x2.add(f64x2.sub(f64x2.mul(ar, x1r), f64x2.mul(ai, x1i)), f64x2.mul(br, x3r)), f64x2.mul(bi, x3i));
  const t1i = sum4(f64x2.mul(ar, x1i), f64x2.mul(ai, x1r), f64x2.mul(br, x3i), f64x2.mul(bi, x3r));
  const t2r = f64x2.sub(f64x2.add(f64x2.sub(f64x2.mul(cr, x0r), f64x2.mul(ci, x0i)), f64x2.mul(er, x2r)), f64x2.mul(ei, x2i));
  const t2i = sum4(f64x2.mul(cr, x0i), f64x2.mul(ci, x0r), f64x2.mul(er, x2i), f64x2.mul(ei, x2r));
  const t3r = f64x2.sub(f64x2.add(f64x2.sub(f64x2.mul(cr, x1r), f64x2.mul(ci, x1i)), f64x2.mul(er, x3r)), f64x2.mul(ei, x3i));
  const t3i = sum4(f64x2.mul(cr, x1i), f64x2.mul(ci, x1r), f64x2.mul(er, x3i), f64x2.mul(ei, x3r));
  // B' = T U†: re = t·u + ti·ui + s·v + si·vi, im = ti·u − t·ui + si·v − s·vi
  const y0r = sum4(f64x2.mul(t0r, ar), f64x2.mul(t0i, ai), f64x2.mul(t1r, br), f64x2.mul(t1i, bi));
  const y0i = f64x2.sub(f64x2.add(f64x2.sub(f64x2.mul(t0i, ar), f64x2.mul(t0r, ai)), f64x2.mul(t1i, br)), f64x2.mul(t1r, bi));
  const y1r = sum4(f64x2.mul(t0r, cr), f64x2.mul(t0i, ci), f64x2.mul(t1r, er), f64x2.mul(t1i, ei));
  const y1i = f64x2.sub(f64x2.add(f64x2.sub(f64x2.mul(t0i, cr), f64x2.mul(t0r, ci)), f64x2.mul(t1i, er)), f64x2.mul(t1r, ei));
  const y2r = sum4(f64x2.mul(t2r, ar), f64x2.mul(t2i, ai), f64x2.mul(t3r, br), f64x2.mul(t3i, bi));
  const y2i = f64x2.sub(f64x2.add(f64x2.sub(f64x2.mul(t2i, ar), f64x2.mul(t2r, ai)), f64x2.mul(t3i, br)), f64x2.mul(t3r, bi));
  const y3r = sum4(f64x2.mul(t2r, cr), f64x2.mul(t2i, ci), f64x2.mul(t3r, er), f64x2.mul(t3i, ei));
  const y3i = f64x2.sub(f64x2.add(f64x2.sub(f64x2.mul(t2i, cr), f64x2.mul(t2r, ci)), f64x2.mul(t3i, er)), f64x2.mul(t3r, ei));
  finish(re, im, b, c1, r1, y0r, y0i, y1r, y1i, y2r, y2i, y3r, y3i, splatAt(m, 8), splatAt(m, 9), splatAt(m, 10), splatAt(m, 11), splatAt(m, 12));
}

@inline
function blockReal(re: usize, im: usize, b: usize, c1: usize, r1: usize, m: usize): void {
  const ar = splatAt(m, 0),
    br = splatAt(m, 2),
    cr = splatAt(m, 4),
    er = splatAt(m, 6);
  const x0r = v128.load(re + b),
    x0i = v128.load(im + b),
    x1r = v128.load(re + (b | c1)),
    x1i = v128.load(im + (b | c1)),
    x2r = v128.load(re + (b | r1)),
    x2i = v128.load(im + (b | r1)),
    x3r = v128.load(re + (b | c1 | r1)),
    x3i = v128.load(im + (b | c1 | r1));
  const t0r = f64x2.add(f64x2.mul(ar, x0r), f64x2.mul(br, x2r)),
    t0i = f64x2.add(f64x2.mul(ar, x0i), f64x2.mul(br, x2i));
  const t1r = f64x2.add(f64x2.mul(ar, x1r), f64x2.mul(br, x3r)),
    t1i = f64x2.add(f64x2.mul(ar, x1i), f64x2.mul(br, x3i));
  const t2r = f64x2.add(f64x2.mul(cr, x0r), f64x2.mul(er, x2r)),
    t2i = f64x2.add(f64x2.mul(cr, x0i), f64x2.mul(er, x2i));
  const t3r = f64x2.add(f64x2.mul(cr, x1r), f64x2.mul(er, x3r)),
    t3i = f64x2.add(f64x2.mul(cr, x1i), f64x2.mul(er, x3i));
  const y0r = f64x2.add(f64x2.mul(t0r, ar), f64x2.mul(t1r, br)),
    y0i = f64x2.add(f64x2.mul(t0i, ar), f64x2.mul(t1i, br));
  const y1r = f64x2.add(f64x2.mul(t0r, cr), f64x2.mul(t1r, er)),
    y1i = f64x2.add(f64x2.mul(t0i, cr), f64x2.mul(t1i, er));
  const y2r = f64x2.add(f64x2.mul(t2r, ar), f64x2.mul(t3r, br)),
    y2i = f64x2.add(f64x2.mul(t2i, ar), f64x2.mul(t3i, br));
  const y3r = f64x2.add(f64x2.mul(t2r, cr), f64x2.mul(t3r, er)),
    y3i = f64x2.add(f64x2.mul(t2i, cr), f64x2.mul(t3i, er));
  finish(re, im, b, c1, r1, y0r, y0i, y1r, y1i, y2r, y2i, y3r, y3i, splatAt(m, 8), splatAt(m, 9), splatAt(m, 10), splatAt(m, 11), splatAt(m, 12));
}

// every block: b over the indices with bits lo and hi clear, two lanes at a time
@inline
function blocks(re: usize, im: usize, total: usize, c1: usize, r1: usize, m: usize, real: bool): void {
  for (let i0: usize = 0; i0 < total; i0 += r1 << 1) {
    for (let i1 = i0, e1 = i0 + r1; i1 < e1; i1 += c1 << 1) {
      for (let b = i1, e = i1 + c1; b < e; b += 16) {
        if (real) blockReal(re, im, b, c1, r1, m);
        else blockDense(re, im, b, c1, r1, m);
      }
    }
  }
}

/**
 * The noisy gate on qubit q ≥ 1 of an n-qubit ρ, or of a slice of it (`len` entries per array,
 * whole blocks); `real`: U is real.
 */
export function noisy1q(re: usize, im: usize, len: i32, n: i32, q: i32, m: usize, real: bool): void {
  const total = <usize>len << 3;
  const c1 = (<usize>1 << q) << 3,
    r1 = (<usize>1 << (q + n)) << 3;
  if (real) blocks(re, im, total, c1, r1, m, true);
  else blocks(re, im, total, c1, r1, m, false);
}

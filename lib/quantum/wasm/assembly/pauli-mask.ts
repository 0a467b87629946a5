// AssemblyScript (compiled by `npm run build:wasm`): one pass over a statevector for Pauli
// terms sharing the flip mask x (the math is in observable/pauli-mask-pass.ts).
//
// The state is read in aligned groups of eight amplitudes b = p … p+7 (four vectors of two
// lanes) with partners c = b ⊕ x: the high bits of x move the group, bits 1–2 permute its
// vectors and bit 0 swaps the lanes inside them. The sign (−1)^{|b & z|} of lane j is the
// parity of p & z (one i32.popcnt per group and term) times that of j & z (a per-term lane
// pattern), applied by flipping sign bits. With `run` = 2^h ≥ 8 and `stride` = 2^(h+1)
// only the half b with bit h (the highest bit of x) clear is visited; with run = stride =
// len every b is (x < 8; the host doubles or not accordingly). Each kernel returns or writes
// Σ_b s_z(b)·Re f(b) (Im f when the term has an odd number of Y factors), f(b) = conj(ψ_c) ψ_b.

import { addSigned, groupSum, laneTotal, partner, pattern, product, storePatterns } from "./pauli-lanes";

/** Σ_b s_z(b)·|ψ_b|² over all b (diagonal terms, x = 0). */
export function pauliDiagonal(re: usize, im: usize, len: i32, z: i32): f64 {
  const total = <usize>len << 3;
  const p0 = pattern(z, 0),
    p1 = pattern(z, 1),
    p2 = pattern(z, 2),
    p3 = pattern(z, 3);
  let acc = f64x2.splat(0);
  for (let b: usize = 0; b < total; b += 64) {
    const r0 = v128.load(re + b),
      r1 = v128.load(re + b, 16),
      r2 = v128.load(re + b, 32),
      r3 = v128.load(re + b, 48);
    const i0 = v128.load(im + b),
      i1 = v128.load(im + b, 16),
      i2 = v128.load(im + b, 32),
      i3 = v128.load(im + b, 48);
    const f0 = v128.xor(f64x2.add(f64x2.mul(r0, r0), f64x2.mul(i0, i0)), p0),
      f1 = v128.xor(f64x2.add(f64x2.mul(r1, r1), f64x2.mul(i1, i1)), p1),
      f2 = v128.xor(f64x2.add(f64x2.mul(r2, r2), f64x2.mul(i2, i2)), p2),
      f3 = v128.xor(f64x2.add(f64x2.mul(r3, r3), f64x2.mul(i3, i3)), p3);
    acc = addSigned(acc, f64x2.add(f64x2.add(f0, f1), f64x2.add(f2, f3)), <i32>(b >> 3), z);
  }
  return laneTotal(acc);
}

// One term, its swap (bit 0 of x) and odd (Y count) fixed: the loop nest shared by the four
// specialisations of pauliTerm.
@inline
function termLoop(
  re: usize,
  im: usize,
  total: usize,
  runB: usize,
  strideB: usize,
  xHigh: usize,
  v: usize,
  z: i32,
  swap: bool,
  odd: bool,
): f64 {
  const c0 = v << 4,
    c1 = (v ^ 1) << 4,
    c2 = (v ^ 2) << 4,
    c3 = (v ^ 3) << 4;
  const p0 = pattern(z, 0),
    p1 = pattern(z, 1),
    p2 = pattern(z, 2),
    p3 = pattern(z, 3);
  let acc = f64x2.splat(0);
  for (let o: usize = 0; o < total; o += strideB) {
    for (let b = o, e = o + runB; b < e; b += 64) {
      const c = b ^ xHigh;
      const h0 = product(partner(re + c + c0, swap), partner(im + c + c0, swap), v128.load(re + b), v128.load(im + b), odd),
        h1 = product(partner(re + c + c1, swap), partner(im + c + c1, swap), v128.load(re + b, 16), v128.load(im + b, 16), odd),
        h2 = product(partner(re + c + c2, swap), partner(im + c + c2, swap), v128.load(re + b, 32), v128.load(im + b, 32), odd),
        h3 = product(partner(re + c + c3, swap), partner(im + c + c3, swap), v128.load(re + b, 48), v128.load(im + b, 48), odd);
      const sum = f64x2.add(
        f64x2.add(v128.xor(h0, p0), v128.xor(h1, p1)),
        f64x2.add(v128.xor(h2, p2), v128.xor(h3, p3)),
      );
      acc = addSigned(acc, sum, <i32>(b >> 3), z);
    }
  }
  return laneTotal(acc);
}

/**
 * One term with flip mask x ≠ 0 and Z mask z: Σ over the visited b of s_z(b)·(Re or Im) f(b).
 * The loop is specialised on bit 0 of x and on odd, so neither is tested per group.
 */
export function pauliTerm(
  re: usize,
  im: usize,
  x: i32,
  run: i32,
  stride: i32,
  len: i32,
  z: i32,
  odd: bool,
): f64 {
  const total = <usize>len << 3;
  const runB = <usize>run << 3,
    strideB = <usize>stride << 3;
  const xHigh = <usize>(x & ~7) << 3;
  const v = <usize>((x >> 1) & 3);
  if (x & 1) {
    return odd
      ? termLoop(re, im, total, runB, strideB, xHigh, v, z, true, true)
      : termLoop(re, im, total, runB, strideB, xHigh, v, z, true, false);
  }
  return odd
    ? termLoop(re, im, total, runB, strideB, xHigh, v, z, false, true)
    : termLoop(re, im, total, runB, strideB, xHigh, v, z, false, false);
}

/**
 * Four terms sharing the flip mask x (any x, 0 included): `table` holds four (i32 z, i32 odd)
 * pairs followed by 256 bytes the kernel fills with their lane patterns; sums go to out[0..3].
 */
export function pauliTerms4(
  re: usize,
  im: usize,
  x: i32,
  run: i32,
  stride: i32,
  len: i32,
  table: usize,
  out: usize,
): void {
  const total = <usize>len << 3;
  const runB = <usize>run << 3,
    strideB = <usize>stride << 3;
  const xHigh = <usize>(x & ~7) << 3;
  const v = (x >> 1) & 3;
  const c0 = <usize>v << 4,
    c1 = <usize>(v ^ 1) << 4,
    c2 = <usize>(v ^ 2) << 4,
    c3 = <usize>(v ^ 3) << 4;
  const swap = (x & 1) != 0;
  const za = load<i32>(table, 0),
    zb = load<i32>(table, 8),
    zc = load<i32>(table, 16),
    zd = load<i32>(table, 24);
  const oa = load<i32>(table, 4) != 0,
    ob = load<i32>(table, 12) != 0,
    oc = load<i32>(table, 20) != 0,
    od = load<i32>(table, 28) != 0;
  const pat = table + 64;
  for (let t = 0; t < 4; t++) storePatterns(pat + (<usize>t << 6), load<i32>(table + (<usize>t << 3)));
  let aa = f64x2.splat(0),
    ab = f64x2.splat(0),
    ac = f64x2.splat(0),
    ad = f64x2.splat(0);
  for (let o: usize = 0; o < total; o += strideB) {
    for (let b = o, e = o + runB; b < e; b += 64) {
      const c = b ^ xHigh;
      const br0 = v128.load(re + b),
        br1 = v128.load(re + b, 16),
        br2 = v128.load(re + b, 32),
        br3 = v128.load(re + b, 48);
      const bi0 = v128.load(im + b),
        bi1 = v128.load(im + b, 16),
        bi2 = v128.load(im + b, 32),
        bi3 = v128.load(im + b, 48);
      const cr0 = partner(re + c + c0, swap),
        cr1 = partner(re + c + c1, swap),
        cr2 = partner(re + c + c2, swap),
        cr3 = partner(re + c + c3, swap);
      const ci0 = partner(im + c + c0, swap),
        ci1 = partner(im + c + c1, swap),
        ci2 = partner(im + c + c2, swap),
        ci3 = partner(im + c + c3, swap);
      const f0 = product(cr0, ci0, br0, bi0, false),
        f1 = product(cr1, ci1, br1, bi1, false),
        f2 = product(cr2, ci2, br2, bi2, false),
        f3 = product(cr3, ci3, br3, bi3, false);
      const g0 = product(cr0, ci0, br0, bi0, true),
        g1 = product(cr1, ci1, br1, bi1, true),
        g2 = product(cr2, ci2, br2, bi2, true),
        g3 = product(cr3, ci3, br3, bi3, true);
      const p = <i32>(b >> 3);
      aa = addSigned(aa, oa ? groupSum(g0, g1, g2, g3, pat) : groupSum(f0, f1, f2, f3, pat), p, za);
      ab = addSigned(ab, ob ? groupSum(g0, g1, g2, g3, pat + 64) : groupSum(f0, f1, f2, f3, pat + 64), p, zb);
      ac = addSigned(ac, oc ? groupSum(g0, g1, g2, g3, pat + 128) : groupSum(f0, f1, f2, f3, pat + 128), p, zc);
      ad = addSigned(ad, od ? groupSum(g0, g1, g2, g3, pat + 192) : groupSum(f0, f1, f2, f3, pat + 192), p, zd);
    }
  }
  store<f64>(out, laneTotal(aa), 0);
  store<f64>(out, laneTotal(ab), 8);
  store<f64>(out, laneTotal(ac), 16);
  store<f64>(out, laneTotal(ad), 24);
}

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

@inline
function signBit(v: i32): i64 {
  return <i64>(popcnt<i32>(v) & 1) << 63;
}

// lane pattern of vector v (lanes 2v, 2v+1 of the group) for the Z mask z
@inline
function pattern(z: i32, v: i32): v128 {
  return i64x2(signBit((2 * v) & z), signBit((2 * v + 1) & z));
}

@inline
function swapLanes(a: v128): v128 {
  return v128.shuffle<f64>(a, a, 1, 0);
}

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
    const s = i64x2.splat(signBit(<i32>(b >> 3) & z));
    acc = f64x2.add(acc, v128.xor(f64x2.add(f64x2.add(f0, f1), f64x2.add(f2, f3)), s));
  }
  return f64x2.extract_lane(acc, 0) + f64x2.extract_lane(acc, 1);
}

// Sign table of the low `bits` index bits for Z mask z: entry e (16 bytes) holds the lane
// sign bits of amplitudes 2e and 2e + 1, so the entry of amplitude b sits at byte
// (b & (2^bits − 1))·8 — the byte offset of b within its block of 2^bits amplitudes.
function fillSigns(tbl: usize, bits: i32, z: i32): void {
  const entries = 1 << (bits - 1);
  for (let e = 0; e < entries; e++) {
    v128.store(tbl + (<usize>e << 4), i64x2(signBit((2 * e) & z), signBit((2 * e + 1) & z)));
  }
}

/**
 * One term with flip mask x ≠ 0 and Z mask z; `tbl` is room for the sign table (8 KiB).
 * Blocks of 2^bits amplitudes (bits = min(log2 len, 10)) take their low signs from the table
 * and one parity for their high bits.
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
  tbl: usize,
): f64 {
  const bits = min(10, 31 - clz<i32>(len));
  fillSigns(tbl, bits, z);
  const blockB = <usize>8 << bits,
    lowB = blockB - 1;
  const total = <usize>len << 3;
  const h = 31 - clz<i32>(x);
  // runs of the visited half inside a block (h < bits), else whole blocks
  const inner = h < bits && run < len;
  const runB = inner ? <usize>run << 3 : blockB,
    strideB = inner ? <usize>stride << 3 : blockB;
  const skipBit = !inner && run < len ? <usize>run << 3 : 0; // blocks with bit h set are skipped
  const zHigh = z >> bits;
  const xHigh = <usize>(x & ~7) << 3;
  const v = (x >> 1) & 3;
  const c0 = <usize>v << 4,
    c1 = <usize>(v ^ 1) << 4,
    c2 = <usize>(v ^ 2) << 4,
    c3 = <usize>(v ^ 3) << 4;
  const swap = (x & 1) != 0;
  let acc = f64x2.splat(0);
  for (let blk: usize = 0; blk < total; blk += blockB) {
    if (blk & skipBit) continue;
    let part = f64x2.splat(0);
    for (let r0 = blk, re0 = blk + blockB; r0 < re0; r0 += strideB) {
      for (let b = r0, e = r0 + runB; b < e; b += 64) {
        const cb = b ^ xHigh;
        const t = tbl + (b & lowB);
        const br0 = v128.load(re + b),
          br1 = v128.load(re + b, 16),
          br2 = v128.load(re + b, 32),
          br3 = v128.load(re + b, 48);
        const bi0 = v128.load(im + b),
          bi1 = v128.load(im + b, 16),
          bi2 = v128.load(im + b, 32),
          bi3 = v128.load(im + b, 48);
        let cr0 = v128.load(re + cb + c0),
          cr1 = v128.load(re + cb + c1),
          cr2 = v128.load(re + cb + c2),
          cr3 = v128.load(re + cb + c3);
        let ci0 = v128.load(im + cb + c0),
          ci1 = v128.load(im + cb + c1),
          ci2 = v128.load(im + cb + c2),
          ci3 = v128.load(im + cb + c3);
        if (swap) {
          cr0 = swapLanes(cr0);
          cr1 = swapLanes(cr1);
          cr2 = swapLanes(cr2);
          cr3 = swapLanes(cr3);
          ci0 = swapLanes(ci0);
          ci1 = swapLanes(ci1);
          ci2 = swapLanes(ci2);
          ci3 = swapLanes(ci3);
        }
        let f0: v128, f1: v128, f2: v128, f3: v128;
        if (odd) {
          f0 = f64x2.sub(f64x2.mul(cr0, bi0), f64x2.mul(ci0, br0));
          f1 = f64x2.sub(f64x2.mul(cr1, bi1), f64x2.mul(ci1, br1));
          f2 = f64x2.sub(f64x2.mul(cr2, bi2), f64x2.mul(ci2, br2));
          f3 = f64x2.sub(f64x2.mul(cr3, bi3), f64x2.mul(ci3, br3));
        } else {
          f0 = f64x2.add(f64x2.mul(cr0, br0), f64x2.mul(ci0, bi0));
          f1 = f64x2.add(f64x2.mul(cr1, br1), f64x2.mul(ci1, bi1));
          f2 = f64x2.add(f64x2.mul(cr2, br2), f64x2.mul(ci2, bi2));
          f3 = f64x2.add(f64x2.mul(cr3, br3), f64x2.mul(ci3, bi3));
        }
        part = f64x2.add(
          part,
          f64x2.add(
            f64x2.add(v128.xor(f0, v128.load(t, 0)), v128.xor(f1, v128.load(t, 16))),
            f64x2.add(v128.xor(f2, v128.load(t, 32)), v128.xor(f3, v128.load(t, 48))),
          ),
        );
      }
    }
    acc = f64x2.add(acc, v128.xor(part, i64x2.splat(signBit(<i32>(blk >> (bits + 3)) & zHigh))));
  }
  return f64x2.extract_lane(acc, 0) + f64x2.extract_lane(acc, 1);
}

// Σ over the four vectors of the term's lane-signed f (f = Re parts, g = Im parts);
// the term's lane patterns are at pat … pat+63.
@inline
function termSum(
  f0: v128,
  f1: v128,
  f2: v128,
  f3: v128,
  g0: v128,
  g1: v128,
  g2: v128,
  g3: v128,
  odd: bool,
  pat: usize,
): v128 {
  const h0 = odd ? g0 : f0,
    h1 = odd ? g1 : f1,
    h2 = odd ? g2 : f2,
    h3 = odd ? g3 : f3;
  return f64x2.add(
    f64x2.add(v128.xor(h0, v128.load(pat, 0)), v128.xor(h1, v128.load(pat, 16))),
    f64x2.add(v128.xor(h2, v128.load(pat, 32)), v128.xor(h3, v128.load(pat, 48))),
  );
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
  for (let t = 0; t < 4; t++) {
    const z = load<i32>(table + (<usize>t << 3));
    for (let v = 0; v < 4; v++) v128.store(pat + (<usize>t << 6) + (<usize>v << 4), pattern(z, v));
  }
  let aa = f64x2.splat(0),
    ab = f64x2.splat(0),
    ac = f64x2.splat(0),
    ad = f64x2.splat(0);
  for (let o: usize = 0; o < total; o += strideB) {
    for (let b = o, e = o + runB; b < e; b += 64) {
      const cb = b ^ xHigh;
      const br0 = v128.load(re + b),
        br1 = v128.load(re + b, 16),
        br2 = v128.load(re + b, 32),
        br3 = v128.load(re + b, 48);
      const bi0 = v128.load(im + b),
        bi1 = v128.load(im + b, 16),
        bi2 = v128.load(im + b, 32),
        bi3 = v128.load(im + b, 48);
      let cr0 = v128.load(re + cb + c0),
        cr1 = v128.load(re + cb + c1),
        cr2 = v128.load(re + cb + c2),
        cr3 = v128.load(re + cb + c3);
      let ci0 = v128.load(im + cb + c0),
        ci1 = v128.load(im + cb + c1),
        ci2 = v128.load(im + cb + c2),
        ci3 = v128.load(im + cb + c3);
      if (swap) {
        cr0 = swapLanes(cr0);
        cr1 = swapLanes(cr1);
        cr2 = swapLanes(cr2);
        cr3 = swapLanes(cr3);
        ci0 = swapLanes(ci0);
        ci1 = swapLanes(ci1);
        ci2 = swapLanes(ci2);
        ci3 = swapLanes(ci3);
      }
      const f0 = f64x2.add(f64x2.mul(cr0, br0), f64x2.mul(ci0, bi0)),
        f1 = f64x2.add(f64x2.mul(cr1, br1), f64x2.mul(ci1, bi1)),
        f2 = f64x2.add(f64x2.mul(cr2, br2), f64x2.mul(ci2, bi2)),
        f3 = f64x2.add(f64x2.mul(cr3, br3), f64x2.mul(ci3, bi3));
      const g0 = f64x2.sub(f64x2.mul(cr0, bi0), f64x2.mul(ci0, br0)),
        g1 = f64x2.sub(f64x2.mul(cr1, bi1), f64x2.mul(ci1, br1)),
        g2 = f64x2.sub(f64x2.mul(cr2, bi2), f64x2.mul(ci2, br2)),
        g3 = f64x2.sub(f64x2.mul(cr3, bi3), f64x2.mul(ci3, br3));
      const p = <i32>(b >> 3);
      aa = f64x2.add(aa, v128.xor(termSum(f0, f1, f2, f3, g0, g1, g2, g3, oa, pat + 0), i64x2.splat(signBit(p & za))));
      ab = f64x2.add(ab, v128.xor(termSum(f0, f1, f2, f3, g0, g1, g2, g3, ob, pat + 64), i64x2.splat(signBit(p & zb))));
      ac = f64x2.add(ac, v128.xor(termSum(f0, f1, f2, f3, g0, g1, g2, g3, oc, pat + 128), i64x2.splat(signBit(p & zc))));
      ad = f64x2.add(ad, v128.xor(termSum(f0, f1, f2, f3, g0, g1, g2, g3, od, pat + 192), i64x2.splat(signBit(p & zd))));
    }
  }
  store<f64>(out, f64x2.extract_lane(aa, 0) + f64x2.extract_lane(aa, 1), 0);
  store<f64>(out, f64x2.extract_lane(ab, 0) + f64x2.extract_lane(ab, 1), 8);
  store<f64>(out, f64x2.extract_lane(ac, 0) + f64x2.extract_lane(ac, 1), 16);
  store<f64>(out, f64x2.extract_lane(ad, 0) + f64x2.extract_lane(ad, 1), 24);
}

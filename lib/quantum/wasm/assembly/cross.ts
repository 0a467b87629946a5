// AssemblyScript (compiled by `npm run build:wasm`): the local cross matrix of two vectors in
// one memory (gradient/local-cross.ts): R[a][b] = Σ_r conj(λ[r ⊕ a]) · φ[r ⊕ b] over the
// groups r with every target bit clear; a, b local indices (first operand = most significant
// bit). A read-only pass over both vectors; `out` receives the 2^k × 2^k matrix interleaved
// (re, im), row-major; `acc` is 32 × 16 bytes of scratch for the vector sums. The 2-qubit
// pass sums only the entries whose bit is set in `needed` (the others are left 0).

@inline
function accumulate(acc: usize, e: i32, lr: v128, li: v128, pr: v128, pi: v128): void {
  const at = acc + (<usize>e << 5);
  // conj(λ)·φ = (lr·pr + li·pi) + i(lr·pi − li·pr)
  v128.store(at, f64x2.add(v128.load(at), f64x2.add(f64x2.mul(lr, pr), f64x2.mul(li, pi))));
  v128.store(at, f64x2.add(v128.load(at, 16), f64x2.sub(f64x2.mul(lr, pi), f64x2.mul(li, pr))), 16);
}

@inline
function finish(acc: usize, out: usize, entries: i32): void {
  for (let e = 0; e < entries; e++) {
    const at = acc + (<usize>e << 5);
    const re = v128.load(at),
      im = v128.load(at, 16);
    store<f64>(out + (<usize>e << 4), f64x2.extract_lane(re, 0) + f64x2.extract_lane(re, 1));
    store<f64>(out + (<usize>e << 4), f64x2.extract_lane(im, 0) + f64x2.extract_lane(im, 1), 8);
  }
}

@inline
function put(out: usize, e: i32, re: v128, im: v128): void {
  store<f64>(out + (<usize>e << 4), f64x2.extract_lane(re, 0) + f64x2.extract_lane(re, 1));
  store<f64>(out + (<usize>e << 4), f64x2.extract_lane(im, 0) + f64x2.extract_lane(im, 1), 8);
}

@inline
function clear(acc: usize, entries: i32): void {
  for (let e = 0; e < entries << 1; e++) v128.store(acc + (<usize>e << 4), f64x2.splat(0));
}

/** 1-qubit cross matrix on index bit q (len amplitudes per vector). */
export function cross1q(lre: usize, lim: usize, pre: usize, pim: usize, len: i32, q: i32, out: usize, acc: usize): void {
  clear(acc, 4);
  const total = <usize>len << 3;
  const o = (<usize>1 << q) << 3;
  if (q >= 1) {
    for (let blk: usize = 0; blk < total; blk += o << 1) {
      for (let b = blk, end = blk + o; b < end; b += 16) {
        const l0r = v128.load(lre + b), l0i = v128.load(lim + b);
        const l1r = v128.load(lre + b + o), l1i = v128.load(lim + b + o);
        const p0r = v128.load(pre + b), p0i = v128.load(pim + b);
        const p1r = v128.load(pre + b + o), p1i = v128.load(pim + b + o);
        accumulate(acc, 0, l0r, l0i, p0r, p0i);
        accumulate(acc, 1, l0r, l0i, p1r, p1i);
        accumulate(acc, 2, l1r, l1i, p0r, p0i);
        accumulate(acc, 3, l1r, l1i, p1r, p1i);
      }
    }
  } else {
    // q = 0: a vector holds a pair (lane 0: local 0, lane 1: local 1)
    for (let b: usize = 0; b < total; b += 16) {
      const lr = v128.load(lre + b), li = v128.load(lim + b);
      const pr = v128.load(pre + b), pi = v128.load(pim + b);
      const l0r = v128.shuffle<f64>(lr, lr, 0, 0), l0i = v128.shuffle<f64>(li, li, 0, 0);
      const l1r = v128.shuffle<f64>(lr, lr, 1, 1), l1i = v128.shuffle<f64>(li, li, 1, 1);
      // lanes of φ: (local 0, local 1) → entries (a, 0) in lane 0 and (a, 1) in lane 1
      accumulate(acc, 0, l0r, l0i, pr, pi);
      accumulate(acc, 1, l1r, l1i, pr, pi);
    }
    // acc entry 0 = (R00 in lane 0, R01 in lane 1), entry 1 = (R10, R11)
    const e0r = v128.load(acc), e0i = v128.load(acc, 16);
    const e1r = v128.load(acc, 32), e1i = v128.load(acc, 48);
    store<f64>(out, f64x2.extract_lane(e0r, 0));
    store<f64>(out, f64x2.extract_lane(e0i, 0), 8);
    store<f64>(out, f64x2.extract_lane(e0r, 1), 16);
    store<f64>(out, f64x2.extract_lane(e0i, 1), 24);
    store<f64>(out, f64x2.extract_lane(e1r, 0), 32);
    store<f64>(out, f64x2.extract_lane(e1i, 0), 40);
    store<f64>(out, f64x2.extract_lane(e1r, 1), 48);
    store<f64>(out, f64x2.extract_lane(e1i, 1), 56);
    return;
  }
  finish(acc, out, 4);
}

/** 2-qubit cross matrix on index bits first, second (local index 2·b_first + b_second). */
export function cross2q(lre: usize, lim: usize, pre: usize, pim: usize, len: i32, first: i32, second: i32, needed: i32, out: usize, acc: usize): void {
  const lo = min(first, second),
    hi = max(first, second);
  const total = <usize>len << 3;
  const o1 = (<usize>1 << second) << 3,
    o2 = (<usize>1 << first) << 3,
    o3 = o1 | o2;
  const sLo = (<usize>1 << lo) << 3,
    sHi = (<usize>1 << hi) << 3;
  if (lo >= 1) {
    // the sums live in locals (the engine keeps what it can in registers)
    let s0r = f64x2.splat(0), s0i = f64x2.splat(0);
    let s1r = f64x2.splat(0), s1i = f64x2.splat(0);
    let s2r = f64x2.splat(0), s2i = f64x2.splat(0);
    let s3r = f64x2.splat(0), s3i = f64x2.splat(0);
    let s4r = f64x2.splat(0), s4i = f64x2.splat(0);
    let s5r = f64x2.splat(0), s5i = f64x2.splat(0);
    let s6r = f64x2.splat(0), s6i = f64x2.splat(0);
    let s7r = f64x2.splat(0), s7i = f64x2.splat(0);
    let s8r = f64x2.splat(0), s8i = f64x2.splat(0);
    let s9r = f64x2.splat(0), s9i = f64x2.splat(0);
    let s10r = f64x2.splat(0), s10i = f64x2.splat(0);
    let s11r = f64x2.splat(0), s11i = f64x2.splat(0);
    let s12r = f64x2.splat(0), s12i = f64x2.splat(0);
    let s13r = f64x2.splat(0), s13i = f64x2.splat(0);
    let s14r = f64x2.splat(0), s14i = f64x2.splat(0);
    let s15r = f64x2.splat(0), s15i = f64x2.splat(0);
    for (let i0: usize = 0; i0 < total; i0 += sHi << 1) {
      for (let i1 = i0, e1 = i0 + sHi; i1 < e1; i1 += sLo << 1) {
        for (let b = i1, e = i1 + sLo; b < e; b += 16) {
          const l0r = v128.load(lre + b), l0i = v128.load(lim + b);
          const l1r = v128.load(lre + (b | o1)), l1i = v128.load(lim + (b | o1));
          const l2r = v128.load(lre + (b | o2)), l2i = v128.load(lim + (b | o2));
          const l3r = v128.load(lre + (b | o3)), l3i = v128.load(lim + (b | o3));
          const p0r = v128.load(pre + b), p0i = v128.load(pim + b);
          const p1r = v128.load(pre + (b | o1)), p1i = v128.load(pim + (b | o1));
          const p2r = v128.load(pre + (b | o2)), p2i = v128.load(pim + (b | o2));
          const p3r = v128.load(pre + (b | o3)), p3i = v128.load(pim + (b | o3));
          if (needed & 1) {
            s0r = f64x2.add(s0r, f64x2.add(f64x2.mul(l0r, p0r), f64x2.mul(l0i, p0i)));
            s0i = f64x2.add(s0i, f64x2.sub(f64x2.mul(l0r, p0i), f64x2.mul(l0i, p0r)));
          }
          if (needed & 2) {
            s1r = f64x2.add(s1r, f64x2.add(f64x2.mul(l0r, p1r), f64x2.mul(l0i, p1i)));
            s1i = f64x2.add(s1i, f64x2.sub(f64x2.mul(l0r, p1i), f64x2.mul(l0i, p1r)));
          }
          if (needed & 4) {
            s2r = f64x2.add(s2r, f64x2.add(f64x2.mul(l0r, p2r), f64x2.mul(l0i, p2i)));
            s2i = f64x2.add(s2i, f64x2.sub(f64x2.mul(l0r, p2i), f64x2.mul(l0i, p2r)));
          }
          if (needed & 8) {
            s3r = f64x2.add(s3r, f64x2.add(f64x2.mul(l0r, p3r), f64x2.mul(l0i, p3i)));
            s3i = f64x2.add(s3i, f64x2.sub(f64x2.mul(l0r, p3i), f64x2.mul(l0i, p3r)));
          }
          if (needed & 16) {
            s4r = f64x2.add(s4r, f64x2.add(f64x2.mul(l1r, p0r), f64x2.mul(l1i, p0i)));
            s4i = f64x2.add(s4i, f64x2.sub(f64x2.mul(l1r, p0i), f64x2.mul(l1i, p0r)));
          }
          if (needed & 32) {
            s5r = f64x2.add(s5r, f64x2.add(f64x2.mul(l1r, p1r), f64x2.mul(l1i, p1i)));
            s5i = f64x2.add(s5i, f64x2.sub(f64x2.mul(l1r, p1i), f64x2.mul(l1i, p1r)));
          }
          if (needed & 64) {
            s6r = f64x2.add(s6r, f64x2.add(f64x2.mul(l1r, p2r), f64x2.mul(l1i, p2i)));
            s6i = f64x2.add(s6i, f64x2.sub(f64x2.mul(l1r, p2i), f64x2.mul(l1i, p2r)));
          }
          if (needed & 128) {
            s7r = f64x2.add(s7r, f64x2.add(f64x2.mul(l1r, p3r), f64x2.mul(l1i, p3i)));
            s7i = f64x2.add(s7i, f64x2.sub(f64x2.mul(l1r, p3i), f64x2.mul(l1i, p3r)));
          }
          if (needed & 256) {
            s8r = f64x2.add(s8r, f64x2.add(f64x2.mul(l2r, p0r), f64x2.mul(l2i, p0i)));
            s8i = f64x2.add(s8i, f64x2.sub(f64x2.mul(l2r, p0i), f64x2.mul(l2i, p0r)));
          }
          if (needed & 512) {
            s9r = f64x2.add(s9r, f64x2.add(f64x2.mul(l2r, p1r), f64x2.mul(l2i, p1i)));
            s9i = f64x2.add(s9i, f64x2.sub(f64x2.mul(l2r, p1i), f64x2.mul(l2i, p1r)));
          }
          if (needed & 1024) {
            s10r = f64x2.add(s10r, f64x2.add(f64x2.mul(l2r, p2r), f64x2.mul(l2i, p2i)));
            s10i = f64x2.add(s10i, f64x2.sub(f64x2.mul(l2r, p2i), f64x2.mul(l2i, p2r)));
          }
          if (needed & 2048) {
            s11r = f64x2.add(s11r, f64x2.add(f64x2.mul(l2r, p3r), f64x2.mul(l2i, p3i)));
            s11i = f64x2.add(s11i, f64x2.sub(f64x2.mul(l2r, p3i), f64x2.mul(l2i, p3r)));
          }
          if (needed & 4096) {
            s12r = f64x2.add(s12r, f64x2.add(f64x2.mul(l3r, p0r), f64x2.mul(l3i, p0i)));
            s12i = f64x2.add(s12i, f64x2.sub(f64x2.mul(l3r, p0i), f64x2.mul(l3i, p0r)));
          }
          if (needed & 8192) {
            s13r = f64x2.add(s13r, f64x2.add(f64x2.mul(l3r, p1r), f64x2.mul(l3i, p1i)));
            s13i = f64x2.add(s13i, f64x2.sub(f64x2.mul(l3r, p1i), f64x2.mul(l3i, p1r)));
          }
          if (needed & 16384) {
            s14r = f64x2.add(s14r, f64x2.add(f64x2.mul(l3r, p2r), f64x2.mul(l3i, p2i)));
            s14i = f64x2.add(s14i, f64x2.sub(f64x2.mul(l3r, p2i), f64x2.mul(l3i, p2r)));
          }
          if (needed & 32768) {
            s15r = f64x2.add(s15r, f64x2.add(f64x2.mul(l3r, p3r), f64x2.mul(l3i, p3i)));
            s15i = f64x2.add(s15i, f64x2.sub(f64x2.mul(l3r, p3i), f64x2.mul(l3i, p3r)));
          }
        }
      }
    }
    put(out, 0, s0r, s0i);
    put(out, 1, s1r, s1i);
    put(out, 2, s2r, s2i);
    put(out, 3, s3r, s3i);
    put(out, 4, s4r, s4i);
    put(out, 5, s5r, s5i);
    put(out, 6, s6r, s6i);
    put(out, 7, s7r, s7i);
    put(out, 8, s8r, s8i);
    put(out, 9, s9r, s9i);
    put(out, 10, s10r, s10i);
    put(out, 11, s11r, s11i);
    put(out, 12, s12r, s12i);
    put(out, 13, s13r, s13i);
    put(out, 14, s14r, s14i);
    put(out, 15, s15r, s15i);
    return;
  }
  // one operand is bit 0: a vector holds the pair (bit 0 clear, set) of one group; products
  // of equal lanes give the entries with equal bit 0, products with φ's lanes swapped the others
  cross2qBit0(lre, lim, pre, pim, total, (<usize>1 << hi) << 3, first == 0, needed, out);
}

// Local index (first operand = most significant bit) of the amplitude with high bit h and bit 0 = j.
@inline
function local0(h: i32, j: i32, firstIsBit0: bool): i32 {
  return firstIsBit0 ? 2 * j + h : 2 * h + j;
}

// Writes the lane sums of one (λ half hA, φ half hC) product: lane j of `same` is entry
// (hA j, hC j), lane j of `swapped` entry (hA j, hC 1−j); entries outside `needed` stay 0.
@inline
function putPair(out: usize, hA: i32, hC: i32, sr: v128, si: v128, xr: v128, xi: v128, firstIsBit0: bool, needed: i32): void {
  for (let j = 0; j < 2; j++) {
    const a = local0(hA, j, firstIsBit0);
    const e1 = 4 * a + local0(hC, j, firstIsBit0);
    const e2 = 4 * a + local0(hC, 1 - j, firstIsBit0);
    if ((needed >> e1) & 1) {
      store<f64>(out + (<usize>e1 << 4), j == 0 ? f64x2.extract_lane(sr, 0) : f64x2.extract_lane(sr, 1));
      store<f64>(out + (<usize>e1 << 4), j == 0 ? f64x2.extract_lane(si, 0) : f64x2.extract_lane(si, 1), 8);
    }
    if ((needed >> e2) & 1) {
      store<f64>(out + (<usize>e2 << 4), j == 0 ? f64x2.extract_lane(xr, 0) : f64x2.extract_lane(xr, 1));
      store<f64>(out + (<usize>e2 << 4), j == 0 ? f64x2.extract_lane(xi, 0) : f64x2.extract_lane(xi, 1), 8);
    }
  }
}

// conj(l)·p lane-wise, added to (accR, accI)
@inline
function macR(acc: v128, lr: v128, li: v128, pr: v128, pi: v128): v128 {
  return f64x2.add(acc, f64x2.add(f64x2.mul(lr, pr), f64x2.mul(li, pi)));
}
@inline
function macI(acc: v128, lr: v128, li: v128, pr: v128, pi: v128): v128 {
  return f64x2.add(acc, f64x2.sub(f64x2.mul(lr, pi), f64x2.mul(li, pr)));
}

/** cross2q with one operand on bit 0; `o` = byte offset of the other operand's bit. */
function cross2qBit0(lre: usize, lim: usize, pre: usize, pim: usize, total: usize, o: usize, firstIsBit0: bool, needed: i32, out: usize): void {
  for (let e = 0; e < 32; e++) store<f64>(out + (<usize>e << 3), 0);
  let s00r = f64x2.splat(0), s00i = f64x2.splat(0), x00r = f64x2.splat(0), x00i = f64x2.splat(0);
  let s01r = f64x2.splat(0), s01i = f64x2.splat(0), x01r = f64x2.splat(0), x01i = f64x2.splat(0);
  let s10r = f64x2.splat(0), s10i = f64x2.splat(0), x10r = f64x2.splat(0), x10i = f64x2.splat(0);
  let s11r = f64x2.splat(0), s11i = f64x2.splat(0), x11r = f64x2.splat(0), x11i = f64x2.splat(0);
  for (let blk: usize = 0; blk < total; blk += o << 1) {
    for (let b = blk, e = blk + o; b < e; b += 16) {
      const l0r = v128.load(lre + b), l0i = v128.load(lim + b);
      const l1r = v128.load(lre + b + o), l1i = v128.load(lim + b + o);
      const p0r = v128.load(pre + b), p0i = v128.load(pim + b);
      const p1r = v128.load(pre + b + o), p1i = v128.load(pim + b + o);
      const q0r = v128.shuffle<f64>(p0r, p0r, 1, 0), q0i = v128.shuffle<f64>(p0i, p0i, 1, 0);
      const q1r = v128.shuffle<f64>(p1r, p1r, 1, 0), q1i = v128.shuffle<f64>(p1i, p1i, 1, 0);
      s00r = macR(s00r, l0r, l0i, p0r, p0i); s00i = macI(s00i, l0r, l0i, p0r, p0i);
      x00r = macR(x00r, l0r, l0i, q0r, q0i); x00i = macI(x00i, l0r, l0i, q0r, q0i);
      s01r = macR(s01r, l0r, l0i, p1r, p1i); s01i = macI(s01i, l0r, l0i, p1r, p1i);
      x01r = macR(x01r, l0r, l0i, q1r, q1i); x01i = macI(x01i, l0r, l0i, q1r, q1i);
      s10r = macR(s10r, l1r, l1i, p0r, p0i); s10i = macI(s10i, l1r, l1i, p0r, p0i);
      x10r = macR(x10r, l1r, l1i, q0r, q0i); x10i = macI(x10i, l1r, l1i, q0r, q0i);
      s11r = macR(s11r, l1r, l1i, p1r, p1i); s11i = macI(s11i, l1r, l1i, p1r, p1i);
      x11r = macR(x11r, l1r, l1i, q1r, q1i); x11i = macI(x11i, l1r, l1i, q1r, q1i);
    }
  }
  putPair(out, 0, 0, s00r, s00i, x00r, x00i, firstIsBit0, needed);
  putPair(out, 0, 1, s01r, s01i, x01r, x01i, firstIsBit0, needed);
  putPair(out, 1, 0, s10r, s10i, x10r, x10i, firstIsBit0, needed);
  putPair(out, 1, 1, s11r, s11i, x11r, x11i, firstIsBit0, needed);
}

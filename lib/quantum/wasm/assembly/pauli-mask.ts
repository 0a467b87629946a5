// AssemblyScript (compiled by `npm run build:wasm`): one pass over a statevector for every
// Pauli term sharing the flip mask x (the math is in observable/pauli-mask-pass.ts).
//
// The state is read in aligned groups of four amplitudes b = p … p+3 with partners
// c = b ⊕ x (the low two bits of x permute lanes: a swap of the two vectors and/or of the
// lanes inside them). The sign (−1)^{|b & z|} of lane j factors as the parity of p & z
// (one i32.popcnt per group and term) times that of j & z (a per-term lane pattern), applied
// by flipping sign bits. With `run` = 2^h and `stride` = 2^(h+1) only the half b with bit h
// (the highest bit of x) clear is visited; with run = stride = len every b is (x < 4).
//
// Term table (48 bytes per term): i32 z, i32 odd (number of Y factors is odd: accumulate
// Im f instead of Re f), then two v128 sign patterns for lanes (0, 1) and (2, 3).
// Output: out[t] (f64) = Σ_b s_z(b)·Re f(b) (or Im f) over the visited b, f(b) = conj(ψ_c) ψ_b.

@inline
function groupSign(p: usize, z: i32): v128 {
  return i64x2.splat(<i64>(popcnt<i32>(<i32>p & z) & 1) << 63);
}

export function pauliMask(
  re: usize,
  im: usize,
  x: i32,
  run: i32,
  stride: i32,
  len: i32,
  g: i32,
  terms: usize,
  acc: usize,
  out: usize,
): void {
  const total = <usize>len << 3;
  const runB = <usize>run << 3,
    strideB = <usize>stride << 3;
  const xHigh = <usize>(x & ~3) << 3;
  const offA = <usize>(x & 2) << 3,
    offB = offA ^ 16;
  const swz =
    x & 1 ? i8x16(8, 9, 10, 11, 12, 13, 14, 15, 0, 1, 2, 3, 4, 5, 6, 7) : i8x16(0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15);
  if (g == 1) {
    const z = load<i32>(terms, 0),
      odd = load<i32>(terms, 4) != 0;
    const patA = v128.load(terms, 16),
      patB = v128.load(terms, 32);
    let sA = f64x2.splat(0),
      sB = f64x2.splat(0);
    for (let o: usize = 0; o < total; o += strideB) {
      for (let b = o, e = o + runB; b < e; b += 32) {
        const cb = b ^ xHigh;
        const bra = v128.load(re + b),
          brb = v128.load(re + b, 16),
          bia = v128.load(im + b),
          bib = v128.load(im + b, 16);
        const cra = i8x16.swizzle(v128.load(re + cb + offA), swz),
          crb = i8x16.swizzle(v128.load(re + cb + offB), swz),
          cia = i8x16.swizzle(v128.load(im + cb + offA), swz),
          cib = i8x16.swizzle(v128.load(im + cb + offB), swz);
        let fa: v128, fb: v128;
        if (odd) {
          fa = f64x2.sub(f64x2.mul(cra, bia), f64x2.mul(cia, bra));
          fb = f64x2.sub(f64x2.mul(crb, bib), f64x2.mul(cib, brb));
        } else {
          fa = f64x2.add(f64x2.mul(cra, bra), f64x2.mul(cia, bia));
          fb = f64x2.add(f64x2.mul(crb, brb), f64x2.mul(cib, bib));
        }
        const s = groupSign(b >> 3, z);
        sA = f64x2.add(sA, v128.xor(fa, v128.xor(patA, s)));
        sB = f64x2.add(sB, v128.xor(fb, v128.xor(patB, s)));
      }
    }
    const sum = f64x2.add(sA, sB);
    store<f64>(out, f64x2.extract_lane(sum, 0) + f64x2.extract_lane(sum, 1));
    return;
  }
  let needRe = false,
    needIm = false;
  for (let t = 0; t < g; t++) {
    const ta = acc + (<usize>t << 5);
    v128.store(ta, f64x2.splat(0));
    v128.store(ta, f64x2.splat(0), 16);
    if (load<i32>(terms + <usize>t * 48, 4) != 0) needIm = true;
    else needRe = true;
  }
  const zero = f64x2.splat(0);
  for (let o: usize = 0; o < total; o += strideB) {
    for (let b = o, e = o + runB; b < e; b += 32) {
      const cb = b ^ xHigh;
      const bra = v128.load(re + b),
        brb = v128.load(re + b, 16),
        bia = v128.load(im + b),
        bib = v128.load(im + b, 16);
      const cra = i8x16.swizzle(v128.load(re + cb + offA), swz),
        crb = i8x16.swizzle(v128.load(re + cb + offB), swz),
        cia = i8x16.swizzle(v128.load(im + cb + offA), swz),
        cib = i8x16.swizzle(v128.load(im + cb + offB), swz);
      const ra = needRe ? f64x2.add(f64x2.mul(cra, bra), f64x2.mul(cia, bia)) : zero,
        rb = needRe ? f64x2.add(f64x2.mul(crb, brb), f64x2.mul(cib, bib)) : zero;
      const ia = needIm ? f64x2.sub(f64x2.mul(cra, bia), f64x2.mul(cia, bra)) : zero,
        ib = needIm ? f64x2.sub(f64x2.mul(crb, bib), f64x2.mul(cib, brb)) : zero;
      const p = <i32>(b >> 3);
      for (let t = 0; t < g; t++) {
        const tt = terms + <usize>t * 48,
          ta = acc + (<usize>t << 5);
        const z = load<i32>(tt, 0);
        const s = i64x2.splat(<i64>(popcnt<i32>(p & z) & 1) << 63);
        const odd = load<i32>(tt, 4) != 0;
        v128.store(ta, f64x2.add(v128.load(ta), v128.xor(odd ? ia : ra, v128.xor(v128.load(tt, 16), s))));
        v128.store(ta, f64x2.add(v128.load(ta, 16), v128.xor(odd ? ib : rb, v128.xor(v128.load(tt, 32), s))), 16);
      }
    }
  }
  for (let t = 0; t < g; t++) {
    const ta = acc + (<usize>t << 5);
    const sum = f64x2.add(v128.load(ta), v128.load(ta, 16));
    store<f64>(out + (<usize>t << 3), f64x2.extract_lane(sum, 0) + f64x2.extract_lane(sum, 1));
  }
}

// AssemblyScript (compiled by `npm run build:wasm`): the dense 2-qubit kernel. `first` and
// `second` are the index bits of the gate's operands (local index = 2·b_first + b_second);
// `m` points at the interleaved 4×4 matrix, followed by 512 bytes of room for the kernel's
// table of vector coefficients. Every lane evaluates the expression of the JavaScript kernel
// (statevector/kernels-general.ts, applyGeneral2q) in the same order: bit-identical results.

// Output row as (Σ_c m_rc ψ_c): coefficients t[0..7] = (re, im) of m_r0 … m_r3 as vectors.
@inline
function rowRe(t: usize, x0: v128, y0: v128, x1: v128, y1: v128, x2: v128, y2: v128, x3: v128, y3: v128): v128 {
  let s = f64x2.mul(v128.load(t, 0), x0);
  s = f64x2.sub(s, f64x2.mul(v128.load(t, 16), y0));
  s = f64x2.add(s, f64x2.mul(v128.load(t, 32), x1));
  s = f64x2.sub(s, f64x2.mul(v128.load(t, 48), y1));
  s = f64x2.add(s, f64x2.mul(v128.load(t, 64), x2));
  s = f64x2.sub(s, f64x2.mul(v128.load(t, 80), y2));
  s = f64x2.add(s, f64x2.mul(v128.load(t, 96), x3));
  return f64x2.sub(s, f64x2.mul(v128.load(t, 112), y3));
}

@inline
function rowIm(t: usize, x0: v128, y0: v128, x1: v128, y1: v128, x2: v128, y2: v128, x3: v128, y3: v128): v128 {
  let s = f64x2.mul(v128.load(t, 0), y0);
  s = f64x2.add(s, f64x2.mul(v128.load(t, 16), x0));
  s = f64x2.add(s, f64x2.mul(v128.load(t, 32), y1));
  s = f64x2.add(s, f64x2.mul(v128.load(t, 48), x1));
  s = f64x2.add(s, f64x2.mul(v128.load(t, 64), y2));
  s = f64x2.add(s, f64x2.mul(v128.load(t, 80), x2));
  s = f64x2.add(s, f64x2.mul(v128.load(t, 96), y3));
  return f64x2.add(s, f64x2.mul(v128.load(t, 112), x3));
}

export function general2q(re: usize, im: usize, len: i32, first: i32, second: i32, m: usize): void {
  const t = m + 256;
  const lo = min(first, second),
    hi = max(first, second);
  const total = <usize>len << 3;
  if (lo >= 1) {
    // two neighbouring base indices per vector: every coefficient splatted
    for (let j = 0; j < 32; j++) v128.store(t + (<usize>j << 4), f64x2.splat(load<f64>(m + (<usize>j << 3))));
    const o1 = (<usize>1 << second) << 3,
      o2 = (<usize>1 << first) << 3,
      o3 = o1 | o2;
    const sLo = (<usize>1 << lo) << 3,
      sHi = (<usize>1 << hi) << 3;
    for (let i0: usize = 0; i0 < total; i0 += sHi << 1) {
      for (let i1 = i0, e1 = i0 + sHi; i1 < e1; i1 += sLo << 1) {
        for (let b = i1, e = i1 + sLo; b < e; b += 16) {
          const x0 = v128.load(re + b),
            y0 = v128.load(im + b),
            x1 = v128.load(re + (b | o1)),
            y1 = v128.load(im + (b | o1));
          const x2 = v128.load(re + (b | o2)),
            y2 = v128.load(im + (b | o2)),
            x3 = v128.load(re + (b | o3)),
            y3 = v128.load(im + (b | o3));
          v128.store(re + b, rowRe(t, x0, y0, x1, y1, x2, y2, x3, y3));
          v128.store(im + b, rowIm(t, x0, y0, x1, y1, x2, y2, x3, y3));
          v128.store(re + (b | o1), rowRe(t + 128, x0, y0, x1, y1, x2, y2, x3, y3));
          v128.store(im + (b | o1), rowIm(t + 128, x0, y0, x1, y1, x2, y2, x3, y3));
          v128.store(re + (b | o2), rowRe(t + 256, x0, y0, x1, y1, x2, y2, x3, y3));
          v128.store(im + (b | o2), rowIm(t + 256, x0, y0, x1, y1, x2, y2, x3, y3));
          v128.store(re + (b | o3), rowRe(t + 384, x0, y0, x1, y1, x2, y2, x3, y3));
          v128.store(im + (b | o3), rowIm(t + 384, x0, y0, x1, y1, x2, y2, x3, y3));
        }
      }
    }
    return;
  }
  // One operand is bit 0: vector A = (ψ_b, ψ_b+1), B = the same at b + 2^hi. Local indices
  // in A's lanes: (0, 1) when the second operand is bit 0, (0, 2) when the first one is.
  const secondLow = second == 0;
  const rA1 = secondLow ? 1 : 2,
    rB0 = secondLow ? 2 : 1;
  for (let c = 0; c < 8; c++) {
    v128.store(t + (<usize>c << 4), f64x2(load<f64>(m + (<usize>c << 3)), load<f64>(m + (<usize>(8 * rA1 + c) << 3))));
    v128.store(t + 128 + (<usize>c << 4), f64x2(load<f64>(m + (<usize>(8 * rB0 + c) << 3)), load<f64>(m + (<usize>(24 + c) << 3))));
  }
  const sHi = (<usize>1 << hi) << 3;
  for (let i0: usize = 0; i0 < total; i0 += sHi << 1) {
    for (let b = i0, e = i0 + sHi; b < e; b += 16) {
      const A = v128.load(re + b),
        AI = v128.load(im + b),
        B = v128.load(re + b + sHi),
        BI = v128.load(im + b + sHi);
      const a0 = v128.shuffle<f64>(A, A, 0, 0),
        a1 = v128.shuffle<f64>(A, A, 1, 1),
        b0 = v128.shuffle<f64>(B, B, 0, 0),
        b1 = v128.shuffle<f64>(B, B, 1, 1);
      const c0 = v128.shuffle<f64>(AI, AI, 0, 0),
        c1 = v128.shuffle<f64>(AI, AI, 1, 1),
        d0 = v128.shuffle<f64>(BI, BI, 0, 0),
        d1 = v128.shuffle<f64>(BI, BI, 1, 1);
      if (secondLow) {
        // x0 = A0, x1 = A1, x2 = B0, x3 = B1
        v128.store(re + b, rowRe(t, a0, c0, a1, c1, b0, d0, b1, d1));
        v128.store(im + b, rowIm(t, a0, c0, a1, c1, b0, d0, b1, d1));
        v128.store(re + b + sHi, rowRe(t + 128, a0, c0, a1, c1, b0, d0, b1, d1));
        v128.store(im + b + sHi, rowIm(t + 128, a0, c0, a1, c1, b0, d0, b1, d1));
      } else {
        // x0 = A0, x1 = B0, x2 = A1, x3 = B1
        v128.store(re + b, rowRe(t, a0, c0, b0, d0, a1, c1, b1, d1));
        v128.store(im + b, rowIm(t, a0, c0, b0, d0, a1, c1, b1, d1));
        v128.store(re + b + sHi, rowRe(t + 128, a0, c0, b0, d0, a1, c1, b1, d1));
        v128.store(im + b + sHi, rowIm(t + 128, a0, c0, b0, d0, a1, c1, b1, d1));
      }
    }
  }
}

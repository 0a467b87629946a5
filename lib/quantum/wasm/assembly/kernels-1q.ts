// AssemblyScript (compiled by `npm run build:wasm`, not by tsc): 1-qubit dense kernels over
// split re/im f64 arrays in linear memory. Pointers are byte offsets; `len` is the number of
// amplitudes (a power of two ≥ 2); `m` points at the interleaved 2×2 matrix [[a, b], [c, d]].
// Every lane evaluates the same expression, in the same order, as the JavaScript kernels
// (statevector/kernels-general.ts), so the results are bit-identical to them.

/** General complex 2×2 on index bit q. */
export function general1q(re: usize, im: usize, len: i32, q: i32, m: usize): void {
  const ar = load<f64>(m, 0),
    ai = load<f64>(m, 8),
    br = load<f64>(m, 16),
    bi = load<f64>(m, 24);
  const cr = load<f64>(m, 32),
    ci = load<f64>(m, 40),
    dr = load<f64>(m, 48),
    di = load<f64>(m, 56);
  if (q == 0) {
    // pairs are the two lanes of one vector: splat each lane, rows (a, c) and (b, d) as lanes
    const AC = f64x2(ar, cr),
      AICI = f64x2(ai, ci),
      BD = f64x2(br, dr),
      BIDI = f64x2(bi, di);
    const end = re + (<usize>len << 3);
    for (let p = re, r = im; p < end; p += 16, r += 16) {
      const v = v128.load(p),
        w = v128.load(r);
      const x0 = v128.shuffle<f64>(v, v, 0, 0),
        x1 = v128.shuffle<f64>(v, v, 1, 1);
      const y0 = v128.shuffle<f64>(w, w, 0, 0),
        y1 = v128.shuffle<f64>(w, w, 1, 1);
      v128.store(
        p,
        f64x2.sub(
          f64x2.add(f64x2.sub(f64x2.mul(AC, x0), f64x2.mul(AICI, y0)), f64x2.mul(BD, x1)),
          f64x2.mul(BIDI, y1),
        ),
      );
      v128.store(
        r,
        f64x2.add(
          f64x2.add(f64x2.add(f64x2.mul(AC, y0), f64x2.mul(AICI, x0)), f64x2.mul(BD, y1)),
          f64x2.mul(BIDI, x1),
        ),
      );
    }
    return;
  }
  const AR = f64x2.splat(ar),
    AI = f64x2.splat(ai),
    BR = f64x2.splat(br),
    BI = f64x2.splat(bi);
  const CR = f64x2.splat(cr),
    CI = f64x2.splat(ci),
    DR = f64x2.splat(dr),
    DI = f64x2.splat(di);
  const half = (<usize>1 << q) << 3; // bytes
  const total = <usize>len << 3;
  for (let blk: usize = 0; blk < total; blk += half << 1) {
    const end = blk + half;
    for (let i = blk; i < end; i += 16) {
      const pi = re + i,
        qi = im + i,
        pj = pi + half,
        qj = qi + half;
      const x0 = v128.load(pi),
        y0 = v128.load(qi),
        x1 = v128.load(pj),
        y1 = v128.load(qj);
      v128.store(
        pi,
        f64x2.sub(
          f64x2.add(f64x2.sub(f64x2.mul(AR, x0), f64x2.mul(AI, y0)), f64x2.mul(BR, x1)),
          f64x2.mul(BI, y1),
        ),
      );
      v128.store(
        qi,
        f64x2.add(
          f64x2.add(f64x2.add(f64x2.mul(AR, y0), f64x2.mul(AI, x0)), f64x2.mul(BR, y1)),
          f64x2.mul(BI, x1),
        ),
      );
      v128.store(
        pj,
        f64x2.sub(
          f64x2.add(f64x2.sub(f64x2.mul(CR, x0), f64x2.mul(CI, y0)), f64x2.mul(DR, x1)),
          f64x2.mul(DI, y1),
        ),
      );
      v128.store(
        qj,
        f64x2.add(
          f64x2.add(f64x2.add(f64x2.mul(CR, y0), f64x2.mul(CI, x0)), f64x2.mul(DR, y1)),
          f64x2.mul(DI, x1),
        ),
      );
    }
  }
}

/** Real 2×2 [[a, b], [c, d]] (imaginary parts of m ignored) on index bit q. */
export function real1q(re: usize, im: usize, len: i32, q: i32, m: usize): void {
  const a = load<f64>(m, 0),
    b = load<f64>(m, 16),
    c = load<f64>(m, 32),
    d = load<f64>(m, 48);
  if (q == 0) {
    const AC = f64x2(a, c),
      BD = f64x2(b, d);
    const end = re + (<usize>len << 3);
    for (let p = re, r = im; p < end; p += 16, r += 16) {
      const v = v128.load(p),
        w = v128.load(r);
      v128.store(
        p,
        f64x2.add(
          f64x2.mul(AC, v128.shuffle<f64>(v, v, 0, 0)),
          f64x2.mul(BD, v128.shuffle<f64>(v, v, 1, 1)),
        ),
      );
      v128.store(
        r,
        f64x2.add(
          f64x2.mul(AC, v128.shuffle<f64>(w, w, 0, 0)),
          f64x2.mul(BD, v128.shuffle<f64>(w, w, 1, 1)),
        ),
      );
    }
    return;
  }
  const A = f64x2.splat(a),
    B = f64x2.splat(b),
    C = f64x2.splat(c),
    D = f64x2.splat(d);
  const half = (<usize>1 << q) << 3;
  const total = <usize>len << 3;
  for (let blk: usize = 0; blk < total; blk += half << 1) {
    const end = blk + half;
    for (let i = blk; i < end; i += 16) {
      const pi = re + i,
        qi = im + i,
        pj = pi + half,
        qj = qi + half;
      const x0 = v128.load(pi),
        y0 = v128.load(qi),
        x1 = v128.load(pj),
        y1 = v128.load(qj);
      v128.store(pi, f64x2.add(f64x2.mul(A, x0), f64x2.mul(B, x1)));
      v128.store(qi, f64x2.add(f64x2.mul(A, y0), f64x2.mul(B, y1)));
      v128.store(pj, f64x2.add(f64x2.mul(C, x0), f64x2.mul(D, x1)));
      v128.store(qj, f64x2.add(f64x2.mul(C, y0), f64x2.mul(D, y1)));
    }
  }
}

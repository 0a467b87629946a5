// AssemblyScript (compiled by `npm run build:wasm`): two Pauli terms with different flip masks
// in one pass. Both masks have the same highest bit h (so the same half b is visited) and the
// same bit 0 (the same lane swap); ψ_b is loaded once for both, the partners b ⊕ xA and b ⊕ xB
// each once: three half-state reads for two terms instead of four. Each term's sum has the
// bits pauliTerm would give it (pauli-lanes.ts).

import { addSigned, laneTotal, partner, pattern, product } from "./pauli-lanes";

// Lane-signed sum of one group for a term: partners at c (vector order v, v^1, v^2, v^3 as
// byte offsets o0 … o3), the term's lane patterns in registers.
@inline
function termGroup(
  re: usize,
  im: usize,
  c: usize,
  o0: usize,
  o1: usize,
  o2: usize,
  o3: usize,
  br0: v128,
  br1: v128,
  br2: v128,
  br3: v128,
  bi0: v128,
  bi1: v128,
  bi2: v128,
  bi3: v128,
  p0: v128,
  p1: v128,
  p2: v128,
  p3: v128,
  swap: bool,
  odd: bool,
): v128 {
  return f64x2.add(
    f64x2.add(
      v128.xor(product(partner(re + c + o0, swap), partner(im + c + o0, swap), br0, bi0, odd), p0),
      v128.xor(product(partner(re + c + o1, swap), partner(im + c + o1, swap), br1, bi1, odd), p1),
    ),
    f64x2.add(
      v128.xor(product(partner(re + c + o2, swap), partner(im + c + o2, swap), br2, bi2, odd), p2),
      v128.xor(product(partner(re + c + o3, swap), partner(im + c + o3, swap), br3, bi3, odd), p3),
    ),
  );
}

// The loop nest for fixed swap, oddA, oddB (patterns in registers, ψ_b loaded once per group).
@inline
function pairLoop(
  re: usize,
  im: usize,
  total: usize,
  runB: usize,
  strideB: usize,
  xA: i32,
  xB: i32,
  zA: i32,
  zB: i32,
  out: usize,
  swap: bool,
  oddA: bool,
  oddB: bool,
): void {
  const hA = <usize>(xA & ~7) << 3,
    hB = <usize>(xB & ~7) << 3;
  const vA = <usize>((xA >> 1) & 3) << 4,
    vB = <usize>((xB >> 1) & 3) << 4;
  const a0 = vA,
    a1 = vA ^ 16,
    a2 = vA ^ 32,
    a3 = vA ^ 48;
  const b0 = vB,
    b1 = vB ^ 16,
    b2 = vB ^ 32,
    b3 = vB ^ 48;
  const pa0 = pattern(zA, 0),
    pa1 = pattern(zA, 1),
    pa2 = pattern(zA, 2),
    pa3 = pattern(zA, 3);
  const pb0 = pattern(zB, 0),
    pb1 = pattern(zB, 1),
    pb2 = pattern(zB, 2),
    pb3 = pattern(zB, 3);
  let accA = f64x2.splat(0),
    accB = f64x2.splat(0);
  for (let o: usize = 0; o < total; o += strideB) {
    for (let b = o, e = o + runB; b < e; b += 64) {
      const br0 = v128.load(re + b),
        br1 = v128.load(re + b, 16),
        br2 = v128.load(re + b, 32),
        br3 = v128.load(re + b, 48);
      const bi0 = v128.load(im + b),
        bi1 = v128.load(im + b, 16),
        bi2 = v128.load(im + b, 32),
        bi3 = v128.load(im + b, 48);
      const p = <i32>(b >> 3);
      const sA = termGroup(re, im, b ^ hA, a0, a1, a2, a3, br0, br1, br2, br3, bi0, bi1, bi2, bi3, pa0, pa1, pa2, pa3, swap, oddA);
      accA = addSigned(accA, sA, p, zA);
      const sB = termGroup(re, im, b ^ hB, b0, b1, b2, b3, br0, br1, br2, br3, bi0, bi1, bi2, bi3, pb0, pb1, pb2, pb3, swap, oddB);
      accB = addSigned(accB, sB, p, zB);
    }
  }
  store<f64>(out, laneTotal(accA), 0);
  store<f64>(out, laneTotal(accB), 8);
}

/**
 * Terms A and B (flip masks xA, xB with the same highest bit ≥ 3 and the same bit 0; Z masks
 * zA, zB; odd = odd number of Y factors): their half-sums go to out[0] and out[1].
 * Specialised on swap, oddA and oddB.
 */
export function pauliPair(
  re: usize,
  im: usize,
  xA: i32,
  xB: i32,
  run: i32,
  stride: i32,
  len: i32,
  zA: i32,
  zB: i32,
  oddA: bool,
  oddB: bool,
  out: usize,
): void {
  const total = <usize>len << 3;
  const runB = <usize>run << 3,
    strideB = <usize>stride << 3;
  if (xA & 1) {
    if (oddA) {
      if (oddB) pairLoop(re, im, total, runB, strideB, xA, xB, zA, zB, out, true, true, true);
      else pairLoop(re, im, total, runB, strideB, xA, xB, zA, zB, out, true, true, false);
    } else if (oddB) pairLoop(re, im, total, runB, strideB, xA, xB, zA, zB, out, true, false, true);
    else pairLoop(re, im, total, runB, strideB, xA, xB, zA, zB, out, true, false, false);
  } else if (oddA) {
    if (oddB) pairLoop(re, im, total, runB, strideB, xA, xB, zA, zB, out, false, true, true);
    else pairLoop(re, im, total, runB, strideB, xA, xB, zA, zB, out, false, true, false);
  } else if (oddB) pairLoop(re, im, total, runB, strideB, xA, xB, zA, zB, out, false, false, true);
  else pairLoop(re, im, total, runB, strideB, xA, xB, zA, zB, out, false, false, false);
}

// AssemblyScript: lane helpers of the Pauli flip-mask passes (pauli-mask.ts, pauli-pair.ts).
// Every pass sums a term's f the same way (products below, lane signs by xor, the four vectors
// of a group as (v0 + v1) + (v2 + v3), the group sign, one running sum), so a term gets the
// same bits whichever kernel computes it.

/** Sign bit (bit 63) of the parity of v. */
@inline
export function signBit(v: i32): i64 {
  return <i64>(popcnt<i32>(v) & 1) << 63;
}

/** Lane signs of vector v (amplitudes 2v, 2v + 1 of a group of eight) for the Z mask z. */
@inline
export function pattern(z: i32, v: i32): v128 {
  return i64x2(signBit((2 * v) & z), signBit((2 * v + 1) & z));
}

@inline
export function swapLanes(a: v128): v128 {
  return v128.shuffle<f64>(a, a, 1, 0);
}

/** Two partner amplitudes at p, lanes swapped when bit 0 of the flip mask is set. */
@inline
export function partner(p: usize, swap: bool): v128 {
  const v = v128.load(p);
  return swap ? swapLanes(v) : v;
}

/** Re f (even) or Im f (odd) of f = conj(ψ_c) ψ_b, two lanes. */
@inline
export function product(cr: v128, ci: v128, br: v128, bi: v128, odd: bool): v128 {
  return odd
    ? f64x2.sub(f64x2.mul(cr, bi), f64x2.mul(ci, br))
    : f64x2.add(f64x2.mul(cr, br), f64x2.mul(ci, bi));
}

/** (h0 ⊕ p0 + h1 ⊕ p1) + (h2 ⊕ p2 + h3 ⊕ p3): a group's lane-signed sum (patterns at pat). */
@inline
export function groupSum(h0: v128, h1: v128, h2: v128, h3: v128, pat: usize): v128 {
  return f64x2.add(
    f64x2.add(v128.xor(h0, v128.load(pat, 0)), v128.xor(h1, v128.load(pat, 16))),
    f64x2.add(v128.xor(h2, v128.load(pat, 32)), v128.xor(h3, v128.load(pat, 48))),
  );
}

/** acc + (group sum with the sign of the group's high bits p & z). */
@inline
export function addSigned(acc: v128, sum: v128, p: i32, z: i32): v128 {
  return f64x2.add(acc, v128.xor(sum, i64x2.splat(signBit(p & z))));
}

/** Writes the lane patterns of Z mask z (64 bytes) at pat. */
@inline
export function storePatterns(pat: usize, z: i32): void {
  for (let v = 0; v < 4; v++) v128.store(pat + (<usize>v << 4), pattern(z, v));
}

@inline
export function laneTotal(acc: v128): f64 {
  return f64x2.extract_lane(acc, 0) + f64x2.extract_lane(acc, 1);
}

// AssemblyScript (compiled by `npm run build:wasm`): one Pauli term's share of λ = A·ψ for the
// adjoint gradient (gradient/apply-observable.ts): for outputs o in [from, to),
//   λ_o += c · s_z(o) · ψ_{o ⊕ x},
// with c the term's coefficient times i^k and s_z(x) (folded in by the host). Groups of eight
// outputs read their partner group o ⊕ x as in the Pauli pass (pauli-mask.ts): the high bits
// of x move the group, bits 1–2 permute its vectors, bit 0 swaps lanes; s_z(o) is the parity
// of the group's high bits times a lane pattern. λ and ψ live in one memory.

import { partner, pattern, signBit } from "./pauli-lanes";

// λ vector at (lr, li) += s ⊕ (c · ψ vector at (pr, pi)), s = lane signs
@inline
function addScaled(lr: usize, li: usize, pr: usize, pi: usize, swap: bool, cr: v128, ci: v128, s: v128): void {
  const ar = partner(pr, swap),
    ai = partner(pi, swap);
  const tr = f64x2.sub(f64x2.mul(cr, ar), f64x2.mul(ci, ai)),
    ti = f64x2.add(f64x2.mul(cr, ai), f64x2.mul(ci, ar));
  v128.store(lr, f64x2.add(v128.load(lr), v128.xor(tr, s)));
  v128.store(li, f64x2.add(v128.load(li), v128.xor(ti, s)));
}

@inline
function termLoop(
  lre: usize,
  lim: usize,
  pre: usize,
  pim: usize,
  from: usize,
  to: usize,
  x: i32,
  z: i32,
  cr: v128,
  ci: v128,
  swap: bool,
): void {
  const xHigh = <usize>(x & ~7) << 3;
  const v = <usize>((x >> 1) & 3) << 4;
  const p0 = pattern(z, 0),
    p1 = pattern(z, 1),
    p2 = pattern(z, 2),
    p3 = pattern(z, 3);
  for (let o = from << 3, e = to << 3; o < e; o += 64) {
    const c = o ^ xHigh;
    const g = i64x2.splat(signBit(<i32>(o >> 3) & z));
    addScaled(lre + o, lim + o, pre + c + v, pim + c + v, swap, cr, ci, v128.xor(p0, g));
    addScaled(lre + o + 16, lim + o + 16, pre + c + (v ^ 16), pim + c + (v ^ 16), swap, cr, ci, v128.xor(p1, g));
    addScaled(lre + o + 32, lim + o + 32, pre + c + (v ^ 32), pim + c + (v ^ 32), swap, cr, ci, v128.xor(p2, g));
    addScaled(lre + o + 48, lim + o + 48, pre + c + (v ^ 48), pim + c + (v ^ 48), swap, cr, ci, v128.xor(p3, g));
  }
}

/** λ_o += (cr + i·ci)·s_z(o)·ψ_{o ⊕ x} for o in [from, to) (multiples of 8). */
export function lambdaTerm(
  lre: usize,
  lim: usize,
  pre: usize,
  pim: usize,
  from: i32,
  to: i32,
  x: i32,
  z: i32,
  cr: f64,
  ci: f64,
): void {
  const r = f64x2.splat(cr),
    i = f64x2.splat(ci);
  if (x & 1) termLoop(lre, lim, pre, pim, <usize>from, <usize>to, x, z, r, i, true);
  else termLoop(lre, lim, pre, pim, <usize>from, <usize>to, x, z, r, i, false);
}

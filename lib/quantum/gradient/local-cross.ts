/**
 * The local cross matrix of two vectors on index bits `bits`:
 *   R[a][b] = Σ_r conj(λ[r ⊕ a]) · φ[r ⊕ b]
 * (r runs over the indices with every target bit zero; a, b are local indices in the
 * types.ts convention, first operand = most significant local bit). Then for any
 * 2^k × 2^k matrix M on those bits, ⟨λ|M|φ⟩ = Σ_{a,b} M[a][b] · R[a][b]: one read-only
 * pass over both vectors serves every angle of a fused block (adjoint.ts).
 * Output: 2^k × 2^k, row-major, interleaved (re, im). Used for blocks on three or more
 * qubits; one- and two-qubit blocks compute R inside their backward step (backward-step.ts).
 */
import { localOffsets } from "../statevector/kernels-general";

export function crossLocal(
  lre: Float64Array,
  lim: Float64Array,
  pre: Float64Array,
  pim: Float64Array,
  bits: readonly number[],
): Float64Array {
  const offsets = localOffsets(bits);
  const s = offsets.length;
  const mask = offsets[s - 1];
  const notMask = ~mask;
  const count = pre.length >>> bits.length;
  const out = new Float64Array(2 * s * s);
  const lr = new Float64Array(s);
  const li = new Float64Array(s);
  const pr = new Float64Array(s);
  const pi = new Float64Array(s);
  for (let t = 0, b = 0; t < count; t++, b = ((b | mask) + 1) & notMask) {
    for (let c = 0; c < s; c++) {
      const o = b | offsets[c];
      lr[c] = lre[o];
      li[c] = lim[o];
      pr[c] = pre[o];
      pi[c] = pim[o];
    }
    for (let r = 0, w = 0; r < s; r++) {
      const xr = lr[r];
      const xi = li[r];
      for (let c = 0; c < s; c++, w += 2) {
        // conj(λ_r)·φ_c = (xr − i·xi)(pr + i·pi)
        out[w] += xr * pr[c] + xi * pi[c];
        out[w + 1] += xr * pi[c] - xi * pr[c];
      }
    }
  }
  return out;
}

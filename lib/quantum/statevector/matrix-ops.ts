/**
 * Small dense complex matrices (row-major, interleaved re/im) used to fuse gates.
 * Local-index convention of types.ts: on operands (q_0, …, q_{k−1}) the FIRST operand is
 * the most significant bit.
 */

/** C = A · B for d×d complex matrices. */
export function multiplyMatrices(a: Float64Array, b: Float64Array, d: number): Float64Array {
  const out = new Float64Array(2 * d * d);
  for (let r = 0; r < d; r++) {
    for (let c = 0; c < d; c++) {
      let sr = 0,
        si = 0;
      for (let j = 0; j < d; j++) {
        const ar = a[2 * (r * d + j)],
          ai = a[2 * (r * d + j) + 1];
        const br = b[2 * (j * d + c)],
          bi = b[2 * (j * d + c) + 1];
        sr += ar * br - ai * bi;
        si += ar * bi + ai * br;
      }
      out[2 * (r * d + c)] = sr;
      out[2 * (r * d + c) + 1] = si;
    }
  }
  return out;
}

/**
 * The matrix of gate `m` on `gateQubits` written on the larger operand list `target`
 * (which contains every gate qubit): U ⊗ I on the other target qubits, in target's order.
 */
export function embedMatrix(
  m: Float64Array,
  gateQubits: readonly number[],
  target: readonly number[],
): Float64Array {
  const K = target.length;
  const D = 1 << K;
  const k = gateQubits.length;
  const d = 1 << k;
  // Position (as a bit of the target-local index) of each gate operand, and the mask of the rest.
  const pos = gateQubits.map((q) => {
    const j = target.indexOf(q);
    if (j < 0) throw new RangeError(`qubit ${q} is not among the fused operands`);
    return K - 1 - j;
  });
  let gateMask = 0;
  for (const p of pos) gateMask |= 1 << p;
  const local = (x: number): number => {
    let v = 0;
    for (let j = 0; j < k; j++) v = (v << 1) | ((x >> pos[j]) & 1);
    return v;
  };
  const out = new Float64Array(2 * D * D);
  for (let R = 0; R < D; R++) {
    for (let C = 0; C < D; C++) {
      if ((R & ~gateMask) !== (C & ~gateMask)) continue;
      const src = 2 * (local(R) * d + local(C));
      out[2 * (R * D + C)] = m[src];
      out[2 * (R * D + C) + 1] = m[src + 1];
    }
  }
  return out;
}

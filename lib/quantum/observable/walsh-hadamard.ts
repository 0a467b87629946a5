/**
 * In-place fast Walsh–Hadamard transform (unnormalised): after the call
 * v[s] = Σ_b (−1)^{popcount(b & s)} v_before[b]. Cost n·2^n additions.
 * Applied to a probability vector p, v[s] = ⟨Z_S⟩ for the qubit set S = bits of s
 * (common practice: parities of a distribution are its Walsh–Hadamard coefficients).
 */
export function walshHadamardInPlace(v: Float64Array): void {
  const d = v.length;
  for (let h = 1; h < d; h <<= 1) {
    for (let i = 0; i < d; i += h << 1) {
      for (let j = i; j < i + h; j++) {
        const a = v[j];
        const b = v[j + h];
        v[j] = a + b;
        v[j + h] = a - b;
      }
    }
  }
}

/**
 * The standard normal distribution as the sampled figures use it: the 95 % quantile Z95
 * (half-width multiplier of a normal 95 % interval, the t quantile's limit for many shots),
 * the complementary error function and the two-sided p-value of a z-score.
 */

/**
 * Two-sided 95 % standard-normal quantile Φ⁻¹(0.975) = 1.959963984540054 (jstat's
 * `normal.inv(0.975, 0, 1)` returns 1.9599639845400545; printed tables round it to
 * 1.959964, common practice). The one definition: intervals, verdicts and charts use it.
 */
export const Z95 = 1.959963984540054;

/**
 * Complementary error function to ~1e-15 relative: the Maclaurin series of erf below 1,
 * else the continued fraction of erfc evaluated by the modified Lentz method (common
 * practice; W. H. Press et al., Numerical Recipes, §5.2 and §6.2). One definition: the normal
 * p-values and the Student t distribution's normal limit use it.
 */
export function erfc(x: number): number {
  if (Number.isNaN(x)) return NaN;
  if (x < 0) return 2 - erfc(-x);
  if (x < 1) {
    let sum = x;
    let term = x;
    for (let n = 1; n < 60; n++) {
      term *= (-x * x) / n;
      sum += term / (2 * n + 1);
    }
    return 1 - (2 / Math.sqrt(Math.PI)) * sum;
  }
  if (x > 27) return 0; // below the smallest double
  const tiny = 1e-300;
  let f = x;
  let c = x;
  let d = 0;
  for (let n = 1; n < 500; n++) {
    const an = n / 2;
    d = x + an * d;
    d = Math.abs(d) < tiny ? 1 / tiny : 1 / d;
    c = x + an / c;
    if (Math.abs(c) < tiny) c = tiny;
    const del = c * d;
    f *= del;
    if (Math.abs(del - 1) < 1e-16) break;
  }
  return Math.exp(-x * x) / (f * Math.sqrt(Math.PI));
}

/** p = 2·(1 − Φ(|z|)) = erfc(|z|/√2). */
export function twoSidedP(z: number): number {
  return Math.min(1, erfc(Math.abs(z) / Math.SQRT2));
}

export function zScore(mean: number, reference: number, stdErr: number): number | null {
  if (![mean, reference, stdErr].every(Number.isFinite) || stdErr <= 0) return null;
  return (mean - reference) / stdErr;
}

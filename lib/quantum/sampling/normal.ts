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
 * Complementary error function, fractional error < 1.2e-7 everywhere (Chebyshev fit,
 * W. H. Press et al., Numerical Recipes in C, 2nd ed., §6.2, `erfcc`).
 */
export function erfc(x: number): number {
  const z = Math.abs(x);
  const t = 1 / (1 + 0.5 * z);
  const ans =
    t *
    Math.exp(
      -z * z -
        1.26551223 +
        t *
          (1.00002368 +
            t *
              (0.37409196 +
                t *
                  (0.09678418 +
                    t *
                      (-0.18628806 +
                        t *
                          (0.27886807 +
                            t *
                              (-1.13520398 +
                                t * (1.48851587 + t * (-0.82215223 + t * 0.17087277)))))))),
    );
  return x >= 0 ? ans : 2 - ans;
}

/** p = 2·(1 − Φ(|z|)) = erfc(|z|/√2). */
export function twoSidedP(z: number): number {
  return Math.min(1, erfc(Math.abs(z) / Math.SQRT2));
}

export function zScore(mean: number, reference: number, stdErr: number): number | null {
  if (![mean, reference, stdErr].every(Number.isFinite) || stdErr <= 0) return null;
  return (mean - reference) / stdErr;
}

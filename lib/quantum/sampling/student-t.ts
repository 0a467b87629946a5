/**
 * Student's t distribution: two-sided tail probability and quantile.
 *
 * Through the regularized incomplete beta function, P(|T_ν| > t) = I_x(ν/2, 1/2) with
 * x = ν/(ν + t²) (M. Abramowitz & I. A. Stegun, Handbook of Mathematical Functions, 1964,
 * 26.7.1 and 26.5.27). I_x(a, b) is evaluated by its continued fraction with the modified
 * Lentz method (W. H. Press et al., Numerical Recipes, 3rd ed., 2007, §6.4 `betacf`), ln Γ
 * by the Lanczos approximation (g = 7, 9 coefficients, common practice). The quantile
 * inverts the tail by bisection on t in a bracket that always contains it (monotone, ~60
 * steps, exact to double round-off); ν = ∞ (or very large) falls back to the normal.
 */
import { erfc } from "./normal";

const LANCZOS = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313,
  -176.61502916214059, 12.507343278686905, -0.13857109526572012, 9.9843695780195716e-6,
  1.5056327351493116e-7,
];

/** ln Γ(x) for x > 0 (Lanczos, g = 7). */
export function logGamma(x: number): number {
  if (x < 0.5) return Math.log(Math.PI / Math.sin(Math.PI * x)) - logGamma(1 - x);
  const y = x - 1;
  let a = LANCZOS[0];
  const t = y + 7.5;
  for (let i = 1; i < 9; i++) a += LANCZOS[i] / (y + i);
  return 0.5 * Math.log(2 * Math.PI) + (y + 0.5) * Math.log(t) - t + Math.log(a);
}

function betaContinuedFraction(a: number, b: number, x: number): number {
  const tiny = 1e-300;
  const qab = a + b;
  const qap = a + 1;
  const qam = a - 1;
  let c = 1;
  let d = 1 - (qab * x) / qap;
  if (Math.abs(d) < tiny) d = tiny;
  d = 1 / d;
  let h = d;
  for (let m = 1; m <= 10_000; m++) {
    const m2 = 2 * m;
    let aa = (m * (b - m) * x) / ((qam + m2) * (a + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + aa / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    h *= d * c;
    aa = (-(a + m) * (qab + m) * x) / ((a + m2) * (qap + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + aa / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const del = d * c;
    h *= del;
    if (Math.abs(del - 1) < 1e-15) break;
  }
  return h;
}

/** Regularized incomplete beta I_x(a, b), a, b > 0, 0 ≤ x ≤ 1. */
export function incompleteBeta(x: number, a: number, b: number): number {
  if (x <= 0) return 0;
  if (x >= 1) return 1;
  const lnFront =
    logGamma(a + b) - logGamma(a) - logGamma(b) + a * Math.log(x) + b * Math.log1p(-x);
  const front = Math.exp(lnFront);
  if (x < (a + 1) / (a + b + 2)) return (front * betaContinuedFraction(a, b, x)) / a;
  return 1 - (front * betaContinuedFraction(b, a, 1 - x)) / b;
}

/** Degrees of freedom beyond which the t distribution is taken as the standard normal. */
const NORMAL_DF = 1e7;

/** P(|Z| > |z|) for the standard normal (the t distribution's limit for huge ν). */
const normalTwoSided = (z: number): number => erfc(Math.abs(z) / Math.SQRT2);

/** P(|T_ν| > |t|), the two-sided p-value of a t statistic with ν > 0 degrees of freedom. */
export function studentTwoSidedP(t: number, df: number): number {
  if (!Number.isFinite(t)) return 0;
  if (!(df > 0)) return 1;
  if (df >= NORMAL_DF) return Math.min(1, normalTwoSided(t));
  return Math.min(1, incompleteBeta(df / (df + t * t), df / 2, 0.5));
}

/** The t with P(|T_ν| > t) = alpha (e.g. alpha = 0.05 → the 97.5 % quantile). */
export function studentQuantileTwoSided(alpha: number, df: number): number {
  if (!(alpha > 0 && alpha < 1)) throw new RangeError(`alpha must lie in (0, 1), got ${alpha}`);
  if (!(df > 0)) return Number.POSITIVE_INFINITY;
  let lo = 0;
  let hi = 1;
  while (studentTwoSidedP(hi, df) > alpha) {
    lo = hi;
    hi *= 2;
    if (hi > 1e300) return Number.POSITIVE_INFINITY;
  }
  for (let i = 0; i < 200 && hi - lo > 1e-15 * hi; i++) {
    const mid = 0.5 * (lo + hi);
    if (studentTwoSidedP(mid, df) > alpha) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

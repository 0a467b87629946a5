/**
 * Shift rules: exact derivatives of trigonometric polynomials from shifted evaluations.
 *
 * A function f(p) = a₀ + Σ_{r=1..R} (a_r cos(rΩp) + b_r sin(rΩp)) — equidistant
 * frequencies Ω, 2Ω, …, RΩ — has the exact derivative
 *   f'(p) = Ω · Σ_{μ=1..2R} (−1)^{μ−1} / (4R·sin²(x_μ/2)) · f(p + x_μ/Ω),  x_μ = (2μ−1)π/(2R)
 * (Wierichs, Izaac, Wang, Lin, "General parameter-shift rules for quantum gradients",
 * Quantum 6, 677 (2022), eq. for equidistant frequencies). R = 1, Ω = 1 is the two-term
 * rule f' = [f(p + π/2) − f(p − π/2)]/2 of Mitarai et al. (2018) and Schuld et al. (2019);
 * R = 2, Ω = 1/2 is the four-term rule of controlled rotations, shifts ±π/2, ±3π/2 with
 * weights (√2 ± 1)/(4√2) (Anselmetti et al. 2021).
 *
 * The same identity differentiates a gate's MATRIX (entries are trigonometric polynomials
 * of each angle) and an expectation value ⟨A⟩(p) (frequencies = differences of the
 * eigenvalues of the gate's generator G = i·U†·∂U/∂p).
 */
import { hermitianEigen } from "../observable/hermitian-eigen";

export interface ShiftRule {
  /** Shifts added to the parameter. */
  shifts: number[];
  /** Weights of f(p + shift). */
  weights: number[];
}

/** The 2R-term rule for the frequencies Ω, 2Ω, …, RΩ. */
export function equidistantRule(omega: number, r: number): ShiftRule {
  const shifts: number[] = [];
  const weights: number[] = [];
  for (let mu = 1; mu <= 2 * r; mu++) {
    const x = ((2 * mu - 1) * Math.PI) / (2 * r);
    const s = Math.sin(x / 2);
    // Fold shifts into (−π/Ω, π/Ω]: x_μ and x_μ − 2π/Ω·… are the same point of a 2π/Ω-periodic f.
    const shift = x <= Math.PI ? x / omega : (x - 2 * Math.PI) / omega;
    shifts.push(shift);
    weights.push((omega * (mu % 2 === 1 ? 1 : -1)) / (4 * r * s * s));
  }
  return { shifts, weights };
}

/**
 * Gate matrices of the standard library have angle frequencies in {0, ±½, ±1} (half
 * angles of rotations, whole angles of phases): the R = 2, Ω = ½ rule is exact for them.
 */
export const MATRIX_RULE: ShiftRule = equidistantRule(0.5, 2);

/** ∂M/∂p_k of a gate matrix function at `params` (exact for the frequencies above). */
export function matrixDerivative(
  matrix: (p: readonly number[]) => Float64Array,
  params: readonly number[],
  k: number,
  rule: ShiftRule = MATRIX_RULE,
): Float64Array {
  let out: Float64Array | null = null;
  const shifted = params.slice();
  for (let i = 0; i < rule.shifts.length; i++) {
    shifted[k] = params[k] + rule.shifts[i];
    const m = matrix(shifted);
    if (out === null) out = new Float64Array(m.length);
    const w = rule.weights[i];
    for (let j = 0; j < m.length; j++) out[j] += w * m[j];
  }
  return out!;
}

const GAP_TOL = 1e-9;

/**
 * The shift rule of an expectation value in one gate angle: from the eigenvalues of the
 * generator G = i·U†·∂U/∂p (Hermitian for a one-parameter unitary family), the distinct
 * gaps must be multiples of the smallest one Ω; R = largest gap / Ω. Returns null when
 * the angle has no effect (G ∝ I) and throws when the gaps are not equidistant.
 */
export function expectationRule(u: Float64Array, du: Float64Array): ShiftRule | null {
  const d = Math.round(Math.sqrt(u.length / 2));
  // G = i·U†·dU: (U†dU)_{rc} = Σ_j conj(U_{jr}) dU_{jc}; times i: (re, im) → (−im, re).
  const re = new Float64Array(d * d);
  const im = new Float64Array(d * d);
  for (let r = 0; r < d; r++) {
    for (let c = 0; c < d; c++) {
      let sr = 0;
      let si = 0;
      for (let j = 0; j < d; j++) {
        const ar = u[2 * (j * d + r)];
        const ai = -u[2 * (j * d + r) + 1];
        const br = du[2 * (j * d + c)];
        const bi = du[2 * (j * d + c) + 1];
        sr += ar * br - ai * bi;
        si += ar * bi + ai * br;
      }
      re[r * d + c] = -si;
      im[r * d + c] = sr;
    }
  }
  // Symmetrise against rounding before the Hermitian solver.
  for (let r = 0; r < d; r++) {
    for (let c = r; c < d; c++) {
      const mr = (re[r * d + c] + re[c * d + r]) / 2;
      const mi = (im[r * d + c] - im[c * d + r]) / 2;
      re[r * d + c] = mr;
      re[c * d + r] = mr;
      im[r * d + c] = mi;
      im[c * d + r] = -mi;
    }
  }
  const values = hermitianEigen({ n: Math.log2(d), dim: d, re, im }).values;
  const gaps: number[] = [];
  for (let i = 0; i < d; i++) {
    for (let j = i + 1; j < d; j++) {
      const g = Math.abs(values[j] - values[i]);
      if (g > GAP_TOL && !gaps.some((h) => Math.abs(h - g) <= GAP_TOL * Math.max(1, g)))
        gaps.push(g);
    }
  }
  if (gaps.length === 0) return null;
  const omega = Math.min(...gaps);
  const r = Math.round(Math.max(...gaps) / omega);
  for (const g of gaps) {
    const ratio = g / omega;
    if (Math.abs(ratio - Math.round(ratio)) > 1e-6)
      throw new Error("the generator's eigenvalue gaps are not equidistant");
  }
  return equidistantRule(omega, r);
}

/**
 * Agreement between a sampled estimate and the exact value it should scatter around.
 *
 * z = (mean − reference) / stdErr — or, when the estimate carries its 95 % interval, divided by
 * the interval's half-width on the reference's side over 1.96 (the intervals are asymmetric
 * next to a deterministic outcome; the standard error is never 0 from shots). Under the central limit theorem the sampled mean of N
 * shots is approximately normal around the exact value, so the two-sided p-value is
 * p = 2·(1 − Φ(|z|)) = erfc(|z|/√2). The verdict calls |z| ≤ 3 (p ≥ 0.0027, the common
 * "three sigma" practice) consistent and anything beyond suspicious: at 1.96 a correct
 * sampler would be flagged in one run of twenty, at 3 in fewer than three of a thousand.
 *
 * The exact value under noise never contains readout error while the raw sampled value
 * does (readout error acts on sampled outcomes only), so with readout error the raw mean is biased by design; the fair
 * comparison is then the readout-mitigated mean, which `pickComparison` selects.
 */

import { intervalZ } from "@/lib/quantum/sampling/interval";
import { twoSidedP } from "@/lib/quantum/sampling/normal";
import { formatExponential, formatFixed } from "@/lib/format";

export const Z_THRESHOLD = 3;

export type VerdictKind = "consistent" | "suspicious" | "exact" | "unavailable";

export type Verdict = {
  kind: VerdictKind;
  /** (mean − reference)/stdErr; null when stdErr is 0 or a value is missing. */
  z: number | null;
  /** Two-sided normal p-value of |z|; null with z. */
  p: number | null;
  deviation: number | null;
};

/**
 * Verdict for a sampled mean ± stdErr against a reference. A zero standard error (every
 * shot gave the same outcome, e.g. an eigenstate) is "exact" when the values agree to
 * `tolerance` (relative to the larger magnitude, at least absolute 1e-12), else suspicious.
 */
export function agreementVerdict(
  sample: { mean: number; stdErr: number; ci95?: [number, number] | null } | null | undefined,
  reference: number | null | undefined,
  { threshold = Z_THRESHOLD, tolerance = 1e-9 }: { threshold?: number; tolerance?: number } = {},
): Verdict {
  if (!sample || reference === null || reference === undefined) {
    return { kind: "unavailable", z: null, p: null, deviation: null };
  }
  const deviation = sample.mean - reference;
  if (!Number.isFinite(deviation) || !Number.isFinite(sample.stdErr) || sample.stdErr < 0) {
    return { kind: "unavailable", z: null, p: null, deviation: null };
  }
  if (sample.stdErr === 0) {
    const scale = Math.max(Math.abs(sample.mean), Math.abs(reference), 1e-3);
    const agrees = Math.abs(deviation) <= Math.max(tolerance * scale, 1e-12);
    return { kind: agrees ? "exact" : "suspicious", z: null, p: null, deviation };
  }
  // With an interval, the distance is measured in its half-width on the reference's side
  // (intervalZ): near a deterministic outcome the interval is one-sided, and |z| ≤ 1.96
  // exactly when the exact value lies inside ci95.
  const z = intervalZ(sample, reference) ?? deviation / sample.stdErr;
  return {
    kind: Math.abs(z) <= threshold ? "consistent" : "suspicious",
    z,
    p: twoSidedP(z),
    deviation,
  };
}

export type ComparisonChoice = {
  /** Which estimate the verdict is about. */
  basis: "raw" | "mitigated";
  /** True when the raw mean carries readout error the exact value lacks. */
  readoutBiased: boolean;
};

/** Chooses the estimate to compare with the exact value (see module doc). */
export function pickComparison(opts: {
  readout?: { p1Given0?: number | null; p0Given1?: number | null } | null;
  hasMitigated: boolean;
}): ComparisonChoice {
  const e0 = opts.readout?.p1Given0 ?? 0;
  const e1 = opts.readout?.p0Given1 ?? 0;
  const readoutBiased = e0 > 0 || e1 > 0;
  return { basis: readoutBiased && opts.hasMitigated ? "mitigated" : "raw", readoutBiased };
}

/** Plain-language sentence for a verdict, e.g. for the panel's summary line. */
export function verdictSentence(v: Verdict, label: string): string {
  switch (v.kind) {
    case "consistent":
      return `The ${label} mean lies ${formatFixed(Math.abs(v.z ?? 0), 2)} standard errors from the exact value — consistent with shot noise.`;
    case "suspicious":
      return v.z === null
        ? `The ${label} mean has no spread but differs from the exact value — look at the inputs.`
        : `The ${label} mean lies ${formatFixed(Math.abs(v.z), 2)} standard errors from the exact value — more than shot noise explains (p = ${v.p === null ? "—" : formatExponential(v.p, 1)}).`;
    case "exact":
      return `Every shot gave the same outcome; the ${label} mean equals the exact value.`;
    default:
      return "No sampled value to compare (the run computed exact values only).";
  }
}

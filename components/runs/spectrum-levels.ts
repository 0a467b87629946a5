/**
 * What the spectrum card shows about the lowest levels: the ground level's degeneracy and
 * the gap λ₁ − λ₀ between the two lowest DISTINCT levels, read from `spectrum.lowest`
 * (4 lowest eigenvalues with multiplicity) and `spectrum.groundDegeneracy`.
 */
import type { EstimateResult } from "@/lib/swr/types";

type Spectrum = NonNullable<EstimateResult["spectrum"]>;

export interface GroundLevels {
  /** Dimension of the ground level; `atLeast` when every listed value is in it. */
  degeneracy: number;
  atLeast: boolean;
  /** λ₁ − λ₀ between distinct levels; null when λ₁ lies beyond the listed values. */
  gap: number | null;
}

/** Same-level tolerance of the engine: 1e-8 relative to the spectrum's scale. */
const LEVEL_TOL = 1e-8;

export function groundLevels(s: Spectrum): GroundLevels | null {
  const lowest = s.lowest;
  if (!lowest || lowest.length === 0) return null;
  const tol = LEVEL_TOL * Math.max(1, Math.abs(s.min), Math.abs(s.max));
  const counted = lowest.filter((v) => v <= lowest[0] + tol).length;
  const degeneracy = s.groundDegeneracy ?? counted;
  const next = lowest[degeneracy];
  return {
    degeneracy,
    atLeast: s.groundDegeneracy === undefined && counted === lowest.length,
    gap: next === undefined ? null : next - lowest[0],
  };
}

export function degeneracyLabel(g: GroundLevels): string {
  if (g.degeneracy === 1) return "non-degenerate ground level";
  return `ground level ${g.atLeast ? "at least " : ""}${g.degeneracy}-fold`;
}

/** Below this ground-space weight the card adds a one-line caution. */
export const SMALL_GROUND_WEIGHT = 0.5;

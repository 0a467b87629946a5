/**
 * Keeps a stored result within a safe row size. Histograms are the only part
 * that grows with shots × qubits; when they would take over 8 MB of JSON they
 * are dropped (each group keeps `distinctOutcomes`), everything else stays.
 * (Everything else is bounded by the engine's limits on terms and sweep points.)
 */
import type { EstimateResult } from "@/lib/quantum/schemas";

export const MAX_RESULT_JSON_BYTES = 8 * 1024 * 1024;

/** JSON size of the histograms: per outcome a bitstring key of n characters plus ~12 for quotes, count and commas. */
export function histogramBytes(result: EstimateResult): number {
  let outcomes = 0;
  for (const group of result.groups) if (group.counts) outcomes += Object.keys(group.counts).length;
  return outcomes * (result.qubits + 12);
}

export function compactResult(result: EstimateResult): EstimateResult {
  if (histogramBytes(result) <= MAX_RESULT_JSON_BYTES) return result;
  return {
    ...result,
    groups: result.groups.map(({ counts, ...group }) => ({
      ...group,
      distinctOutcomes: group.distinctOutcomes ?? (counts ? Object.keys(counts).length : undefined),
    })),
  };
}

/**
 * Shots actually drawn: every parameter point's (grid or list), or the single estimate's,
 * each with the shots of its gradient's parameter-shifted circuits.
 */
export function shotsDrawn(result: EstimateResult): number {
  if (result.sweep)
    return result.sweep.points.reduce(
      (sum, p) => sum + (p.sampled?.shots ?? 0) + (p.gradientShots ?? 0),
      0,
    );
  return (result.sampled?.shots ?? 0) + (result.gradientShots ?? 0);
}

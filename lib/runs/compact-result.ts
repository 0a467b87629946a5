/**
 * Keeps a stored result within a safe row size. Histograms are the only part
 * that grows with shots × qubits; above 8 MB of JSON they are dropped (each
 * group keeps `distinctOutcomes`), everything the UI reads stays.
 */
import type { EstimateResult } from "@/lib/quantum/schemas";

export const MAX_RESULT_JSON_BYTES = 8 * 1024 * 1024;

export function compactResult(result: EstimateResult): EstimateResult {
  if (JSON.stringify(result).length <= MAX_RESULT_JSON_BYTES) return result;
  return {
    ...result,
    groups: result.groups.map(({ counts, ...group }) => ({
      ...group,
      distinctOutcomes: group.distinctOutcomes ?? (counts ? Object.keys(counts).length : undefined),
    })),
  };
}

/** Shots actually drawn: every sweep point's, or the single estimate's. */
export function shotsDrawn(result: EstimateResult): number {
  if (result.sweep) return result.sweep.points.reduce((sum, p) => sum + (p.sampled?.shots ?? 0), 0);
  return result.sampled?.shots ?? 0;
}

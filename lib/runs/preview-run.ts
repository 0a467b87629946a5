/**
 * The cheap part of a submission: the engine's preview (parse, qubits, gate
 * counts, settings, shot plan — no simulation), run on a preview thread with
 * caps and a time budget, and the quota verdict for the organisation's plan.
 * Engine errors become 400 problems; caps and the budget 422.
 */
import "server-only";
import { ProblemError } from "@/lib/api/problem";
import { isEngineError } from "@/lib/quantum/errors";
import type { EstimateRequest, PreviewResult } from "@/lib/quantum/schemas";
import { quotaVerdict } from "@/lib/usage/quotas";
import { assertPreviewCaps, assertSourceCaps } from "./preview-caps";
import { previewPool } from "./preview-pool";
import { engineProblem } from "./problems";
import type { ShotPlanSource } from "./constants";
import type { QuotaVerdict } from "./schemas";

/**
 * The engine's preview, computed off the event loop (lib/runs/preview-pool.ts)
 * within the caps (lib/runs/preview-caps.ts) and the time budget.
 */
export async function previewOrThrow(request: EstimateRequest): Promise<PreviewResult> {
  assertSourceCaps(request);
  let preview: PreviewResult;
  try {
    preview = await previewPool().run(request);
  } catch (error) {
    if (isEngineError(error)) throw new ProblemError(engineProblem(error));
    throw error;
  }
  assertPreviewCaps(preview);
  return preview;
}

/**
 * Total shots a run will draw over all sweep points. With `targetPrecision` the
 * preview plans from the state's exact variances when it could simulate the state
 * within its work budget (then exactly what the run draws), else from worst-case
 * bounds (at least what the run draws); usage meters the shots actually drawn.
 */
export function plannedShots(preview: PreviewResult): number {
  return preview.totalShots;
}

/** Where the planned shots come from (stored with the run as `shotsPlan`). */
export function shotPlanSource(preview: PreviewResult): ShotPlanSource {
  return preview.shotPlan === null ? "fixed" : preview.varianceSource;
}

export async function previewRun(
  org: { id: string; plan: string },
  request: EstimateRequest,
): Promise<PreviewResult & { quota: QuotaVerdict }> {
  const preview = await previewOrThrow(request);
  const quota = await quotaVerdict(org.id, org.plan, {
    method: preview.method,
    qubits: preview.qubits,
    shots: plannedShots(preview),
  });
  return { ...preview, quota };
}

/**
 * The cheap part of a submission: the engine's preview (parse, qubits, gate
 * counts, settings, shot plan — no simulation), run on a preview thread with
 * caps and a time budget, and the quota verdict for the organisation's plan.
 * Engine errors become 400 problems; caps and the budget 422.
 *
 * The preview endpoint also answers the circuit's outline (what the new-run page
 * draws), computed on the same thread from the same parse: with the preview, in
 * the problem when something other than the circuit is wrong, or alone for a
 * circuit-only request.
 */
import "server-only";
import { isProblemError, ProblemError, validationFailed, zodFieldErrors } from "@/lib/api/problem";
import type { CircuitOutline, EstimateRequest, PreviewResult } from "@/lib/quantum/schemas";
import { quotaVerdict } from "@/lib/usage/quotas";
import { assertPreviewCaps, assertSourceCaps } from "./preview-caps";
import { previewPool } from "./preview-pool";
import { engineProblem } from "./problems";
import type { ShotPlanSource } from "./constants";
import {
  circuitPreviewRequestSchema,
  engineRequestOf,
  runCreateSchema,
  type CircuitPreview,
  type CircuitPreviewRequest,
  type RunPreview,
} from "./schemas";

/**
 * The engine's preview, computed off the event loop (lib/runs/preview-pool.ts)
 * within the caps (lib/runs/preview-caps.ts) and the time budget.
 */
export async function previewOrThrow(request: EstimateRequest): Promise<PreviewResult> {
  assertSourceCaps(request);
  const { preview, error } = await previewPool().check(request, "preview");
  if (error) throw new ProblemError(engineProblem(error));
  if (!preview) throw new Error("the preview thread answered without a preview");
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

/** The problem with the circuit's outline as an extension member (when there is one). */
function outlined(error: unknown, outline: CircuitOutline | null): unknown {
  if (!outline || !isProblemError(error)) return error;
  const { problem } = error;
  return new ProblemError({ ...problem, extensions: { ...problem.extensions, outline } });
}

/** The outline of a body that failed its schema, when its circuit part alone is fine. */
async function outlineOfDraft(body: unknown): Promise<CircuitOutline | null> {
  const draft = (typeof body === "object" && body !== null ? body : {}) as Record<string, unknown>;
  const parsed = circuitPreviewRequestSchema.safeParse({
    circuit: draft.circuit,
    parameters: draft.parameters,
  });
  if (!parsed.success) return null;
  try {
    assertSourceCaps(parsed.data);
    return (await previewPool().check(parsed.data, "outline")).outline;
  } catch {
    return null; // Over a cap, over the budget, or the pool is busy: the problem stands alone.
  }
}

/**
 * `POST /api/v1/runs/preview`: the preview, the quota verdict and the circuit's outline
 * of a run body. A failure is a problem that carries `outline` whenever the circuit
 * itself could be read, so a client can draw it while the rest is still being written.
 */
export async function previewRun(
  org: { id: string; plan: string },
  body: unknown,
): Promise<RunPreview> {
  const parsed = runCreateSchema.safeParse(body);
  if (!parsed.success) {
    const problem = validationFailed(
      "The request body does not match the schema.",
      zodFieldErrors(parsed.error),
    );
    throw outlined(problem, await outlineOfDraft(body));
  }
  const request = engineRequestOf(parsed.data);
  assertSourceCaps(request);
  const { preview, outline, error } = await previewPool().check(request, "both");
  if (error) throw outlined(new ProblemError(engineProblem(error)), outline);
  if (!preview) throw new Error("the preview thread answered without a preview");
  try {
    assertPreviewCaps(preview);
  } catch (capError) {
    throw outlined(capError, outline);
  }
  const quota = await quotaVerdict(org.id, org.plan, {
    method: preview.method,
    qubits: preview.qubits,
    shots: plannedShots(preview),
  });
  return { ...preview, quota, outline };
}

/** `POST /api/v1/runs/preview?only=circuit`: the circuit's outline alone (its errors as 400). */
export async function previewCircuit(input: CircuitPreviewRequest): Promise<CircuitPreview> {
  assertSourceCaps(input);
  const { outline, error } = await previewPool().check(input, "outline");
  if (error) throw new ProblemError(engineProblem(error));
  if (!outline) throw new Error("the preview thread answered without an outline");
  return { outline };
}

/**
 * Submitting a run: rate limit → idempotency → engine preview (cheap) →
 * quota → insert `queued` row → enqueue the job (id = run id).
 *
 * Nothing is left half-written: when Redis does not take the job, the row is
 * deleted again and the caller gets 503 (a retry with the same
 * Idempotency-Key then starts afresh). A repeated Idempotency-Key returns the
 * original run; the same key with a different body is 422.
 */
import "server-only";
import { randomInt, randomUUID } from "node:crypto";
import type { Run } from "@/db/schema";
import { ProblemError } from "@/lib/api/problem";
import type { Actor } from "@/lib/api/with-org";
import type { OrgSummary } from "@/lib/orgs/queries";
import { enqueue, QueueUnavailableError } from "@/lib/queue/enqueue";
import { MAX_SEED } from "@/lib/quantum/estimate/limits";
import type { PreviewResult } from "@/lib/quantum/schemas";
import { consume } from "@/lib/rate-limit";
import { assertAllowed, quotaVerdict } from "@/lib/usage/quotas";
import { runSubmitBudget } from "./limits";
import { deleteUnqueuedRun, insertRun } from "./mutations";
import { plannedShots, previewOrThrow, shotPlanSource } from "./preview-run";
import { findRunByIdempotencyKey } from "./queries";
import { requestHash } from "./request-hash";
import { engineRequestOf, type RunCreateInput } from "./schemas";
import { plural } from "@/lib/format";

export type SubmitResult = { run: Run; replayed: boolean };

/** The person behind the actor: a key counts against the user who created it. */
export function personKey(actor: Actor): string {
  if (actor.kind === "user") return `u:${actor.userId}`;
  return actor.createdById ? `u:${actor.createdById}` : `k:${actor.apiKeyId}`;
}

function replay(run: Run, hash: string): SubmitResult {
  if (run.requestHash !== hash) {
    throw new ProblemError({
      type: "/problems/idempotency-key-reused",
      title: "Idempotency-Key reused",
      status: 422,
      detail: `This Idempotency-Key was already used for run ${run.id} with a different request body. Use a new key for a new run.`,
    });
  }
  return { run, replayed: true };
}

export function defaultRunName(preview: PreviewResult): string {
  const method = preview.method === "density_matrix" ? "density-matrix" : "statevector";
  const terms = preview.observable.terms;
  return `${preview.qubits}-qubit ${method} run, ${plural(terms, "term")}`;
}

export async function submitRun(
  org: OrgSummary,
  actor: Actor,
  input: RunCreateInput,
  idempotencyKey: string | null,
): Promise<SubmitResult> {
  await consume("run-submit", runSubmitBudget(), personKey(actor), "Too many runs submitted.");
  const request = engineRequestOf(input);
  const hash = requestHash(input);
  if (idempotencyKey) {
    const existing = await findRunByIdempotencyKey(org.id, idempotencyKey);
    if (existing) return replay(existing, hash);
  }

  const preview = await previewOrThrow(request);
  const shots = plannedShots(preview);
  assertAllowed(
    await quotaVerdict(org.id, org.plan, { method: preview.method, qubits: preview.qubits, shots }),
  );

  const id = randomUUID();
  const run = await insertRun(org.id, {
    id,
    name: input.name ?? defaultRunName(preview),
    request,
    method: preview.method,
    qubits: preview.qubits,
    shots,
    shotsPlan: shotPlanSource(preview),
    seed: request.seed ?? randomInt(0, MAX_SEED + 1),
    idempotencyKey,
    requestHash: hash,
    createdByUserId: actor.kind === "user" ? actor.userId : actor.createdById,
    createdByApiKeyId: actor.kind === "api_key" ? actor.apiKeyId : null,
  });
  if (!run) {
    // Another request with the same key won the insert a moment ago.
    const existing = await findRunByIdempotencyKey(org.id, idempotencyKey!);
    if (!existing) throw new Error("idempotency key conflict without a run");
    return replay(existing, hash);
  }

  try {
    await enqueue("run.execute", { orgId: org.id, runId: id }, { jobId: id });
  } catch (error) {
    if (!(error instanceof QueueUnavailableError)) throw error;
    await deleteUnqueuedRun(org.id, id);
    console.error(`[ketwise] enqueue of run ${id} failed; the run was not created`, error.cause);
    throw new ProblemError({
      type: "/problems/queue-unavailable",
      title: "Service unavailable",
      status: 503,
      detail:
        "Runs cannot be queued right now (the job queue is unreachable). Nothing was created; try again shortly.",
      retryAfter: 5,
    });
  }
  return { run, replayed: false };
}

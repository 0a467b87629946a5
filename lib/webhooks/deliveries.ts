/**
 * Webhook deliveries in the worker.
 *
 * `webhook.fanout` (one per terminal run): one delivery row per enabled endpoint of
 * the run's organisation (unique per endpoint and run, so a repeated fan-out adds
 * nothing), its JSON body fixed now, and one `webhook.deliver` job each.
 *
 * `webhook.deliver`: one signed POST (./signature.ts) through the SSRF guard
 * (./outbound.ts), recorded as a `webhook_attempts` row. A 2xx answer marks the
 * delivery delivered; anything else throws so BullMQ retries with exponential
 * backoff (WEBHOOK_RETRY_BASE_MS, doubled each time) until WEBHOOK_MAX_ATTEMPTS, after
 * which it is failed. A refused destination fails at once (retrying cannot help);
 * a disabled or deleted endpoint stops its pending deliveries.
 */
import "server-only";
import { and, eq } from "drizzle-orm";
import { db } from "@/db";
import { webhookAttempts, webhookDeliveries, webhookEndpoints, type Run } from "@/db/schema";
import { env } from "@/lib/env";
import { enqueue } from "@/lib/queue/enqueue";
import {
  webhookDeliverSchema,
  type WebhookDeliverJob,
  type WebhookFanoutJob,
} from "@/lib/queue/jobs";
import { findRun } from "@/lib/runs/queries";
import { allowedNetworks } from "./mutations";
import { checkDestination, DestinationRefused, postToDestination } from "./outbound";
import { RUN_FINISHED_EVENT } from "./schemas";
import { decryptSecret } from "./secret";
import { webhookHeaders } from "./signature";

/** Thrown to make BullMQ retry a delivery whose attempt did not get a 2xx answer. */
export class DeliveryAttemptFailed extends Error {
  constructor(message: string) {
    super(message);
    this.name = "DeliveryAttemptFailed";
  }
}

type ResultSummary = {
  exact?: { value: number };
  ideal?: { value: number };
  sampled?: { mean: number; stdErr: number } | null;
};

/** The `run.finished` event body: the run's headline, never its request or full result. */
export function runFinishedBody(
  deliveryId: string,
  run: Run,
  appUrl: string,
  now = new Date(),
): string {
  const result = run.result as ResultSummary | null;
  return JSON.stringify({
    id: deliveryId,
    type: RUN_FINISHED_EVENT,
    createdAt: now.toISOString(),
    data: {
      run: {
        id: run.id,
        name: run.name,
        status: run.status,
        method: run.method,
        qubits: run.qubits,
        shots: run.shots,
        seed: run.seed,
        queuedAt: run.queuedAt.toISOString(),
        startedAt: run.startedAt?.toISOString() ?? null,
        finishedAt: run.finishedAt?.toISOString() ?? null,
        summary:
          run.status === "succeeded" && result?.exact && result.ideal
            ? {
                ideal: result.ideal.value,
                exact: result.exact.value,
                sampledMean: result.sampled?.mean ?? null,
                sampledStdErr: result.sampled?.stdErr ?? null,
              }
            : null,
        error: run.error ?? null,
        links: { api: `${appUrl}/api/v1/runs/${run.id}`, page: `${appUrl}/app/runs/${run.id}` },
      },
    },
  });
}

const deliverOptions = (deliveryId: string) => ({
  jobId: `whd-${deliveryId}`,
  attempts: env.WEBHOOK_MAX_ATTEMPTS,
  backoffMs: env.WEBHOOK_RETRY_BASE_MS,
});

export async function fanOutRunFinished(job: WebhookFanoutJob): Promise<number> {
  const run = await findRun(job.orgId, job.runId);
  if (!run) return 0;
  const endpoints = await db
    .select({ id: webhookEndpoints.id })
    .from(webhookEndpoints)
    .where(and(eq(webhookEndpoints.orgId, job.orgId), eq(webhookEndpoints.enabled, true)));
  for (const endpoint of endpoints) {
    const id = crypto.randomUUID();
    await db
      .insert(webhookDeliveries)
      .ignore()
      .values({
        id,
        orgId: job.orgId,
        endpointId: endpoint.id,
        runId: run.id,
        event: RUN_FINISHED_EVENT,
        body: runFinishedBody(id, run, env.APP_URL),
      });
    // The row that exists now (ours, or one a previous try of this fan-out made).
    const [row] = await db
      .select({ id: webhookDeliveries.id, status: webhookDeliveries.status })
      .from(webhookDeliveries)
      .where(
        and(
          eq(webhookDeliveries.orgId, job.orgId),
          eq(webhookDeliveries.endpointId, endpoint.id),
          eq(webhookDeliveries.runId, run.id),
        ),
      );
    if (row?.status === "pending")
      await enqueue(
        "webhook.deliver",
        { orgId: job.orgId, deliveryId: row.id },
        deliverOptions(row.id),
      );
  }
  return endpoints.length;
}

async function record(
  orgId: string,
  deliveryId: string,
  attempt: number,
  outcome: { status: number | null; error: string | null; durationMs: number },
  next: "delivered" | "failed" | "pending",
): Promise<void> {
  await db.transaction(async (tx) => {
    await tx
      .insert(webhookAttempts)
      .ignore()
      .values({
        orgId,
        deliveryId,
        attempt,
        responseStatus: outcome.status,
        error: outcome.error?.slice(0, 255) ?? null,
        durationMs: outcome.durationMs,
      });
    await tx
      .update(webhookDeliveries)
      .set({
        status: next,
        attempts: attempt,
        lastResponseStatus: outcome.status,
        lastError: outcome.error?.slice(0, 255) ?? null,
        lastAttemptAt: new Date(),
      })
      .where(and(eq(webhookDeliveries.orgId, orgId), eq(webhookDeliveries.id, deliveryId)));
  });
}

/**
 * One attempt of a delivery; `final` when the queue will not retry it again.
 * Returns what happened; throws DeliveryAttemptFailed when BullMQ should retry.
 */
export async function deliverWebhook(
  job: WebhookDeliverJob,
  final: boolean,
): Promise<"delivered" | "failed" | "skipped"> {
  const [row] = await db
    .select({ delivery: webhookDeliveries, endpoint: webhookEndpoints })
    .from(webhookDeliveries)
    .innerJoin(webhookEndpoints, eq(webhookEndpoints.id, webhookDeliveries.endpointId))
    .where(and(eq(webhookDeliveries.orgId, job.orgId), eq(webhookDeliveries.id, job.deliveryId)));
  if (!row || row.delivery.status !== "pending") return "skipped";
  const { delivery, endpoint } = row;
  const attempt = delivery.attempts + 1;
  if (!endpoint.enabled) {
    await db
      .update(webhookDeliveries)
      .set({
        status: "failed",
        lastError: "the endpoint was disabled before this delivery succeeded",
      })
      .where(and(eq(webhookDeliveries.orgId, job.orgId), eq(webhookDeliveries.id, delivery.id)));
    return "skipped";
  }
  let dest;
  try {
    dest = await checkDestination(endpoint.url, allowedNetworks());
  } catch (error) {
    if (!(error instanceof DestinationRefused)) throw error;
    await record(
      job.orgId,
      delivery.id,
      attempt,
      { status: null, error: `refused: ${error.message}`, durationMs: 0 },
      "failed",
    );
    return "failed";
  }
  const headers = webhookHeaders(decryptSecret(endpoint.secretCipher), delivery.id, delivery.body);
  const outcome = await postToDestination(dest, delivery.body, headers, env.WEBHOOK_TIMEOUT_MS);
  const ok =
    outcome.status !== null && outcome.status >= 200 && outcome.status < 300 && !outcome.error;
  await record(
    job.orgId,
    delivery.id,
    attempt,
    outcome,
    ok ? "delivered" : final ? "failed" : "pending",
  );
  if (ok) return "delivered";
  if (final) return "failed";
  throw new DeliveryAttemptFailed(
    `delivery ${delivery.id} attempt ${attempt}: ${outcome.error ?? `answered ${outcome.status}`}`,
  );
}

/**
 * The worker's `failed` hook: a `webhook.deliver` job that failed its LAST attempt
 * did so with an internal error (database or Redis down — HTTP answers are recorded
 * by deliverWebhook and never fail the last attempt), so its delivery would stay
 * `pending` forever. It is marked failed. True when this call changed it.
 */
export async function failDeliveryAfterRetries(job: {
  name: string;
  data: unknown;
  attemptsMade: number;
  opts: { attempts?: number };
}): Promise<boolean> {
  if (job.name !== "webhook.deliver" || job.attemptsMade < (job.opts.attempts ?? 1)) return false;
  const payload = webhookDeliverSchema.safeParse(job.data);
  if (!payload.success) return false;
  const [result] = await db
    .update(webhookDeliveries)
    .set({
      status: "failed",
      lastError: "given up after an internal error on our side",
      lastAttemptAt: new Date(),
    })
    .where(
      and(
        eq(webhookDeliveries.orgId, payload.data.orgId),
        eq(webhookDeliveries.id, payload.data.deliveryId),
        eq(webhookDeliveries.status, "pending"),
      ),
    );
  return result.affectedRows > 0;
}

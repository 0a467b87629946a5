/**
 * The job catalogue: every job name with the zod schema of its payload. The
 * producer (lib/queue/enqueue.ts) validates before adding; the worker's
 * registry validates again before running the handler (a malformed job is
 * dropped with a log line, never retried).
 */
import { z } from "zod";

export const RUNS_QUEUE = "ketwise-runs";

/** The API request that queued the job (its `X-Request-Id`), carried into the worker's log lines. */
const requestId = z
  .string()
  .regex(/^[A-Za-z0-9._-]{8,64}$/)
  .optional();

export const runJobSchema = z.strictObject({
  orgId: z.uuid(),
  runId: z.uuid(),
  requestId,
});
export type RunJob = z.infer<typeof runJobSchema>;

export const runFinishedMailSchema = z.strictObject({
  orgId: z.uuid(),
  runId: z.uuid(),
  requestId,
});
export type RunFinishedMailJob = z.infer<typeof runFinishedMailSchema>;

/** Report one finished period's overage of one organisation (lib/billing/overage.ts). */
export const overageJobSchema = z.strictObject({
  orgId: z.uuid(),
  period: z.string().regex(/^\d{4}-(0[1-9]|1[0-2])$/),
  requestId,
});
export type OverageJob = z.infer<typeof overageJobSchema>;

/** Make one delivery per enabled webhook endpoint for a run that became terminal (lib/webhooks/deliveries.ts). */
export const webhookFanoutSchema = z.strictObject({
  orgId: z.uuid(),
  runId: z.uuid(),
  status: z.enum(["succeeded", "failed", "canceled"]),
  requestId,
});
export type WebhookFanoutJob = z.infer<typeof webhookFanoutSchema>;

/** One signed POST of a delivery; retried with WEBHOOK_MAX_ATTEMPTS / WEBHOOK_RETRY_BASE_MS. */
export const webhookDeliverSchema = z.strictObject({
  orgId: z.uuid(),
  deliveryId: z.uuid(),
  requestId,
});
export type WebhookDeliverJob = z.infer<typeof webhookDeliverSchema>;

export const JOB_SCHEMAS = {
  "run.execute": runJobSchema,
  "run.finished-mail": runFinishedMailSchema,
  "billing.report-overage": overageJobSchema,
  "webhook.fanout": webhookFanoutSchema,
  "webhook.deliver": webhookDeliverSchema,
} as const;

export type JobName = keyof typeof JOB_SCHEMAS;
export type JobPayload<N extends JobName> = z.infer<(typeof JOB_SCHEMAS)[N]>;

/**
 * Retry policy for infrastructure faults (database or Redis unreachable, a
 * crashed engine thread): 5 attempts with exponential backoff 1 s, 2 s, 4 s,
 * 8 s. User errors never throw out of a handler, so they are never retried.
 */
export const JOB_ATTEMPTS = 5;
export const JOB_BACKOFF = { type: "exponential", delay: 1_000 } as const;

/** Stalled-job recovery: a job whose worker stopped renewing its lock is re-queued after ≤ lock + interval. */
export const LOCK_DURATION_MS = 10_000;
export const STALLED_INTERVAL_MS = 5_000;
export const MAX_STALLED_COUNT = 2;

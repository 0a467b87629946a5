/**
 * The job registry: job name → payload schema (lib/queue/jobs.ts) → handler.
 * Handlers are thin and call lib/. A job with an unknown name or a payload
 * that does not validate is dropped with a log line (retrying cannot fix it).
 */
import { DelayedError, type Job } from "bullmq";
import type { z } from "zod";
import { withLogContext } from "@/lib/observability/logger";
import { JOB_SCHEMAS, type JobName, type JobPayload } from "@/lib/queue/jobs";
import type { EngineRunner } from "@/lib/runs/engine-runner";
import { executeRun } from "@/lib/runs/execute-run";
import { sendRunFinishedMail } from "@/lib/runs/notify";
import { deliverWebhook, fanOutRunFinished } from "@/lib/webhooks/deliveries";
import { reportOverageJob } from "./jobs/billing-overage";
import { log } from "./log";
import { WaitingRuns } from "./waiting-runs";

/** How long a run waits before trying again for one of its organisation's run slots. */
export const SLOT_RETRY_MS = 250;

type Context = { job: Job; token: string | undefined };
type Handler<N extends JobName> = (payload: JobPayload<N>, ctx: Context) => Promise<unknown>;
type Entry<N extends JobName> = { schema: z.ZodType<JobPayload<N>>; handler: Handler<N> };
export type Registry = { [N in JobName]: Entry<N> };

export function buildRegistry(deps: { engine: EngineRunner }): Registry {
  const waiting = new WaitingRuns();
  return {
    "run.execute": {
      schema: JOB_SCHEMAS["run.execute"],
      handler: async (payload, { job, token }) => {
        const outcome = await executeRun(payload, deps.engine, log);
        if (outcome.kind === "busy") {
          // The plan's concurrent-run slots are full: wait without spending an attempt.
          if (waiting.mark(payload.runId))
            log(
              `run ${payload.runId}: waiting for a slot (${outcome.running} of ${outcome.limit} running)`,
            );
          await job.moveToDelayed(Date.now() + SLOT_RETRY_MS, token);
          throw new DelayedError();
        }
        waiting.clear(payload.runId);
        if (outcome.kind !== "missing") log(`run ${payload.runId}: ${outcome.kind}`);
        return outcome.kind;
      },
    },
    "run.finished-mail": {
      schema: JOB_SCHEMAS["run.finished-mail"],
      handler: async (payload) => sendRunFinishedMail(payload),
    },
    "billing.report-overage": {
      schema: JOB_SCHEMAS["billing.report-overage"],
      handler: async (payload) => reportOverageJob(payload),
    },
    "webhook.fanout": {
      schema: JOB_SCHEMAS["webhook.fanout"],
      handler: async (payload) => {
        const endpoints = await fanOutRunFinished(payload);
        if (endpoints) log(`run ${payload.runId}: ${endpoints} webhook delivery(ies) queued`);
        return endpoints;
      },
    },
    "webhook.deliver": {
      schema: JOB_SCHEMAS["webhook.deliver"],
      handler: async (payload, { job }) => {
        const outcome = await deliverWebhook(
          payload,
          job.attemptsMade + 1 >= (job.opts.attempts ?? 1),
        );
        if (outcome !== "skipped") log(`webhook delivery ${payload.deliveryId}: ${outcome}`);
        return outcome;
      },
    },
  };
}

/** Validates and dispatches one job. */
export async function dispatch(
  registry: Registry,
  job: Job,
  token: string | undefined,
): Promise<unknown> {
  const entry = registry[job.name as JobName] as Entry<JobName> | undefined;
  if (!entry) {
    log(`dropping job ${job.id}: unknown job name "${job.name}"`);
    return "dropped";
  }
  const parsed = entry.schema.safeParse(job.data);
  if (!parsed.success) {
    log(
      `dropping job ${job.id} (${job.name}): malformed payload: ${parsed.error.issues.map((i) => i.message).join("; ")}`,
    );
    return "dropped";
  }
  const { requestId, orgId } = parsed.data;
  const runId = "runId" in parsed.data ? parsed.data.runId : undefined;
  return withLogContext({ requestId, orgId, runId, jobId: job.id }, () =>
    (entry.handler as Handler<JobName>)(parsed.data, { job, token }),
  );
}

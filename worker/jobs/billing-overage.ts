/**
 * Overage reporting in the worker: a pass every hour (first one a minute after
 * start) finds finished periods with unsettled usage and queues one
 * `billing.report-overage` job per (organisation, period) — job id
 * `overage-<org>-<period>`, so passes never queue it twice while it waits.
 * The job retries with the queue's backoff (lib/queue/jobs.ts) when the
 * provider is unreachable; lib/billing/overage.ts makes repeats harmless.
 */
import { findUnreportedPeriods, reportOverage } from "@/lib/billing/overage";
import { enqueue } from "@/lib/queue/enqueue";
import type { OverageJob } from "@/lib/queue/jobs";
import { log } from "../log";

const PASS_EVERY_MS = 60 * 60_000;

export async function reportOverageJob(job: OverageJob): Promise<string> {
  const outcome = await reportOverage(job.orgId, job.period);
  const what =
    outcome.skipped ??
    (outcome.sent.map((s) => `${s.metric} ${s.quantity}`).join(", ") || "no overage");
  log(`overage ${job.orgId} ${job.period}: ${what}`);
  return what;
}

export async function queueOveragePass(): Promise<number> {
  const due = await findUnreportedPeriods();
  for (const { orgId, period } of due)
    await enqueue(
      "billing.report-overage",
      { orgId, period },
      { jobId: `overage-${orgId}-${period}` },
    );
  return due.length;
}

export function startOverageScheduler(): { stop: () => void } {
  const pass = () =>
    queueOveragePass().then(
      (n) => n && log(`overage pass: ${n} period(s) queued`),
      (error: unknown) => log("overage pass failed", error),
    );
  const first = setTimeout(pass, 60_000);
  const timer = setInterval(pass, PASS_EVERY_MS);
  return {
    stop() {
      clearTimeout(first);
      clearInterval(timer);
    },
  };
}

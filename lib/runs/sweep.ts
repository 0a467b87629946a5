/**
 * Safety net for runs whose job went missing (a crash between insert and
 * enqueue, Redis data loss, a final failure that could not be written).
 * Maintenance across organisations — only the worker's sweeper calls it.
 *
 * - queued for over RUN_QUEUED_GRACE_SECONDS (default 60) with no job in the
 *   queue → enqueued again;
 * - running past its plan's time limit + 2 minutes with no active job →
 *   failed with a clear problem.
 */
import "server-only";
import { and, eq, inArray, lt, or } from "drizzle-orm";
import { db } from "@/db";
import { organizations, runs } from "@/db/schema";
import { getPlan, isPlanId } from "@/lib/billing/plans";
import { env } from "@/lib/env";
import { enqueue, getRunsQueue } from "@/lib/queue/enqueue";
import { failUnfinishedRun } from "./execution-mutations";
import { infrastructureProblem } from "./problems";

const RUNNING_GRACE_MS = 120_000;

export async function sweepOrphanRuns(
  now = new Date(),
): Promise<{ requeued: number; failed: number }> {
  const longestRunMs = 3_600_000 + RUNNING_GRACE_MS;
  const rows = await db
    .select({
      id: runs.id,
      orgId: runs.orgId,
      status: runs.status,
      startedAt: runs.startedAt,
      plan: organizations.plan,
    })
    .from(runs)
    .innerJoin(organizations, eq(organizations.id, runs.orgId))
    .where(
      or(
        and(
          eq(runs.status, "queued"),
          lt(runs.queuedAt, new Date(now.getTime() - env.RUN_QUEUED_GRACE_SECONDS * 1000)),
        ),
        and(
          inArray(runs.status, ["running"]),
          lt(runs.startedAt, new Date(now.getTime() - RUNNING_GRACE_MS)),
        ),
      ),
    )
    .limit(200);
  let requeued = 0;
  let failed = 0;
  const queue = getRunsQueue();
  for (const row of rows) {
    const job = await queue.getJob(row.id);
    const state = job ? await job.getState() : "missing";
    if (row.status === "queued" && (state === "missing" || state === "completed")) {
      if (job) await job.remove();
      await enqueue("run.execute", { orgId: row.orgId, runId: row.id }, { jobId: row.id });
      requeued++;
    } else if (
      row.status === "running" &&
      state !== "active" &&
      state !== "waiting" &&
      state !== "delayed"
    ) {
      const limitMs =
        (isPlanId(row.plan) ? getPlan(row.plan).limits.maxRunSeconds * 1000 : longestRunMs) +
        RUNNING_GRACE_MS;
      if (row.startedAt && now.getTime() - row.startedAt.getTime() > limitMs) {
        const changed = await failUnfinishedRun(
          row.orgId,
          row.id,
          infrastructureProblem(1, "its job was lost"),
        );
        if (changed) failed++;
      }
    } else if (row.status === "queued" && state === "failed") {
      if (
        await failUnfinishedRun(
          row.orgId,
          row.id,
          infrastructureProblem(job?.attemptsMade ?? 1, "it could not be started"),
        )
      )
        failed++;
    }
  }
  return { requeued, failed };
}

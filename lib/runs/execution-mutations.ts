/**
 * The worker's writes to a run. Exactly-once comes from two guards:
 * - `attempts` is a fencing token: claiming increments it, and progress and
 *   the final write only apply while the run is still `running` with the same
 *   attempt (a superseded attempt — e.g. after stalled-job recovery — writes
 *   nothing);
 * - usage rows are unique per (run, metric) and written with INSERT IGNORE in
 *   the same transaction as the final status.
 */
import "server-only";
import { and, count, eq, inArray } from "drizzle-orm";
import { db } from "@/db";
import { organizations, runs, type Run, type StoredProblem } from "@/db/schema";
import { getPlan, type Plan } from "@/lib/billing/plans";
import { recordRunUsage, type RunUsage } from "@/lib/usage/mutations";
import { periodOf } from "@/lib/usage/period";
import { isTerminalStatus, type RunStatus } from "./constants";
import { announceRunFinished } from "./run-events";

export type ClaimResult =
  | { kind: "missing" }
  | { kind: "terminal"; status: RunStatus }
  | { kind: "busy"; running: number; limit: number }
  | { kind: "claimed"; run: Run; attempt: number; plan: Plan; redelivered: boolean };

/**
 * Marks a run `running` for a new attempt, without a transaction:
 * 1. read the run with its organisation's plan;
 * 2. compare-and-set status and attempts (a cancel or another worker in
 *    between makes it miss, and the claim is re-read);
 * 3. for a run that was queued, count the organisation's running runs; above
 *    the plan's `concurrentRuns` the claim is undone and the run waits. Two
 *    workers racing for the last slot may both back off; they retry after a
 *    short delay. A run already `running` is a re-delivery (crash, stall) and
 *    keeps its slot;
 * 4. re-check that the claim still stands (a cancel may have landed between
 *    2 and 3), so a run canceled before it started never reaches the engine.
 */
export async function claimRun(orgId: string, runId: string): Promise<ClaimResult> {
  for (let tries = 0; tries < 3; tries++) {
    const [row] = await db
      .select({ run: runs, plan: organizations.plan })
      .from(runs)
      .innerJoin(organizations, eq(organizations.id, runs.orgId))
      .where(and(eq(runs.orgId, orgId), eq(runs.id, runId)));
    if (!row) return { kind: "missing" };
    const { run } = row;
    if (isTerminalStatus(run.status)) return { kind: "terminal", status: run.status };
    const plan = getPlan(row.plan);
    const redelivered = run.status === "running";
    const attempt = run.attempts + 1;
    const startedAt = new Date();
    const [claimed] = await db
      .update(runs)
      .set({ status: "running", attempts: attempt, startedAt, progress: 0, phase: "starting" })
      .where(
        and(
          eq(runs.orgId, orgId),
          eq(runs.id, runId),
          eq(runs.status, run.status),
          eq(runs.attempts, run.attempts),
        ),
      );
    if (claimed.affectedRows === 0) continue; // changed under us: read again
    if (!redelivered) {
      const [{ running }] = await db
        .select({ running: count() })
        .from(runs)
        .where(and(eq(runs.orgId, orgId), eq(runs.status, "running")));
      if (running > plan.limits.concurrentRuns) {
        const [undone] = await db
          .update(runs)
          .set({
            status: "queued",
            attempts: run.attempts,
            startedAt: null,
            progress: 0,
            phase: null,
          })
          .where(current(orgId, runId, attempt));
        if (undone.affectedRows === 0) continue; // canceled meanwhile: read again
        return { kind: "busy", running: running - 1, limit: plan.limits.concurrentRuns };
      }
      // A cancel between the compare-and-set and the count found the run
      // "running" and ended it: it never started, so it is not ours to run.
      const [still] = await db
        .select({ id: runs.id })
        .from(runs)
        .where(current(orgId, runId, attempt));
      if (!still) continue;
    }
    return {
      kind: "claimed",
      run: { ...run, status: "running", attempts: attempt, startedAt },
      attempt,
      plan,
      redelivered,
    };
  }
  throw new Error(`run ${runId} kept changing while it was being claimed`);
}

const current = (orgId: string, runId: string, attempt: number) =>
  and(
    eq(runs.orgId, orgId),
    eq(runs.id, runId),
    eq(runs.status, "running"),
    eq(runs.attempts, attempt),
  );

/** Writes progress; false when the run is no longer this attempt's (canceled or superseded). */
export async function writeProgress(
  orgId: string,
  runId: string,
  attempt: number,
  progress: number,
  phase: string,
) {
  const [result] = await db
    .update(runs)
    .set({ progress: Math.min(1, Math.max(0, progress)), phase: phase.slice(0, 64) })
    .where(current(orgId, runId, attempt));
  return result.affectedRows > 0;
}

/** True while the run is `running` under this attempt. */
export async function isCurrentAttempt(
  orgId: string,
  runId: string,
  attempt: number,
): Promise<boolean> {
  const rows = await db
    .select({ id: runs.id })
    .from(runs)
    .where(current(orgId, runId, attempt))
    .limit(1);
  return rows.length > 0;
}

export type RunFinish = {
  status: "succeeded" | "failed";
  result?: Record<string, unknown>;
  error?: StoredProblem;
  timings?: { parseMs: number; simulateMs: number; sampleMs: number };
  /** Shots the engine drew (succeeded runs): shown beside the planned shots, and billed. */
  shotsDrawn?: number;
  usage: RunUsage;
};

/**
 * Result, status, timings and usage rows in ONE transaction, applied only
 * while this attempt still owns the run. Returns false when it did not.
 * After the commit the finish is announced (waiters, webhooks).
 */
export async function finishRun(
  orgId: string,
  runId: string,
  attempt: number,
  finish: RunFinish,
): Promise<boolean> {
  const done = await db.transaction(async (tx) => {
    const finishedAt = new Date();
    const [result] = await tx
      .update(runs)
      .set({
        status: finish.status,
        progress: finish.status === "succeeded" ? 1 : undefined,
        phase: finish.status === "succeeded" ? "done" : "failed",
        result: finish.result ?? null,
        error: finish.error ?? null,
        finishedAt,
        ...(finish.shotsDrawn !== undefined ? { shotsDrawn: finish.shotsDrawn } : {}),
        ...(finish.timings ?? {}),
      })
      .where(current(orgId, runId, attempt));
    if (result.affectedRows === 0) return false;
    await recordRunUsage(tx, orgId, runId, periodOf(finishedAt), finish.usage);
    return true;
  });
  if (done) await announceRunFinished(orgId, runId, finish.status);
  return done;
}

/**
 * Meters the compute a canceled run consumed (once). Returns false, metering
 * nothing, when the run is not canceled — another attempt owns it now.
 */
export async function recordCanceledRunUsage(
  orgId: string,
  runId: string,
  simulationSeconds: number,
): Promise<boolean> {
  return db.transaction(async (tx) => {
    const [run] = await tx
      .select({ status: runs.status, finishedAt: runs.finishedAt })
      .from(runs)
      .where(and(eq(runs.orgId, orgId), eq(runs.id, runId)))
      .for("update");
    if (run?.status !== "canceled") return false;
    await recordRunUsage(tx, orgId, runId, periodOf(run.finishedAt ?? new Date()), {
      simulationSeconds,
    });
    return true;
  });
}

/** Fails a run that has not finished (malformed row, retries exhausted) and announces it. False if it already had. */
export async function failUnfinishedRun(
  orgId: string,
  runId: string,
  problem: StoredProblem,
): Promise<boolean> {
  const [result] = await db
    .update(runs)
    .set({ status: "failed", error: problem, finishedAt: new Date(), phase: "failed" })
    .where(
      and(eq(runs.orgId, orgId), eq(runs.id, runId), inArray(runs.status, ["queued", "running"])),
    );
  if (result.affectedRows === 0) return false;
  await announceRunFinished(orgId, runId, "failed");
  return true;
}

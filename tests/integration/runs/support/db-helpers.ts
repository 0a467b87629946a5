/** Direct database helpers for run tests (plan changes, raw rows, usage). */
import { randomUUID } from "node:crypto";
import { and, eq, inArray } from "drizzle-orm";
import { db } from "@/db";
import { organizations, runs, usageEvents } from "@/db/schema";
import { getRunsQueue } from "@/lib/queue/enqueue";
import { requestHash } from "@/lib/runs/request-hash";

export async function setPlan(orgId: string, plan: "sandbox" | "lab" | "institute"): Promise<void> {
  await db.update(organizations).set({ plan }).where(eq(organizations.id, orgId));
}

export async function runRow(orgId: string, runId: string) {
  const [row] = await db
    .select()
    .from(runs)
    .where(and(eq(runs.orgId, orgId), eq(runs.id, runId)));
  return row;
}

/** Inserts a queued run straight into the table, bypassing the API's checks (malformed-row tests). */
export async function insertRawRun(
  orgId: string,
  request: Record<string, unknown>,
  extra: Partial<typeof runs.$inferInsert> = {},
) {
  const id = randomUUID();
  await db.insert(runs).values({
    id,
    orgId,
    name: "raw",
    request,
    method: "statevector",
    qubits: 2,
    shots: 0,
    seed: 1,
    requestHash: requestHash(request),
    ...extra,
  });
  return id;
}

export async function usageOf(orgId: string, runId: string) {
  return db
    .select()
    .from(usageEvents)
    .where(and(eq(usageEvents.orgId, orgId), eq(usageEvents.runId, runId)));
}

/**
 * Cancels the organisations' queued runs and removes their jobs, so a test
 * file that queues runs without a worker leaves no work for later files.
 */
export async function cancelLeftoverRuns(orgIds: string[]): Promise<void> {
  const left = await db
    .select({ id: runs.id })
    .from(runs)
    .where(and(inArray(runs.orgId, orgIds), eq(runs.status, "queued")));
  if (left.length === 0) return;
  await db
    .update(runs)
    .set({ status: "canceled", finishedAt: new Date() })
    .where(
      inArray(
        runs.id,
        left.map((r) => r.id),
      ),
    );
  const queue = getRunsQueue();
  await Promise.all(left.map((r) => queue.remove(r.id).catch(() => 0)));
}

/**
 * Writes of runs from the request path: insert (idempotent on the key),
 * delete (a submission whose enqueue failed), cancel. The worker's writes are
 * in execution-mutations.ts. Every function takes the organisation id.
 */
import "server-only";
import { and, eq, inArray } from "drizzle-orm";
import { db } from "@/db";
import { runs, type NewRun, type Run } from "@/db/schema";
import { announceRunFinished } from "./run-events";

/** MariaDB's duplicate-key error (ER_DUP_ENTRY). */
export function isDuplicateKey(error: unknown): boolean {
  for (let e: unknown = error; e; e = (e as { cause?: unknown }).cause) {
    if (
      (e as { errno?: number }).errno === 1062 ||
      (e as { code?: string }).code === "ER_DUP_ENTRY"
    )
      return true;
  }
  return false;
}

type RunInsert = Omit<NewRun, "orgId" | "id" | "status" | "queuedAt"> & { id: string };

/** Inserts a queued run and returns it; null when another run already holds the idempotency key. */
export async function insertRun(orgId: string, values: RunInsert): Promise<Run | null> {
  const row: Run = {
    createdByUserId: null,
    createdByApiKeyId: null,
    shots: 0,
    shotsPlan: null,
    shotsDrawn: null,
    idempotencyKey: null,
    ...values,
    orgId,
    status: "queued",
    progress: 0,
    phase: null,
    error: null,
    result: null,
    attempts: 0,
    queuedAt: new Date(),
    startedAt: null,
    finishedAt: null,
    parseMs: null,
    simulateMs: null,
    sampleMs: null,
  };
  try {
    await db.insert(runs).values(row);
  } catch (error) {
    if (values.idempotencyKey && isDuplicateKey(error)) return null;
    throw error;
  }
  return row;
}

/** Removes a run that never reached the queue (its row must not linger as a queued orphan). */
export async function deleteUnqueuedRun(orgId: string, runId: string): Promise<void> {
  await db
    .delete(runs)
    .where(and(eq(runs.orgId, orgId), eq(runs.id, runId), eq(runs.status, "queued")));
}

/**
 * Cancels a queued or running run. Returns true when this call changed it (and
 * announces it); a running run's worker sees the status within a fraction of a
 * second and stops.
 */
export async function cancelRun(orgId: string, runId: string): Promise<boolean> {
  const [result] = await db
    .update(runs)
    .set({ status: "canceled", finishedAt: new Date(), phase: "canceled" })
    .where(
      and(eq(runs.orgId, orgId), eq(runs.id, runId), inArray(runs.status, ["queued", "running"])),
    );
  if (result.affectedRows === 0) return false;
  await announceRunFinished(orgId, runId, "canceled");
  return true;
}

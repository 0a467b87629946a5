/** Direct database helpers for run tests (plan changes, raw rows, usage). */
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { db } from "@/db";
import { organizations, runs, usageEvents } from "@/db/schema";
import { requestHash } from "@/lib/runs/request-hash";

export async function setPlan(orgId: string, plan: "sandbox" | "lab" | "institute"): Promise<void> {
  await db.update(organizations).set({ plan }).where(eq(organizations.id, orgId));
}

export async function runRow(orgId: string, runId: string) {
  const [row] = await db.select().from(runs).where(and(eq(runs.orgId, orgId), eq(runs.id, runId)));
  return row;
}

/** Inserts a queued run straight into the table, bypassing the API's checks (malformed-row tests). */
export async function insertRawRun(orgId: string, request: Record<string, unknown>, extra: Partial<typeof runs.$inferInsert> = {}) {
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
  return db.select().from(usageEvents).where(and(eq(usageEvents.orgId, orgId), eq(usageEvents.runId, runId)));
}

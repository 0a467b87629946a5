/**
 * Reads of the usage meters. Totals come from `usage_totals` (kept with the
 * events); pending figures (runs not finished yet) come from the runs table,
 * so a quota counts what is already promised.
 */
import "server-only";
import { and, eq, inArray, sql } from "drizzle-orm";
import { db } from "@/db";
import { runs, usageEvents, usageTotals } from "@/db/schema";
import type { UsageMetric } from "@/db/schema";

export type UsageTotals = { runs: number; shots: number; simulationSeconds: number };

export async function getUsageTotals(orgId: string, period: string): Promise<UsageTotals> {
  const rows = await db
    .select({ metric: usageTotals.metric, quantity: usageTotals.quantity })
    .from(usageTotals)
    .where(and(eq(usageTotals.orgId, orgId), eq(usageTotals.period, period)));
  const byMetric = new Map<UsageMetric, number>(rows.map((r) => [r.metric, Number(r.quantity)]));
  return {
    runs: byMetric.get("runs") ?? 0,
    shots: byMetric.get("shots") ?? 0,
    simulationSeconds: byMetric.get("simulation_seconds") ?? 0,
  };
}

export type UnfinishedRuns = { queued: number; running: number; pendingShots: number };

/**
 * Runs of the organisation that are queued or running, and (unless `shots` is
 * false) the shots they will draw. Without shots the count reads the
 * (org_id, status, …) index only.
 */
export async function getUnfinishedRuns(orgId: string, options: { shots?: boolean } = {}): Promise<UnfinishedRuns> {
  const rows = await db
    .select({
      status: runs.status,
      count: sql<string>`COUNT(*)`,
      shots: options.shots === false ? sql<string>`0` : sql<string>`COALESCE(SUM(${runs.shots}), 0)`,
    })
    .from(runs)
    .where(and(eq(runs.orgId, orgId), inArray(runs.status, ["queued", "running"])))
    .groupBy(runs.status);
  const out: UnfinishedRuns = { queued: 0, running: 0, pendingShots: 0 };
  for (const row of rows) {
    if (row.status === "queued") out.queued = Number(row.count);
    if (row.status === "running") out.running = Number(row.count);
    out.pendingShots += Number(row.shots);
  }
  return out;
}

/** Usage rows of one run (tests and the run page's "what this cost"). */
export async function listRunUsage(orgId: string, runId: string) {
  return db
    .select({ metric: usageEvents.metric, quantity: usageEvents.quantity, period: usageEvents.period })
    .from(usageEvents)
    .where(and(eq(usageEvents.orgId, orgId), eq(usageEvents.runId, runId)));
}

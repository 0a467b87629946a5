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
export async function getUnfinishedRuns(
  orgId: string,
  options: { shots?: boolean } = {},
): Promise<UnfinishedRuns> {
  const rows = await db
    .select({
      status: runs.status,
      count: sql<string>`COUNT(*)`,
      shots:
        options.shots === false ? sql<string>`0` : sql<string>`COALESCE(SUM(${runs.shots}), 0)`,
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
    .select({
      metric: usageEvents.metric,
      quantity: usageEvents.quantity,
      period: usageEvents.period,
    })
    .from(usageEvents)
    .where(and(eq(usageEvents.orgId, orgId), eq(usageEvents.runId, runId)));
}

/**
 * Everything a quota check reads, in one round trip: this period's totals and
 * the organisation's unfinished runs (with their shots when `shots` is true).
 */
export async function getQuotaFigures(
  orgId: string,
  period: string,
  options: { shots: boolean },
): Promise<{ usage: UsageTotals; unfinished: UnfinishedRuns }> {
  const shotsPart = options.shots
    ? sql`UNION ALL SELECT 'shots', '', COALESCE(SUM(${runs.shots}), 0) FROM ${runs}
          WHERE ${runs.orgId} = ${orgId} AND ${runs.status} IN ('queued', 'running')`
    : sql``;
  const [rows] = (await db.execute(sql`
    SELECT 'usage' AS kind, ${usageTotals.metric} AS name, ${usageTotals.quantity} AS value FROM ${usageTotals}
      WHERE ${usageTotals.orgId} = ${orgId} AND ${usageTotals.period} = ${period}
    UNION ALL SELECT 'runs', ${runs.status}, COUNT(*) FROM ${runs}
      WHERE ${runs.orgId} = ${orgId} AND ${runs.status} IN ('queued', 'running') GROUP BY ${runs.status}
    ${shotsPart}`)) as unknown as [{ kind: string; name: string; value: string | number }[]];
  const usage: UsageTotals = { runs: 0, shots: 0, simulationSeconds: 0 };
  const unfinished: UnfinishedRuns = { queued: 0, running: 0, pendingShots: 0 };
  for (const row of rows) {
    const value = Number(row.value);
    if (row.kind === "usage") {
      if (row.name === "runs") usage.runs = value;
      else if (row.name === "shots") usage.shots = value;
      else if (row.name === "simulation_seconds") usage.simulationSeconds = value;
    } else if (row.kind === "runs") {
      if (row.name === "queued") unfinished.queued = value;
      else if (row.name === "running") unfinished.running = value;
    } else if (row.kind === "shots") unfinished.pendingShots = value;
  }
  return { usage, unfinished };
}

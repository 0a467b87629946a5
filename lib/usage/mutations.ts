/**
 * Writes of the usage meters, always inside the transaction that finishes the
 * run. `INSERT IGNORE` on the unique (run, metric) key makes a repeated write
 * (a re-delivered job) a no-op, so usage is counted once per run; the
 * monthly totals are incremented only by the events that were new.
 */
import "server-only";
import { and, eq, sql } from "drizzle-orm";
import type { Tx } from "@/db";
import { usageEvents, usageTotals } from "@/db/schema";

export type RunUsage = { runs?: number; shots?: number; simulationSeconds?: number };

export async function recordRunUsage(
  tx: Tx,
  orgId: string,
  runId: string,
  period: string,
  usage: RunUsage,
) {
  const rows = [
    { metric: "runs" as const, quantity: usage.runs },
    { metric: "shots" as const, quantity: usage.shots },
    { metric: "simulation_seconds" as const, quantity: usage.simulationSeconds },
  ]
    .filter((r): r is { metric: typeof r.metric; quantity: number } => r.quantity !== undefined)
    .map((r) => ({
      orgId,
      runId,
      period,
      metric: r.metric,
      quantity: Math.round(r.quantity * 1e6) / 1e6,
    }));
  if (rows.length === 0) return;
  const [inserted] = await tx.insert(usageEvents).ignore().values(rows);
  if (inserted.affectedRows === 0) return;
  if (inserted.affectedRows === rows.length) {
    await tx
      .insert(usageTotals)
      .values(rows.map(({ metric, quantity }) => ({ orgId, period, metric, quantity })))
      .onDuplicateKeyUpdate({
        set: { quantity: sql`${usageTotals.quantity} + VALUES(${usageTotals.quantity})` },
      });
    return;
  }
  // Some of this run's events existed already (not a path the app takes): rebuild the totals from the events.
  await rebuildUsageTotals(tx, orgId, period);
}

/** Recomputes an organisation's totals for a period from its usage events. */
export async function rebuildUsageTotals(tx: Tx, orgId: string, period: string): Promise<void> {
  await tx
    .delete(usageTotals)
    .where(and(eq(usageTotals.orgId, orgId), eq(usageTotals.period, period)));
  await tx.execute(sql`
    INSERT INTO ${usageTotals} (org_id, period, metric, quantity)
    SELECT org_id, period, metric, SUM(quantity) FROM ${usageEvents}
    WHERE org_id = ${orgId} AND period = ${period} GROUP BY org_id, period, metric`);
}

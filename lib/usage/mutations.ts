/**
 * Writes of the usage meters. Always inside the transaction that finishes the
 * run; `INSERT IGNORE` on the unique (run, metric) key makes a repeated write
 * (a re-delivered job) a no-op, so usage is counted once per run.
 */
import "server-only";
import type { Db } from "@/db";
import { usageEvents } from "@/db/schema";

type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

export type RunUsage = { runs?: number; shots?: number; simulationSeconds?: number };

export async function recordRunUsage(tx: Tx | Db, orgId: string, runId: string, period: string, usage: RunUsage) {
  const rows = [
    { metric: "runs" as const, quantity: usage.runs },
    { metric: "shots" as const, quantity: usage.shots },
    { metric: "simulation_seconds" as const, quantity: usage.simulationSeconds },
  ]
    .filter((r): r is { metric: typeof r.metric; quantity: number } => r.quantity !== undefined)
    .map((r) => ({ orgId, runId, period, metric: r.metric, quantity: Math.round(r.quantity * 1e6) / 1e6 }));
  if (rows.length > 0) await tx.insert(usageEvents).ignore().values(rows);
}

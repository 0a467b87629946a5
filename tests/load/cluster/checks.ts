/**
 * What the cluster check verifies, from the database and the workers' logs:
 * every acknowledged submission has exactly one run, every run succeeded, no
 * run's result was written twice, and the usage meters count each run once.
 */
import { sql } from "drizzle-orm";
import { db } from "@/db";
import type { Submitted } from "./client";

export type RunRow = {
  id: string;
  status: string;
  attempts: number;
  idempotency_key: string | null;
};

export async function runsOf(orgId: string): Promise<RunRow[]> {
  const [rows] = (await db.execute(
    sql`select id, status, attempts, idempotency_key from runs where org_id = ${orgId}`,
  )) as unknown as [RunRow[]];
  return rows;
}

export async function waitAllTerminal(orgId: string, timeoutMs: number): Promise<RunRow[]> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const rows = await runsOf(orgId).catch(() => null);
    if (rows && rows.every((r) => ["succeeded", "failed", "canceled"].includes(r.status)))
      return rows;
    if (Date.now() > deadline) return rows ?? [];
    await new Promise((r) => setTimeout(r, 250));
  }
}

export async function runStatus(orgId: string, runId: string): Promise<RunRow | null> {
  const [rows] = (await db.execute(
    sql`select id, status, attempts, idempotency_key from runs where org_id = ${orgId} and id = ${runId}`,
  )) as unknown as [RunRow[]];
  return rows[0] ?? null;
}

/** Runs whose result was written by more than one attempt, from the workers' JSON log lines. */
export function runsFinishedTwice(logs: string[]): string[] {
  const count = new Map<string, number>();
  for (const text of logs) {
    for (const line of text.split("\n")) {
      if (!line.startsWith("{")) continue;
      try {
        const entry = JSON.parse(line) as { msg?: string };
        const match = /^run ([0-9a-f-]{36}): succeeded$/.exec(entry.msg ?? "");
        if (match) count.set(match[1], (count.get(match[1]) ?? 0) + 1);
      } catch {
        // a line cut by the output buffer
      }
    }
  }
  return [...count].filter(([, n]) => n > 1).map(([id]) => id);
}

export type Verdict = {
  submitted: number;
  runs: number;
  succeeded: number;
  lost: number;
  duplicates: number;
  runTwice: number;
  doubleMetered: number;
  details: string[];
};

export async function verify(
  orgId: string,
  acknowledged: Submitted[],
  workerLogs: string[],
): Promise<Verdict> {
  const rows = await runsOf(orgId);
  const byId = new Map(rows.map((r) => [r.id, r]));
  const details: string[] = [];
  const keys = new Map<string, string>();
  let duplicates = 0;
  for (const s of acknowledged) {
    const seen = keys.get(s.key);
    if (seen && seen !== s.runId) {
      duplicates++;
      details.push(`key ${s.key} answered with two runs ${seen} and ${s.runId}`);
    }
    keys.set(s.key, s.runId);
  }
  const perKey = new Map<string, number>();
  for (const r of rows)
    if (r.idempotency_key) perKey.set(r.idempotency_key, (perKey.get(r.idempotency_key) ?? 0) + 1);
  for (const [key, n] of perKey) {
    if (n > 1) {
      duplicates++;
      details.push(`key ${key} has ${n} runs`);
    }
  }
  const stray = rows.filter((r) => !r.idempotency_key || !keys.has(r.idempotency_key));
  for (const r of stray)
    details.push(`run ${r.id} (${r.status}) was not acknowledged to any client`);

  let lost = 0;
  for (const [key, runId] of keys) {
    const row = byId.get(runId);
    if (row?.status !== "succeeded") {
      lost++;
      details.push(`key ${key}: run ${runId} ${row ? row.status : "missing"}`);
    }
  }
  const twice = runsFinishedTwice(workerLogs);
  for (const id of twice) details.push(`run ${id} finished twice`);

  const [events] = (await db.execute(
    sql`select metric, count(*) as n, count(distinct run_id) as runs, coalesce(sum(quantity), 0) as total from usage_events where org_id = ${orgId} group by metric`,
  )) as unknown as [{ metric: string; n: number; runs: number; total: string }[]];
  const [totals] = (await db.execute(
    sql`select metric, coalesce(sum(quantity), 0) as total from usage_totals where org_id = ${orgId} group by metric`,
  )) as unknown as [{ metric: string; total: string }[]];
  let doubleMetered = 0;
  const succeeded = rows.filter((r) => r.status === "succeeded").length;
  const runsMetered = events.find((e) => e.metric === "runs");
  if (Number(runsMetered?.total ?? 0) !== succeeded) {
    doubleMetered += Math.abs(Number(runsMetered?.total ?? 0) - succeeded);
    details.push(`runs meter says ${runsMetered?.total ?? 0}, ${succeeded} runs succeeded`);
  }
  for (const e of events) {
    if (Number(e.n) !== Number(e.runs)) {
      doubleMetered++;
      details.push(`${e.metric}: ${e.n} events for ${e.runs} runs`);
    }
    const total = totals.find((t) => t.metric === e.metric);
    if (Math.abs(Number(total?.total ?? 0) - Number(e.total)) > 1e-6) {
      doubleMetered++;
      details.push(`${e.metric}: totals ${total?.total} ≠ events ${e.total}`);
    }
  }
  return {
    submitted: keys.size,
    runs: rows.length,
    succeeded,
    lost,
    duplicates: duplicates + stray.length,
    runTwice: twice.length,
    doubleMetered,
    details,
  };
}

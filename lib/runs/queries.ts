/**
 * Reads of runs. Every function takes the organisation id; a run of another
 * organisation is simply not found (the API answers 404, never 403).
 */
import "server-only";
import { and, desc, eq, gte, like, lt, or, sql, type SQL } from "drizzle-orm";
import { db } from "@/db";
import { runs, type Run } from "@/db/schema";
import { notFound } from "@/lib/api/problem";
import { decodeCursor, paginate } from "./cursor";
import type { RunListQuery } from "./schemas";
import type { RunStatus } from "./constants";

const isUuid = (value: string) =>
  /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(value);

export async function findRun(orgId: string, runId: string): Promise<Run | null> {
  if (!isUuid(runId)) return null;
  const rows = await db
    .select()
    .from(runs)
    .where(and(eq(runs.orgId, orgId), eq(runs.id, runId)))
    .limit(1);
  return rows[0] ?? null;
}

/** The run, or a 404 problem (also for ids of other organisations). */
export async function getRunOrThrow(orgId: string, runId: string): Promise<Run> {
  const run = await findRun(orgId, runId);
  if (!run) throw notFound("No run with this id in this organisation.");
  return run;
}

export async function findRunByIdempotencyKey(orgId: string, key: string): Promise<Run | null> {
  const rows = await db
    .select()
    .from(runs)
    .where(and(eq(runs.orgId, orgId), eq(runs.idempotencyKey, key)))
    .limit(1);
  return rows[0] ?? null;
}

/** Columns of a list row: no request, and only the headline values of the result (read in SQL). */
const summaryColumns = {
  id: runs.id,
  orgId: runs.orgId,
  createdByUserId: runs.createdByUserId,
  createdByApiKeyId: runs.createdByApiKeyId,
  name: runs.name,
  method: runs.method,
  qubits: runs.qubits,
  shots: runs.shots,
  shotsPlan: runs.shotsPlan,
  shotsDrawn: runs.shotsDrawn,
  seed: runs.seed,
  status: runs.status,
  progress: runs.progress,
  phase: runs.phase,
  error: runs.error,
  queuedAt: runs.queuedAt,
  startedAt: runs.startedAt,
  finishedAt: runs.finishedAt,
  parseMs: runs.parseMs,
  simulateMs: runs.simulateMs,
  sampleMs: runs.sampleMs,
  ideal: sql<string | null>`JSON_VALUE(${runs.result}, '$.ideal.value')`,
  exact: sql<string | null>`JSON_VALUE(${runs.result}, '$.exact.value')`,
  sampledMean: sql<string | null>`JSON_VALUE(${runs.result}, '$.sampled.mean')`,
  sampledStdErr: sql<string | null>`JSON_VALUE(${runs.result}, '$.sampled.stdErr')`,
};

export type RunListRow = Awaited<ReturnType<typeof selectSummaries>>[number];

function selectSummaries(where: SQL | undefined, limit: number) {
  return db
    .select(summaryColumns)
    .from(runs)
    .where(where)
    .orderBy(desc(runs.queuedAt), desc(runs.id))
    .limit(limit);
}

/** LIKE pattern matching `text` literally anywhere (%, _ and \\ escaped). */
const containing = (text: string) => `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

const dayStart = (day: string) => new Date(`${day}T00:00:00.000Z`);

/** Newest first, optionally filtered (status, method, name, submitter, queued day range), keyset-paginated. */
export async function listRuns(orgId: string, query: RunListQuery) {
  const conditions: (SQL | undefined)[] = [eq(runs.orgId, orgId)];
  if (query.status) conditions.push(eq(runs.status, query.status as RunStatus));
  if (query.method) conditions.push(eq(runs.method, query.method));
  if (query.q) conditions.push(like(runs.name, containing(query.q)));
  if (query.createdBy)
    conditions.push(
      or(eq(runs.createdByUserId, query.createdBy), eq(runs.createdByApiKeyId, query.createdBy)),
    );
  if (query.from) conditions.push(gte(runs.queuedAt, dayStart(query.from)));
  if (query.to)
    conditions.push(lt(runs.queuedAt, new Date(dayStart(query.to).getTime() + 86_400_000)));
  if (query.cursor) {
    const after = decodeCursor(query.cursor);
    conditions.push(
      or(lt(runs.queuedAt, after.time), and(eq(runs.queuedAt, after.time), lt(runs.id, after.id))),
    );
  }
  const rows = await selectSummaries(and(...conditions), query.limit + 1);
  return paginate(rows, query.limit, (row) => ({ time: row.queuedAt, id: row.id }));
}

/**
 * Reads of the library. Every function takes the organisation id; another
 * organisation's item is not found (404).
 */
import "server-only";
import { and, desc, eq, lt, or, sql, type SQL } from "drizzle-orm";
import { db } from "@/db";
import { circuits, observables } from "@/db/schema";
import { notFound } from "@/lib/api/problem";
import { decodeCursor, paginate } from "@/lib/runs/cursor";
import type { LibraryListQuery } from "./schemas";

type Table = typeof circuits | typeof observables;

const isUuid = (value: string) =>
  /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(value);

function listConditions(table: Table, orgId: string, query: LibraryListQuery): SQL | undefined {
  const conditions: (SQL | undefined)[] = [eq(table.orgId, orgId)];
  if (query.tag) conditions.push(sql`JSON_CONTAINS(${table.tags}, ${JSON.stringify(query.tag)})`);
  if (query.cursor) {
    const after = decodeCursor(query.cursor);
    conditions.push(
      or(
        lt(table.createdAt, after.time),
        and(eq(table.createdAt, after.time), lt(table.id, after.id)),
      ),
    );
  }
  return and(...conditions);
}

const summary = (t: Table) => ({
  id: t.id,
  name: t.name,
  description: t.description,
  tags: t.tags,
  format: t.format,
  qubits: t.qubits,
  createdByUserId: t.createdByUserId,
  createdAt: t.createdAt,
  updatedAt: t.updatedAt,
});

export async function listCircuits(orgId: string, query: LibraryListQuery) {
  const rows = await db
    .select(summary(circuits))
    .from(circuits)
    .where(listConditions(circuits, orgId, query))
    .orderBy(desc(circuits.createdAt), desc(circuits.id))
    .limit(query.limit + 1);
  return paginate(rows, query.limit, (r) => ({ time: r.createdAt, id: r.id }));
}

export async function listObservables(orgId: string, query: LibraryListQuery) {
  const rows = await db
    .select(summary(observables))
    .from(observables)
    .where(listConditions(observables, orgId, query))
    .orderBy(desc(observables.createdAt), desc(observables.id))
    .limit(query.limit + 1);
  return paginate(rows, query.limit, (r) => ({ time: r.createdAt, id: r.id }));
}

export async function getCircuitOrThrow(orgId: string, id: string) {
  const rows = isUuid(id)
    ? await db
        .select()
        .from(circuits)
        .where(and(eq(circuits.orgId, orgId), eq(circuits.id, id)))
        .limit(1)
    : [];
  if (!rows[0]) throw notFound("No saved circuit with this id in this organisation.");
  return rows[0];
}

export async function getObservableOrThrow(orgId: string, id: string) {
  const rows = isUuid(id)
    ? await db
        .select()
        .from(observables)
        .where(and(eq(observables.orgId, orgId), eq(observables.id, id)))
        .limit(1)
    : [];
  if (!rows[0]) throw notFound("No saved observable with this id in this organisation.");
  return rows[0];
}

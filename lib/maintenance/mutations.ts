/**
 * Data migrations: named, one-time changes to stored data, applied by
 * `scripts/migrate.ts` after the SQL migrations. Each step runs in one transaction that
 * first inserts its row into `data_migrations` (a concurrent migrator waits on that row
 * and then skips the step), so a step is applied exactly once per database and a failure
 * leaves nothing half-done.
 */
import "server-only";
import { and, eq, isNotNull, sql } from "drizzle-orm";
import { getDb, type Db, type Tx } from "@/db";
import { dataMigrations, observables, runs, usageEvents } from "@/db/schema";
import {
  legacyMatrixToWritten,
  migrateRunRequest,
  migrateRunResult,
  type StoredMatrix,
} from "./matrix-order";

/** Restricts a step to one organisation's rows (tests); the migrator passes none. */
export type MigrationScope = { orgId?: string };

export interface DataMigration {
  name: string;
  /** Applies the change; returns the rows changed. */
  apply(tx: Tx, scope?: MigrationScope): Promise<number>;
}

/** Matrix observables keep their physical meaning under the written (qubit 0 leftmost) order. */
export const matrixQubitOrder: DataMigration = {
  name: "2026-12-matrix-observables-qubit-0-leftmost",
  async apply(tx, scope = {}) {
    let changed = 0;
    const library = await tx
      .select({ id: observables.id, matrix: observables.matrix })
      .from(observables)
      .where(
        and(
          isNotNull(observables.matrix),
          scope.orgId ? eq(observables.orgId, scope.orgId) : undefined,
        ),
      );
    for (const row of library) {
      await tx
        .update(observables)
        .set({ matrix: legacyMatrixToWritten(row.matrix as StoredMatrix) })
        .where(eq(observables.id, row.id));
      changed++;
    }
    const stored = await tx
      .select({ id: runs.id, request: runs.request, result: runs.result })
      .from(runs)
      .where(
        and(
          sql`JSON_VALUE(${runs.request}, '$.observable.format') = 'matrix'`,
          scope.orgId ? eq(runs.orgId, scope.orgId) : undefined,
        ),
      );
    for (const row of stored) {
      await tx
        .update(runs)
        .set({ request: migrateRunRequest(row.request), result: migrateRunResult(row.result) })
        .where(eq(runs.id, row.id));
      changed++;
    }
    return changed;
  },
};

/** Succeeded runs from before `shots_drawn` existed get it from their metered shots (the billed figure). */
export const backfillShotsDrawn: DataMigration = {
  name: "2026-12-runs-shots-drawn-from-usage",
  async apply(tx, scope = {}) {
    const [res] = await tx.execute(sql`
      UPDATE ${runs} SET shots_drawn = COALESCE(
        (SELECT ROUND(${usageEvents.quantity}) FROM ${usageEvents}
          WHERE ${usageEvents.runId} = ${runs.id} AND ${usageEvents.metric} = 'shots' LIMIT 1), 0)
      WHERE ${runs.status} = 'succeeded' AND ${runs.shotsDrawn} IS NULL
      ${scope.orgId ? sql`AND ${runs.orgId} = ${scope.orgId}` : sql``}`);
    return (res as unknown as { affectedRows: number }).affectedRows;
  },
};

/** Every data migration, oldest first. Never reorder or rename an applied step. */
export const DATA_MIGRATIONS: readonly DataMigration[] = [matrixQubitOrder, backfillShotsDrawn];

/** Runs one step in a transaction without recording it (tests, with a scope). */
export async function applyStepUnrecorded(
  step: DataMigration,
  scope: MigrationScope,
  db: Db = getDb(),
): Promise<number> {
  return db.transaction((tx) => step.apply(tx, scope));
}

/** Applies the steps not yet recorded; returns the names applied now. */
export async function applyDataMigrations(db: Db = getDb()): Promise<string[]> {
  const applied: string[] = [];
  for (const step of DATA_MIGRATIONS) {
    const ran = await db.transaction(async (tx) => {
      const [claim] = await tx.execute(
        sql`INSERT IGNORE INTO ${dataMigrations} (name) VALUES (${step.name})`,
      );
      if ((claim as unknown as { affectedRows: number }).affectedRows === 0) return false;
      const rows = await step.apply(tx);
      await tx
        .update(dataMigrations)
        .set({ rowsChanged: rows })
        .where(eq(dataMigrations.name, step.name));
      return true;
    });
    if (ran) applied.push(step.name);
  }
  return applied;
}

/**
 * Data migrations applied by `scripts/migrate.ts` after the SQL migrations: one row
 * per step (its name), written in the same transaction as the step's changes, so each
 * step runs exactly once per database (lib/maintenance/data-migrations.ts).
 */
import { sql } from "drizzle-orm";
import { datetime, int, mysqlTable, varchar } from "drizzle-orm/mysql-core";

export const dataMigrations = mysqlTable("data_migrations", {
  name: varchar("name", { length: 120 }).primaryKey(),
  /** Rows the step changed (for the record). */
  rowsChanged: int("rows_changed").notNull().default(0),
  appliedAt: datetime("applied_at", { mode: "date", fsp: 3 })
    .notNull()
    .default(sql`CURRENT_TIMESTAMP(3)`),
});

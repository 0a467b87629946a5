/**
 * Usage meter events: what a run consumed, one row per (run, metric), written
 * in the same transaction that finishes the run. The unique key makes a
 * re-delivered job unable to count twice. `period` is the UTC calendar month
 * `YYYY-MM` the run finished in (plans bill per calendar month).
 * Metrics: `runs` (1 per executed run), `shots` (shots drawn),
 * `simulation_seconds` (engine wall-clock seconds, fractional).
 * `reportedAt` is set once the quantity is reported to the payment provider.
 */
import { sql } from "drizzle-orm";
import {
  bigint,
  char,
  datetime,
  decimal,
  index,
  mysqlEnum,
  mysqlTable,
  primaryKey,
  uniqueIndex,
  varchar,
} from "drizzle-orm/mysql-core";
import { organizations } from "./orgs";
import { runs } from "./runs";

export const USAGE_METRICS = ["runs", "shots", "simulation_seconds"] as const;
export type UsageMetric = (typeof USAGE_METRICS)[number];

export const usageEvents = mysqlTable(
  "usage_events",
  {
    id: bigint("id", { mode: "number", unsigned: true }).autoincrement().primaryKey(),
    orgId: varchar("org_id", { length: 36 })
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    runId: varchar("run_id", { length: 36 })
      .notNull()
      .references(() => runs.id, { onDelete: "cascade" }),
    metric: mysqlEnum("metric", USAGE_METRICS).notNull(),
    quantity: decimal("quantity", { precision: 20, scale: 6, mode: "number" }).notNull(),
    period: char("period", { length: 7 }).notNull(),
    createdAt: datetime("created_at", { mode: "date", fsp: 3 })
      .notNull()
      .default(sql`CURRENT_TIMESTAMP(3)`),
    reportedAt: datetime("reported_at", { mode: "date", fsp: 3 }),
  },
  (t) => [
    uniqueIndex("usage_events_run_metric").on(t.runId, t.metric),
    index("usage_events_org_period").on(t.orgId, t.period, t.metric),
  ],
);

export type UsageEvent = typeof usageEvents.$inferSelect;

/**
 * Running totals per (organisation, period, metric), kept in the same
 * transaction as the usage events they sum, so a quota check reads three rows
 * instead of summing a month of events.
 */
export const usageTotals = mysqlTable(
  "usage_totals",
  {
    orgId: varchar("org_id", { length: 36 })
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    period: char("period", { length: 7 }).notNull(),
    metric: mysqlEnum("metric", USAGE_METRICS).notNull(),
    quantity: decimal("quantity", { precision: 20, scale: 6, mode: "number" }).notNull().default(0),
    updatedAt: datetime("updated_at", { mode: "date", fsp: 3 })
      .notNull()
      .default(sql`CURRENT_TIMESTAMP(3)`)
      .$onUpdate(() => new Date()),
  },
  (t) => [primaryKey({ columns: [t.orgId, t.period, t.metric] })],
);

export type UsageTotal = typeof usageTotals.$inferSelect;

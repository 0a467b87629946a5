/**
 * Billing bookkeeping on Ketwise's side of the payment provider:
 *
 * - `billing_events`: the id of every provider webhook event already applied.
 *   The row is inserted in the same transaction as the event's effects, so a
 *   re-delivered event finds its id and changes nothing (idempotent webhooks).
 * - `overage_reports`: one row per (organisation, usage period, metric) whose
 *   overage above the plan's included amount has been (or is being) reported to
 *   the provider as metered usage. `identifier` is the meter event's identifier,
 *   so a retry after a lost answer is de-duplicated by the provider as well.
 *   `status` is `pending` until the provider accepted the event, then `sent`.
 */
import { sql } from "drizzle-orm";
import {
  bigint,
  char,
  datetime,
  index,
  int,
  mysqlEnum,
  mysqlTable,
  uniqueIndex,
  varchar,
} from "drizzle-orm/mysql-core";
import { organizations } from "./orgs";

export const billingEvents = mysqlTable(
  "billing_events",
  {
    id: varchar("id", { length: 255 }).primaryKey(),
    type: varchar("type", { length: 80 }).notNull(),
    orgId: varchar("org_id", { length: 36 }),
    receivedAt: datetime("received_at", { mode: "date", fsp: 3 })
      .notNull()
      .default(sql`CURRENT_TIMESTAMP(3)`),
  },
  (t) => [index("billing_events_org").on(t.orgId, t.receivedAt)],
);

export const OVERAGE_METRICS = ["shots", "simulation_seconds"] as const;
export type OverageMetric = (typeof OVERAGE_METRICS)[number];

export const overageReports = mysqlTable(
  "overage_reports",
  {
    id: bigint("id", { mode: "number", unsigned: true }).autoincrement().primaryKey(),
    orgId: varchar("org_id", { length: 36 })
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    period: char("period", { length: 7 }).notNull(),
    metric: mysqlEnum("metric", OVERAGE_METRICS).notNull(),
    /** Whole units above the included amount (shots, or seconds rounded up). */
    quantity: bigint("quantity", { mode: "number", unsigned: true }).notNull(),
    identifier: varchar("identifier", { length: 100 }).notNull().unique(),
    status: mysqlEnum("status", ["pending", "sent"]).notNull().default("pending"),
    attempts: int("attempts").notNull().default(0),
    lastError: varchar("last_error", { length: 255 }),
    createdAt: datetime("created_at", { mode: "date", fsp: 3 })
      .notNull()
      .default(sql`CURRENT_TIMESTAMP(3)`),
    sentAt: datetime("sent_at", { mode: "date", fsp: 3 }),
  },
  (t) => [uniqueIndex("overage_reports_org_period_metric").on(t.orgId, t.period, t.metric)],
);

export type OverageReport = typeof overageReports.$inferSelect;

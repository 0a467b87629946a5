/**
 * Append-only audit trail per organisation: who (user or API key) did what to
 * which target. `metadata` is small JSON (no secrets, no request bodies).
 */
import { sql } from "drizzle-orm";
import { bigint, datetime, index, json, mysqlTable, varchar } from "drizzle-orm/mysql-core";
import { organizations } from "./orgs";

export const auditEvents = mysqlTable(
  "audit_events",
  {
    id: bigint("id", { mode: "number", unsigned: true }).autoincrement().primaryKey(),
    orgId: varchar("org_id", { length: 36 })
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    actorUserId: varchar("actor_user_id", { length: 36 }),
    actorApiKeyId: varchar("actor_api_key_id", { length: 36 }),
    /** Dotted verb, e.g. `org.created`, `member.role_changed`, `api_key.revoked`. */
    action: varchar("action", { length: 64 }).notNull(),
    targetType: varchar("target_type", { length: 32 }),
    targetId: varchar("target_id", { length: 64 }),
    metadata: json("metadata").$type<Record<string, unknown>>(),
    ip: varchar("ip", { length: 45 }),
    createdAt: datetime("created_at", { mode: "date", fsp: 3 })
      .notNull()
      .default(sql`CURRENT_TIMESTAMP(3)`),
  },
  (t) => [index("audit_events_org_time").on(t.orgId, t.createdAt)],
);

export type AuditEvent = typeof auditEvents.$inferSelect;

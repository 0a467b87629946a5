/**
 * Organisation API keys. A key reads `kw_<prefix>_<secret>`; only the prefix
 * (for display and lookup) and SHA-256 (hex) of the whole key are stored.
 * A key acts with its own role, never above its creator's role at creation.
 * `scope`: `personal` keys belong to their creator (revoked when the creator
 * leaves the organisation); `organization` keys are made by admins for shared
 * automation and outlive their creator's membership.
 */
import { sql } from "drizzle-orm";
import { datetime, index, mysqlEnum, mysqlTable, varchar } from "drizzle-orm/mysql-core";
import { users } from "./auth";
import { organizations, ROLES } from "./orgs";

export const API_KEY_SCOPES = ["personal", "organization"] as const;
export type ApiKeyScope = (typeof API_KEY_SCOPES)[number];

export const apiKeys = mysqlTable(
  "api_keys",
  {
    id: varchar("id", { length: 36 })
      .primaryKey()
      .$defaultFn(() => crypto.randomUUID()),
    orgId: varchar("org_id", { length: 36 })
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    createdById: varchar("created_by_id", { length: 36 }).references(() => users.id, {
      onDelete: "set null",
    }),
    name: varchar("name", { length: 80 }).notNull(),
    prefix: varchar("prefix", { length: 16 }).notNull().unique(),
    hash: varchar("hash", { length: 64 }).notNull().unique(),
    role: mysqlEnum("role", ROLES).notNull(),
    scope: mysqlEnum("scope", API_KEY_SCOPES).notNull().default("personal"),
    lastUsedAt: datetime("last_used_at", { mode: "date", fsp: 3 }),
    revokedAt: datetime("revoked_at", { mode: "date", fsp: 3 }),
    createdAt: datetime("created_at", { mode: "date", fsp: 3 })
      .notNull()
      .default(sql`CURRENT_TIMESTAMP(3)`),
  },
  (t) => [index("api_keys_org").on(t.orgId)],
);

export type ApiKey = typeof apiKeys.$inferSelect;

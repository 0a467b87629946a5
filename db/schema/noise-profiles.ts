/**
 * Noise profiles saved by an organisation for the run builder: a named noise model
 * (semantics as in DEVELOPERS.md, "Noise model"; probabilities in [0, 1]). Names are unique per organisation.
 */
import { sql } from "drizzle-orm";
import { datetime, index, mysqlTable, uniqueIndex, varchar } from "drizzle-orm/mysql-core";
import type { NoiseModel } from "@/lib/quantum/types";
import { users } from "./auth";
import { jsonText } from "./json-text";
import { organizations } from "./orgs";

export const noiseProfiles = mysqlTable(
  "noise_profiles",
  {
    id: varchar("id", { length: 36 })
      .primaryKey()
      .$defaultFn(() => crypto.randomUUID()),
    orgId: varchar("org_id", { length: 36 })
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    createdByUserId: varchar("created_by_user_id", { length: 36 }).references(() => users.id, {
      onDelete: "set null",
    }),
    name: varchar("name", { length: 80 }).notNull(),
    noise: jsonText<NoiseModel>("noise").notNull(),
    createdAt: datetime("created_at", { mode: "date", fsp: 3 })
      .notNull()
      .default(sql`CURRENT_TIMESTAMP(3)`),
    updatedAt: datetime("updated_at", { mode: "date", fsp: 3 })
      .notNull()
      .default(sql`CURRENT_TIMESTAMP(3)`)
      .$onUpdate(() => new Date()),
  },
  (t) => [
    uniqueIndex("noise_profiles_org_name").on(t.orgId, t.name),
    index("noise_profiles_org_updated").on(t.orgId, t.updatedAt),
  ],
);

export type NoiseProfileRow = typeof noiseProfiles.$inferSelect;

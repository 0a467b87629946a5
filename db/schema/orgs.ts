/**
 * Tenancy: organisations, who belongs to them with which role, and pending
 * invitations. Every tenant-owned row elsewhere carries `org_id`.
 * Roles, weakest to strongest: viewer < member < admin < owner.
 */
import { sql } from "drizzle-orm";
import {
  datetime,
  index,
  int,
  mysqlEnum,
  mysqlTable,
  uniqueIndex,
  varchar,
} from "drizzle-orm/mysql-core";
import { users } from "./auth";

export const ROLES = ["viewer", "member", "admin", "owner"] as const;
export type Role = (typeof ROLES)[number];

const createdAt = () =>
  datetime("created_at", { mode: "date", fsp: 3 })
    .notNull()
    .default(sql`CURRENT_TIMESTAMP(3)`);

export const organizations = mysqlTable("organizations", {
  id: varchar("id", { length: 36 })
    .primaryKey()
    .$defaultFn(() => crypto.randomUUID()),
  name: varchar("name", { length: 120 }).notNull(),
  slug: varchar("slug", { length: 80 }).notNull().unique(),
  /** Plan id from lib/billing/plans.ts (sandbox | lab | institute). */
  plan: varchar("plan", { length: 32 }).notNull().default("sandbox"),
  /** Paid seats (the subscription quantity); Sandbox keeps its plan's fixed limit. */
  seats: int("seats").notNull().default(1),
  stripeCustomerId: varchar("stripe_customer_id", { length: 255 }).unique(),
  stripeSubscriptionId: varchar("stripe_subscription_id", { length: 255 }).unique(),
  /** Provider subscription status (active, trialing, past_due, canceled, …); null on Sandbox. */
  subscriptionStatus: varchar("subscription_status", { length: 32 }),
  createdAt: createdAt(),
  updatedAt: datetime("updated_at", { mode: "date", fsp: 3 })
    .notNull()
    .default(sql`CURRENT_TIMESTAMP(3)`)
    .$onUpdate(() => new Date()),
});

export const memberships = mysqlTable(
  "memberships",
  {
    id: varchar("id", { length: 36 })
      .primaryKey()
      .$defaultFn(() => crypto.randomUUID()),
    orgId: varchar("org_id", { length: 36 })
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    userId: varchar("user_id", { length: 36 })
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    role: mysqlEnum("role", ROLES).notNull(),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex("memberships_org_user").on(t.orgId, t.userId),
    index("memberships_user").on(t.userId),
  ],
);

export const invitations = mysqlTable(
  "invitations",
  {
    id: varchar("id", { length: 36 })
      .primaryKey()
      .$defaultFn(() => crypto.randomUUID()),
    orgId: varchar("org_id", { length: 36 })
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    email: varchar("email", { length: 255 }).notNull(),
    role: mysqlEnum("role", ROLES).notNull(),
    /** SHA-256 (hex) of the token sent by e-mail; the token itself is never stored. */
    tokenHash: varchar("token_hash", { length: 64 }).notNull().unique(),
    invitedById: varchar("invited_by_id", { length: 36 }).references(() => users.id, {
      onDelete: "set null",
    }),
    expiresAt: datetime("expires_at", { mode: "date", fsp: 3 }).notNull(),
    acceptedAt: datetime("accepted_at", { mode: "date", fsp: 3 }),
    revokedAt: datetime("revoked_at", { mode: "date", fsp: 3 }),
    createdAt: createdAt(),
  },
  (t) => [index("invitations_org_email").on(t.orgId, t.email)],
);

export type Organization = typeof organizations.$inferSelect;
export type Membership = typeof memberships.$inferSelect;
export type Invitation = typeof invitations.$inferSelect;

/**
 * Run-finished webhooks. An organisation's admins register endpoints (URL +
 * signing secret, the secret shown once and stored encrypted with a key derived
 * from AUTH_SECRET, lib/webhooks/secret.ts). Each terminal run makes one
 * delivery per enabled endpoint (unique per endpoint and run; its body is fixed
 * when it is made, so every retry sends the same bytes), and every HTTP attempt
 * of a delivery is a row of its own.
 */
import { sql } from "drizzle-orm";
import {
  bigint,
  boolean,
  datetime,
  index,
  int,
  mediumtext,
  mysqlEnum,
  mysqlTable,
  uniqueIndex,
  varchar,
} from "drizzle-orm/mysql-core";
import { users } from "./auth";
import { organizations } from "./orgs";

export const WEBHOOK_DELIVERY_STATUSES = ["pending", "delivered", "failed"] as const;
export type WebhookDeliveryStatus = (typeof WEBHOOK_DELIVERY_STATUSES)[number];

export const webhookEndpoints = mysqlTable(
  "webhook_endpoints",
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
    url: varchar("url", { length: 2048 }).notNull(),
    description: varchar("description", { length: 120 }),
    /** AES-256-GCM ciphertext of the signing secret (base64url iv.tag.data). */
    secretCipher: varchar("secret_cipher", { length: 255 }).notNull(),
    /** First characters of the secret, to tell endpoints apart on the page. */
    secretPrefix: varchar("secret_prefix", { length: 16 }).notNull(),
    enabled: boolean("enabled").notNull().default(true),
    createdAt: datetime("created_at", { mode: "date", fsp: 3 })
      .notNull()
      .default(sql`CURRENT_TIMESTAMP(3)`),
  },
  (t) => [index("webhook_endpoints_org").on(t.orgId, t.createdAt)],
);

export const webhookDeliveries = mysqlTable(
  "webhook_deliveries",
  {
    id: varchar("id", { length: 36 })
      .primaryKey()
      .$defaultFn(() => crypto.randomUUID()),
    orgId: varchar("org_id", { length: 36 })
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    endpointId: varchar("endpoint_id", { length: 36 })
      .notNull()
      .references(() => webhookEndpoints.id, { onDelete: "cascade" }),
    runId: varchar("run_id", { length: 36 }).notNull(),
    event: varchar("event", { length: 32 }).notNull(),
    /** The exact JSON body every attempt sends. */
    body: mediumtext("body").notNull(),
    status: mysqlEnum("status", WEBHOOK_DELIVERY_STATUSES).notNull().default("pending"),
    attempts: int("attempts").notNull().default(0),
    lastResponseStatus: int("last_response_status"),
    lastError: varchar("last_error", { length: 255 }),
    lastAttemptAt: datetime("last_attempt_at", { mode: "date", fsp: 3 }),
    createdAt: datetime("created_at", { mode: "date", fsp: 3 })
      .notNull()
      .default(sql`CURRENT_TIMESTAMP(3)`),
  },
  (t) => [
    uniqueIndex("webhook_deliveries_endpoint_run").on(t.endpointId, t.runId),
    index("webhook_deliveries_org_time").on(t.orgId, t.createdAt),
  ],
);

export const webhookAttempts = mysqlTable(
  "webhook_attempts",
  {
    id: bigint("id", { mode: "number", unsigned: true }).autoincrement().primaryKey(),
    orgId: varchar("org_id", { length: 36 })
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    deliveryId: varchar("delivery_id", { length: 36 })
      .notNull()
      .references(() => webhookDeliveries.id, { onDelete: "cascade" }),
    attempt: int("attempt").notNull(),
    /** HTTP status of the answer; null when there was none (refused address, timeout, connection error). */
    responseStatus: int("response_status"),
    error: varchar("error", { length: 255 }),
    durationMs: int("duration_ms").notNull(),
    at: datetime("at", { mode: "date", fsp: 3 })
      .notNull()
      .default(sql`CURRENT_TIMESTAMP(3)`),
  },
  (t) => [uniqueIndex("webhook_attempts_delivery_attempt").on(t.deliveryId, t.attempt)],
);

export type WebhookEndpoint = typeof webhookEndpoints.$inferSelect;
export type WebhookDelivery = typeof webhookDeliveries.$inferSelect;
export type WebhookAttempt = typeof webhookAttempts.$inferSelect;

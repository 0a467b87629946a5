/**
 * Runs: one estimate request of an organisation, from submission to result.
 *
 * Lifecycle: queued → running → succeeded | failed | canceled (a queued run may
 * also go straight to canceled or failed). `request` is the engine request as
 * submitted (the body of POST /api/v1/runs without `name`); `seed` is the one the run uses —
 * the user's, or one chosen at submission — so every sampled figure is
 * reproducible. `error` is an RFC 9457 problem document, `result` the engine's
 * EstimateResult. `shots` is the planned total (the request's `shots`, or the
 * shot plan for `targetPrecision`: state-aware when the preview could simulate the
 * state within its budget, else the worst-case bound — `shotsPlan` says which);
 * `shotsDrawn` is what the engine really drew (set when the run succeeds; billed).
 * The idempotency key is unique per org.
 */
import { sql } from "drizzle-orm";
import {
  bigint,
  char,
  datetime,
  double,
  index,
  int,
  mysqlEnum,
  mysqlTable,
  uniqueIndex,
  varchar,
} from "drizzle-orm/mysql-core";
import type { ProblemDocument } from "@/lib/api/problem-schema";
import { apiKeys } from "./api-keys";
import { users } from "./auth";
import { jsonText } from "./json-text";
import { organizations } from "./orgs";
import { RUN_METHODS, RUN_STATUSES, SHOT_PLAN_SOURCES } from "./run-enums";

export { RUN_METHODS, RUN_STATUSES, type RunMethod, type RunStatus } from "./run-enums";

/** RFC 9457 problem as stored on a failed run: the document of lib/api/problem-schema.ts. */
export type StoredProblem = ProblemDocument;

const ms3 = (name: string) => datetime(name, { mode: "date", fsp: 3 });

export const runs = mysqlTable(
  "runs",
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
    createdByApiKeyId: varchar("created_by_api_key_id", { length: 36 }).references(
      () => apiKeys.id,
      {
        onDelete: "set null",
      },
    ),
    name: varchar("name", { length: 120 }).notNull(),
    request: jsonText<Record<string, unknown>>("request").notNull(),
    method: mysqlEnum("method", RUN_METHODS).notNull(),
    qubits: int("qubits").notNull(),
    shots: bigint("shots", { mode: "number", unsigned: true }).notNull().default(0),
    shotsPlan: mysqlEnum("shots_plan", SHOT_PLAN_SOURCES),
    shotsDrawn: bigint("shots_drawn", { mode: "number", unsigned: true }),
    seed: bigint("seed", { mode: "number" }).notNull(),
    status: mysqlEnum("status", RUN_STATUSES).notNull().default("queued"),
    /** Fraction done in [0, 1], written at most a few times a second. */
    progress: double("progress").notNull().default(0),
    phase: varchar("phase", { length: 64 }),
    error: jsonText<StoredProblem>("error"),
    result: jsonText<Record<string, unknown>>("result"),
    idempotencyKey: varchar("idempotency_key", { length: 255 }),
    /** SHA-256 (hex) of the canonical submitted body, to tell a replay from a key reused for another request. */
    requestHash: char("request_hash", { length: 64 }).notNull(),
    /** Times a worker has started this run (re-deliveries after a crash count). */
    attempts: int("attempts").notNull().default(0),
    queuedAt: ms3("queued_at")
      .notNull()
      .default(sql`CURRENT_TIMESTAMP(3)`),
    startedAt: ms3("started_at"),
    finishedAt: ms3("finished_at"),
    parseMs: double("parse_ms"),
    simulateMs: double("simulate_ms"),
    sampleMs: double("sample_ms"),
  },
  (t) => [
    uniqueIndex("runs_org_idempotency").on(t.orgId, t.idempotencyKey),
    index("runs_org_queued").on(t.orgId, t.queuedAt, t.id),
    index("runs_org_status_queued").on(t.orgId, t.status, t.queuedAt, t.id),
  ],
);

export type Run = typeof runs.$inferSelect;
export type NewRun = typeof runs.$inferInsert;

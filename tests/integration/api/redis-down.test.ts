/**
 * Redis unreachable (pointed at a closed port): a submission answers 503
 * with nothing half-written (no run row is left behind), while reads keep
 * working (rate limits fall back to per-process memory) and a `?wait=N` read
 * answers the run as it is instead of hanging.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@/db";
import { runs } from "@/db/schema";
import { GET as ready } from "@/app/api/ready/route";
import { closeQueue } from "@/lib/queue/enqueue";
import { closeRedis } from "@/lib/rate-limit/redis";
import { closePreviewPool } from "@/lib/runs/preview-pool";
import { previewOrThrow } from "@/lib/runs/preview-run";
import { engineRequestOf } from "@/lib/runs/schemas";
import { activeWaiters, closeRunWaiters } from "@/lib/runs/run-waiter";
import { createTestApiKey, createUserWithOrg } from "../../support/factories";
import { api } from "../runs/support/api";
import { insertRawRun } from "../runs/support/db-helpers";
import { bellRequest } from "../runs/support/requests";

// Before anything reads the environment (lib/env reads it lazily, once per test file).
process.env.REDIS_URL = "redis://127.0.0.1:1/1";

let org: Awaited<ReturnType<typeof createUserWithOrg>>;
let key: string;

beforeAll(async () => {
  org = await createUserWithOrg("redis-down");
  key = (await createTestApiKey(org.orgId, "member", org.user.id)).key;
  // Start the preview threads first, so the time bound below measures Redis timeouts, not thread start-up.
  await previewOrThrow(engineRequestOf(bellRequest() as never));
});

afterAll(async () => {
  await closePreviewPool();
  await closeRunWaiters();
  await closeQueue();
  await closeRedis();
  await closeDb();
});

describe("Redis down", () => {
  it("is not ready: 503 naming the Redis check, while the database check passes", async () => {
    const res = await ready();
    const body = await res.json();
    expect(res.status).toBe(503);
    expect(res.headers.get("content-type")).toBe("application/problem+json");
    expect(body.detail).toMatch(/^redis: /);
    expect(body.checks.database.ok).toBe(true);
    expect(body.checks.redis.ok).toBe(false);
    // The public answer names the failing check, never the driver's message (hosts, ports).
    expect(body.detail).not.toMatch(/127\.0\.0\.1|ECONN|:\d{2,5}\b/);
  });

  it("answers 503 on submit and leaves no run behind", async () => {
    const started = Date.now();
    const res = await api("POST", "/api/v1/runs", {
      key,
      body: bellRequest(),
      headers: { "idempotency-key": "redis-down-1" },
    });
    expect(res.status, JSON.stringify(res.body)).toBe(503);
    expect(res.body.type).toBe("/problems/queue-unavailable");
    expect(res.body.detail).toMatch(/Nothing was created/);
    expect(Number(res.headers.get("retry-after"))).toBeGreaterThan(0);
    expect(Date.now() - started).toBeLessThan(10_000);
    expect(await db.select().from(runs).where(eq(runs.orgId, org.orgId))).toHaveLength(0);
    // Reads still answer.
    const list = await api("GET", "/api/v1/runs", { key });
    expect(list.status).toBe(200);
    expect(list.body.data).toEqual([]);
  });

  it("answers GET ?wait=N with the run as it is (no subscription possible, no hang)", async () => {
    const id = await insertRawRun(org.orgId, bellRequest());
    const res = await api("GET", `/api/v1/runs/${id}?wait=30`, { key });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.status).toBe("queued");
    expect(activeWaiters()).toBe(0);
  });
});

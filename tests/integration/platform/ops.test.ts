/**
 * Operations endpoints: liveness, readiness (database, migrations, Redis),
 * Prometheus metrics behind a token, and the request id carried from an API
 * answer into the queued job. Metric names follow the Prometheus naming
 * conventions (common practice: `_seconds`, `_total` suffixes).
 */
process.env.METRICS_TOKEN = "metrics-token-for-tests-0123456789";

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db";
import { GET as health } from "@/app/api/health/route";
import { GET as metricsRoute } from "@/app/api/metrics/route";
import { GET as ready } from "@/app/api/ready/route";
import { closeQueue, getRunsQueue } from "@/lib/queue/enqueue";
import { closeRedis } from "@/lib/rate-limit/redis";
import { createTestApiKey, createUserWithOrg } from "../../support/factories";
import { api } from "../runs/support/api";
import { cancelLeftoverRuns } from "../runs/support/db-helpers";
import { bellRequest } from "../runs/support/requests";

let org: Awaited<ReturnType<typeof createUserWithOrg>>;
let key: string;

beforeAll(async () => {
  org = await createUserWithOrg("ops");
  key = (await createTestApiKey(org.orgId, "member", org.user.id)).key;
});

afterAll(async () => {
  if (org) await cancelLeftoverRuns([org.orgId]);
  await closeQueue();
  await closeRedis();
  await closeDb();
});

const scrape = (authorization?: string) =>
  metricsRoute(
    new Request("http://localhost/api/metrics", {
      headers: authorization ? { authorization } : {},
    }),
  );

describe("health and readiness", () => {
  it("answers liveness without touching dependencies", async () => {
    const res = health();
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ status: "ok" });
  });

  it("is ready when the database carries every migration and Redis answers", async () => {
    const res = await ready();
    const body = await res.json();
    expect(res.status).toBe(200);
    expect(body.status).toBe("ready");
    expect(body.checks.database.ok).toBe(true);
    expect(body.checks.migrations.detail).toMatch(/^current \(\d{4}_/);
    expect(body.checks.redis.ok).toBe(true);
  });
});

describe("metrics", () => {
  it("refuses a scrape without the token, or with a wrong one", async () => {
    expect((await scrape()).status).toBe(401);
    expect((await scrape("Bearer not-the-token-at-all-000000")).status).toBe(401);
  });

  it("serves API latency by route pattern, queue depth and rate-limit refusals", async () => {
    const submitted = await api("POST", "/api/v1/runs", { key, body: bellRequest() });
    expect(submitted.status).toBe(202);
    await api("GET", `/api/v1/runs/${submitted.body.id}`, { key });
    const res = await scrape(`Bearer ${process.env.METRICS_TOKEN}`);
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toMatch(/^text\/plain/);
    const text = await res.text();
    expect(text).toMatch(
      /ketwise_http_request_duration_seconds_count\{route="\/api\/v1\/runs\/:id",method="GET",status="2xx"\} [1-9]/,
    );
    expect(text).toMatch(
      /ketwise_http_request_duration_seconds_count\{route="\/api\/v1\/runs",method="POST",status="2xx"\} [1-9]/,
    );
    expect(text).toMatch(/ketwise_queue_jobs\{state="waiting"\} \d+/);
    expect(text).toContain("ketwise_queue_oldest_waiting_seconds");
    expect(text).toContain("ketwise_rate_limit_refusals_total");
  });
});

describe("request ids", () => {
  it("echoes a safe client id, replaces an unsafe one, and carries it into the queued job", async () => {
    const mine = "trace-0123456789abcdef";
    const res = await api("POST", "/api/v1/runs", {
      key,
      body: bellRequest(),
      headers: { "x-request-id": mine },
    });
    expect(res.status).toBe(202);
    expect(res.headers.get("x-request-id")).toBe(mine);
    const job = await getRunsQueue().getJob(res.body.id);
    expect(job?.data).toMatchObject({ runId: res.body.id, requestId: mine });

    const bad = await api("GET", "/api/v1/usage", { key, headers: { "x-request-id": "<script>" } });
    expect(bad.headers.get("x-request-id")).toMatch(/^[0-9a-f-]{36}$/);
  });
});

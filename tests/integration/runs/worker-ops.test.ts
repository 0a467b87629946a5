/**
 * The worker's own /health and /metrics server (WORKER_METRICS_PORT): health
 * answers while the worker takes jobs, metrics need the token and count
 * engine seconds and run latency by method and size class, and a job's log
 * lines carry the request id of the API call that queued it.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db";
import { closeQueue } from "@/lib/queue/enqueue";
import { closeRedis } from "@/lib/rate-limit/redis";
import { createTestApiKey, createUserWithOrg } from "../../support/factories";
import { api, pollRun } from "./support/api";
import { cancelLeftoverRuns } from "./support/db-helpers";
import { bellRequest } from "./support/requests";
import { startWorker, type WorkerProcess } from "./support/worker-process";

const TOKEN = "worker-metrics-token-0123456789";
let org: Awaited<ReturnType<typeof createUserWithOrg>>;
let key: string;
let worker: WorkerProcess;
let port: number;

beforeAll(async () => {
  org = await createUserWithOrg("worker-ops");
  key = (await createTestApiKey(org.orgId, "member", org.user.id)).key;
  worker = await startWorker({
    concurrency: 1,
    env: { WORKER_METRICS_PORT: "0", METRICS_TOKEN: TOKEN },
  });
  // Port 0: the worker takes any free port and names it in its ready line.
  const bound = /\/metrics on 127\.0\.0\.1:(\d+)/.exec(worker.output());
  if (!bound) throw new Error(`the worker did not name its metrics port:\n${worker.output()}`);
  port = Number(bound[1]);
});

afterAll(async () => {
  await worker?.kill();
  if (org) await cancelLeftoverRuns([org.orgId]);
  await closeQueue();
  await closeRedis();
  await closeDb();
});

const get = (path: string, token?: string) =>
  fetch(`http://127.0.0.1:${port}${path}`, {
    headers: token ? { authorization: `Bearer ${token}` } : {},
  });

describe("worker operations", () => {
  it("runs a job with the request id in its log lines and counts it in the metrics", async () => {
    expect((await get("/health")).status).toBe(200);
    const requestId = "worker-ops-trace-42";
    const res = await api("POST", "/api/v1/runs", {
      key,
      body: bellRequest(),
      headers: { "x-request-id": requestId },
    });
    expect(res.status).toBe(202);
    const run = await pollRun(key, res.body.id);
    expect(run.status).toBe("succeeded");

    const lines = worker
      .output()
      .split("\n")
      .filter((l) => l.startsWith("{"))
      .map((l) => JSON.parse(l) as Record<string, unknown>);
    const jobLines = lines.filter((l) => l.runId === res.body.id);
    expect(jobLines.length).toBeGreaterThan(0);
    expect(
      jobLines.every(
        (l) => l.requestId === requestId && l.service === "worker" && l.orgId === org.orgId,
      ),
    ).toBe(true);

    expect((await get("/metrics")).status).toBe(401);
    const scraped = await get("/metrics", TOKEN);
    expect(scraped.status).toBe(200);
    const text = await scraped.text();
    expect(text).toMatch(/ketwise_engine_seconds_total\{method="statevector"\} \d/);
    expect(text).toMatch(
      /ketwise_run_duration_seconds_count\{method="statevector",size="le8",outcome="result"\} 1/,
    );
    expect(text).toMatch(/ketwise_worker_busy_ratio \d/);
  });

  it("exits cleanly on SIGTERM, closing its metrics server", async () => {
    const exited = new Promise<number | null>((resolve) =>
      worker.child.once("exit", (code) => resolve(code)),
    );
    worker.child.kill("SIGTERM");
    expect(await exited).toBe(0);
    expect(worker.output()).toContain('"msg":"stopped"');
    await expect(get("/health")).rejects.toThrow();
  });
});

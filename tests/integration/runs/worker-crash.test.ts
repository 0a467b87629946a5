/**
 * Crash recovery: a worker process killed (SIGKILL) in the middle of a run.
 * BullMQ's stalled-job check hands the job to the surviving worker, which runs
 * it again under a new attempt number; the run finishes exactly once, with one
 * set of usage rows and the same result `estimate()` gives.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db";
import { estimate } from "@/lib/quantum";
import { closeQueue, getRunsQueue } from "@/lib/queue/enqueue";
import { closeRedis } from "@/lib/rate-limit/redis";
import { createTestApiKey, createUserWithOrg } from "../../support/factories";
import { api, pollRun } from "./support/api";
import { runRow, usageOf } from "./support/db-helpers";
import { longRunRequest } from "./support/requests";
import { startWorker, type WorkerProcess } from "./support/worker-process";

let workers: WorkerProcess[] = [];
let owner: Awaited<ReturnType<typeof createUserWithOrg>>;
let key: string;

beforeAll(async () => {
  const started = await Promise.all([
    startWorker({ concurrency: 1 }),
    startWorker({ concurrency: 1 }),
    createUserWithOrg("crash"),
  ]);
  workers = [started[0], started[1]];
  owner = started[2];
  key = (await createTestApiKey(owner.orgId, "member", owner.user.id)).key;
});

afterAll(async () => {
  await Promise.all(workers.map((w) => w.stop()));
  await closeQueue();
  await closeRedis();
  await closeDb();
});

describe("a worker killed mid-run", () => {
  it("leaves the run to another worker, which finishes it exactly once", async () => {
    const request = longRunRequest(64);
    const res = await api("POST", "/api/v1/runs", { key, body: request });
    expect(res.status, JSON.stringify(res.body)).toBe(202);
    const id = res.body.id;
    await pollRun(key, id, {
      until: (r) => r.status === "running" && r.progress > 0,
      timeoutMs: 60_000,
    });

    const started = `run ${id}: attempt 1 started`;
    const victim = workers.find((w) => w.output().includes(started));
    const survivor = workers.find((w) => w !== victim)!;
    expect(victim, "one worker reported starting the run").toBeDefined();
    await victim!.kill();

    const run = await pollRun(key, id, { timeoutMs: 120_000, intervalMs: 200 });
    expect(run.status, JSON.stringify(run.error)).toBe("succeeded");
    expect(survivor.output()).toContain(`run ${id}: attempt 2 started (re-delivered)`);
    expect((await runRow(owner.orgId, id)).attempts).toBe(2);

    const usage = await usageOf(owner.orgId, id);
    expect(usage.map((u) => u.metric).sort()).toEqual(["runs", "shots", "simulation_seconds"]);
    expect(usage.find((u) => u.metric === "runs")?.quantity).toBe(1);
    const direct = await estimate(request);
    expect({ ...run.result, timings: undefined }).toEqual({ ...direct, timings: undefined });
    expect(usage.find((u) => u.metric === "shots")?.quantity).toBe(
      direct.sweep!.points.reduce((a, p) => a + (p.sampled?.shots ?? 0), 0),
    );

    // Nothing runs it a third time: the queue has the job as completed, which it never re-runs.
    await survivor.waitForOutput(`run ${id}: succeeded`);
    await expect.poll(() => getRunsQueue().getJobState(id), { timeout: 30_000 }).toBe("completed");
    expect(survivor.output()).not.toContain(`run ${id}: attempt 3`);
    expect(await usageOf(owner.orgId, id)).toHaveLength(3);
  });
});

/**
 * The run path end to end against the real MariaDB, Redis and worker process:
 * submit → 202 + Location → poll → succeeded, with a result equal to calling
 * `estimate()` directly; usage rows written once; Idempotency-Key replays.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db";
import { estimate } from "@/lib/quantum";
import { closeQueue } from "@/lib/queue/enqueue";
import { closeRedis } from "@/lib/rate-limit/redis";
import { listRunUsage } from "@/lib/usage/queries";
import { createTestApiKey, createUserWithOrg } from "../../support/factories";
import { api, pollRun } from "./support/api";
import { bellRequest } from "./support/requests";
import { startWorker, type WorkerProcess } from "./support/worker-process";

let worker: WorkerProcess;
let owner: Awaited<ReturnType<typeof createUserWithOrg>>;
let key: string;

beforeAll(async () => {
  worker = await startWorker();
  owner = await createUserWithOrg("runs");
  key = (await createTestApiKey(owner.orgId, "member", owner.user.id)).key;
});

afterAll(async () => {
  await worker?.stop();
  await closeQueue();
  await closeRedis();
  await closeDb();
});

const withoutTimings = (result: Record<string, unknown>) => ({ ...result, timings: undefined });

describe("submit → poll → result", () => {
  it("answers 202 with Location, and the run finishes with the same result estimate() gives", async () => {
    const body = { name: "Bell CHSH", ...bellRequest() };
    const res = await api("POST", "/api/v1/runs", { key, body });
    expect(res.status, JSON.stringify(res.body)).toBe(202);
    expect(res.headers.get("location")).toBe(`/api/v1/runs/${res.body.id}`);
    expect(res.body).toMatchObject({ name: "Bell CHSH", status: "queued", qubits: 2, shots: 1000, seed: 11, method: "statevector" });

    const run = await pollRun(key, res.body.id);
    expect(run.status, JSON.stringify(run.error)).toBe("succeeded");
    expect(run.progress).toBe(1);
    const direct = await estimate(bellRequest());
    expect(withoutTimings(run.result)).toEqual(withoutTimings(direct as unknown as Record<string, unknown>));
    // Tsirelson's bound: √2(ZZ + XX) on the Bell state is 2√2 (Cirel'son 1980).
    expect(run.result.exact.value).toBeCloseTo(2 * Math.SQRT2, 12);
    expect(new Date(run.startedAt).getTime()).toBeGreaterThanOrEqual(new Date(run.queuedAt).getTime());
    expect(new Date(run.finishedAt).getTime()).toBeGreaterThanOrEqual(new Date(run.startedAt).getTime());

    const usage = await listRunUsage(owner.orgId, run.id);
    const byMetric = Object.fromEntries(usage.map((u) => [u.metric, u.quantity]));
    expect(byMetric.runs).toBe(1);
    expect(byMetric.shots).toBe(1000);
    expect(byMetric.simulation_seconds).toBeGreaterThan(0);
    expect(usage).toHaveLength(3);
  });
});

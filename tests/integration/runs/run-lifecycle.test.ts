/**
 * The run path end to end against the real MariaDB, Redis and a real worker
 * process (2 engine threads): submit → 202 + Location → poll → succeeded with
 * the result `estimate()` gives; Idempotency-Key; the plan's concurrent-run
 * slots; cancel (queued and running, stopping within a second); a malformed
 * row and an engine error found only in the worker; the plan's time limit;
 * the e-mail to the submitter after a run longer than a minute.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq, sql } from "drizzle-orm";
import { closeDb, db } from "@/db";
import { runs } from "@/db/schema";
import { estimate } from "@/lib/quantum";
import { closeQueue, enqueue } from "@/lib/queue/enqueue";
import { closeRedis } from "@/lib/rate-limit/redis";
import type { EngineRunner } from "@/lib/runs/engine-runner";
import { executeRun } from "@/lib/runs/execute-run";
import { NOTIFY_AFTER_MS, notifyIfLong } from "@/lib/runs/notify";
import { getRunsQueue } from "@/lib/queue/enqueue";
import { waitForMail } from "../../support/maildev";
import { createTestApiKey, createUserWithOrg } from "../../support/factories";
import { api, pollRun } from "./support/api";
import { insertRawRun, runRow, usageOf } from "./support/db-helpers";
import { inProcessEngine } from "./support/in-process-engine";
import { bellRequest, longRunRequest, smallRequest } from "./support/requests";
import { startWorker, type WorkerProcess } from "./support/worker-process";

let worker: WorkerProcess;
let owner: Awaited<ReturnType<typeof createUserWithOrg>>;
let key: string;

beforeAll(async () => {
  [worker, owner] = await Promise.all([startWorker({ concurrency: 2 }), createUserWithOrg("runs")]);
  key = (await createTestApiKey(owner.orgId, "member", owner.user.id)).key;
});

afterAll(async () => {
  await worker?.stop();
  await closeQueue();
  await closeRedis();
  await closeDb();
});

const withoutTimings = (result: Record<string, unknown>) => ({ ...result, timings: undefined });
const metrics = (rows: { metric: string; quantity: number }[]) =>
  Object.fromEntries(rows.map((u) => [u.metric, u.quantity]));

describe("submit → poll → result", () => {
  it("answers 202 with Location, and the run finishes with the result estimate() gives", async () => {
    const res = await api("POST", "/api/v1/runs", {
      key,
      body: { name: "Bell CHSH", ...bellRequest() },
    });
    expect(res.status, JSON.stringify(res.body)).toBe(202);
    expect(res.headers.get("location")).toBe(`/api/v1/runs/${res.body.id}`);
    expect(res.body).toMatchObject({
      name: "Bell CHSH",
      status: "queued",
      qubits: 2,
      shots: 1000,
      seed: 11,
      method: "statevector",
    });

    const run = await pollRun(key, res.body.id);
    expect(run.status, JSON.stringify(run.error)).toBe("succeeded");
    expect(run.progress).toBe(1);
    const direct = await estimate(bellRequest());
    expect(withoutTimings(run.result)).toEqual(
      withoutTimings(direct as unknown as Record<string, unknown>),
    );
    // Tsirelson's bound: √2(ZZ + XX) on the Bell state is 2√2 (Cirel'son 1980).
    expect(run.result.exact.value).toBeCloseTo(2 * Math.SQRT2, 12);
    expect(Date.parse(run.startedAt)).toBeGreaterThanOrEqual(Date.parse(run.queuedAt));
    expect(Date.parse(run.finishedAt)).toBeGreaterThanOrEqual(Date.parse(run.startedAt));
    expect(run.timings.simulateMs).toBeGreaterThanOrEqual(0);

    const usage = await usageOf(owner.orgId, run.id);
    expect(usage).toHaveLength(3);
    expect(metrics(usage)).toMatchObject({ runs: 1, shots: 1000 });
    expect(metrics(usage).simulation_seconds).toBeGreaterThan(0);
    expect(usage[0].period).toBe(new Date(run.finishedAt).toISOString().slice(0, 7));
  });

  it("chooses and stores a seed when none is given, and the result uses it", async () => {
    const res = await api("POST", "/api/v1/runs", {
      key,
      body: { ...bellRequest(), seed: undefined },
    });
    expect(res.status).toBe(202);
    expect(Number.isInteger(res.body.seed)).toBe(true);
    const run = await pollRun(key, res.body.id);
    expect(run.result.seed).toBe(res.body.seed);
    expect(run.name).toBe("2-qubit statevector run, 2 terms");
  });
});

describe("Idempotency-Key", () => {
  it("returns the original run for a repeated key and refuses the key with another body", async () => {
    const headers = { "idempotency-key": `test-${crypto.randomUUID()}` };
    const first = await api("POST", "/api/v1/runs", { key, body: smallRequest(1), headers });
    const again = await api("POST", "/api/v1/runs", { key, body: smallRequest(1), headers });
    expect(first.status).toBe(202);
    expect(again.status).toBe(202);
    expect(again.body.id).toBe(first.body.id);
    expect(again.headers.get("idempotent-replayed")).toBe("true");
    const other = await api("POST", "/api/v1/runs", { key, body: smallRequest(2), headers });
    expect(other.status).toBe(422);
    expect(other.body.type).toBe("/problems/idempotency-key-reused");
    const list = await api("GET", "/api/v1/runs?limit=100", { key });
    expect(list.body.data.filter((r: { id: string }) => r.id === first.body.id)).toHaveLength(1);
    await pollRun(key, first.body.id);
  });
});

describe("concurrency slots and cancellation", () => {
  it("runs one at a time on Sandbox, cancels a queued run at once and stops a running one", async () => {
    const long = await api("POST", "/api/v1/runs", { key, body: longRunRequest(400) });
    expect(long.status, JSON.stringify(long.body)).toBe(202);
    await pollRun(key, long.body.id, {
      until: (r) => r.status === "running" && r.progress > 0,
      timeoutMs: 60_000,
    });

    // Sandbox allows 1 concurrent run: the second waits queued although a thread is free.
    const second = await api("POST", "/api/v1/runs", { key, body: smallRequest(3) });
    await worker.waitForOutput(`run ${second.body.id}: waiting for a slot`);
    expect((await api("GET", `/api/v1/runs/${second.body.id}`, { key })).body.status).toBe(
      "queued",
    );
    const canceledQueued = await api("POST", `/api/v1/runs/${second.body.id}/cancel`, { key });
    expect(canceledQueued.status).toBe(200);
    expect(canceledQueued.body.status).toBe("canceled");

    const canceled = await api("POST", `/api/v1/runs/${long.body.id}/cancel`, { key });
    expect(canceled.status).toBe(200);
    expect(canceled.body.status).toBe("canceled");
    // The worker stops the engine thread (a 400-layer run would take far longer to finish).
    await worker.waitForOutput(`run ${long.body.id}: canceled`);
    // The slot and the engine thread are free again: a new run finishes.
    const third = await api("POST", "/api/v1/runs", { key, body: smallRequest(4) });
    expect((await pollRun(key, third.body.id, { timeoutMs: 60_000 })).status).toBe("succeeded");

    const after = await api("GET", `/api/v1/runs/${long.body.id}`, { key });
    expect(after.body.status).toBe("canceled");
    expect(after.body.result).toBeNull();
    // A canceled run meters only the engine time it used; never a run or shots.
    expect(Object.keys(metrics(await usageOf(owner.orgId, long.body.id)))).toEqual([
      "simulation_seconds",
    ]);
    expect(await usageOf(owner.orgId, second.body.id)).toHaveLength(0);
    // Canceling again is a no-op; a finished run cannot be canceled.
    expect((await api("POST", `/api/v1/runs/${long.body.id}/cancel`, { key })).status).toBe(200);
    const finished = await api("POST", `/api/v1/runs/${third.body.id}/cancel`, { key });
    expect(finished.status).toBe(409);
  });
});

describe("faults found only in the worker", () => {
  it("fails a malformed run row without retrying", async () => {
    const runId = await insertRawRun(owner.orgId, { circuit: { format: "qasm9", source: "x" } });
    await enqueue("run.execute", { orgId: owner.orgId, runId }, { jobId: runId });
    const run = await pollRun(key, runId);
    expect(run.status).toBe("failed");
    expect(run.error.type).toBe("/problems/run-malformed");
    expect(run.error.detail).toMatch(/circuit/);
    expect((await runRow(owner.orgId, runId)).attempts).toBe(1);
  });

  it("fails with the engine's problem (line and column) when the engine rejects the stored request", async () => {
    const request = bellRequest({
      circuit: {
        format: "qasm2",
        source: 'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[2];\nfoo q[0];\n',
      },
    });
    const runId = await insertRawRun(owner.orgId, request);
    await enqueue("run.execute", { orgId: owner.orgId, runId }, { jobId: runId });
    const run = await pollRun(key, runId);
    expect(run.status).toBe("failed");
    expect(run.error.status).toBe(400);
    expect(run.error.type).toMatch(/^\/problems\/engine\//);
    expect(run.error.errors[0]).toMatchObject({ path: "circuit.source", line: 4 });
    expect(Object.keys(metrics(await usageOf(owner.orgId, runId)))).toEqual(["simulation_seconds"]);
  });

  it("stops an attempt another worker took over, reports it superseded and meters nothing", async () => {
    const runId = await insertRawRun(owner.orgId, longRunRequest(400), {
      method: "density_matrix",
      qubits: 8,
    });
    const engine: EngineRunner = {
      run: (request, options) => {
        // Another worker claims the run (as after a lost job lock) while this attempt computes.
        void db
          .update(runs)
          .set({ attempts: sql`${runs.attempts} + 1` })
          .where(eq(runs.id, runId))
          .execute();
        return inProcessEngine.run(request, options);
      },
    };
    const outcome = await executeRun({ orgId: owner.orgId, runId }, engine, () => {});
    expect(outcome.kind).toBe("superseded");
    const row = await runRow(owner.orgId, runId);
    expect(row.status).toBe("running");
    expect(row.attempts).toBe(2);
    expect(await usageOf(owner.orgId, runId)).toEqual([]);
    // Nobody runs attempt 2 here: free the organisation's run slot for the next test.
    await db
      .update(runs)
      .set({ status: "canceled", finishedAt: new Date() })
      .where(eq(runs.id, runId));
  });

  it("stops a run at its time limit with a clear problem", async () => {
    const runId = await insertRawRun(owner.orgId, longRunRequest(40), {
      method: "density_matrix",
      qubits: 8,
    });
    const outcome = await executeRun({ orgId: owner.orgId, runId }, inProcessEngine, () => {}, {
      timeLimitMs: 300,
    });
    expect(outcome.kind).toBe("failed");
    const row = await runRow(owner.orgId, runId);
    expect(row.status).toBe("failed");
    expect(row.error?.type).toBe("/problems/run-time-limit");
    expect(row.error?.detail).toMatch(/Sandbox/);
    expect(Object.keys(metrics(await usageOf(owner.orgId, runId)))).toEqual(["simulation_seconds"]);
  });
});

describe("finished-run e-mail", () => {
  it("mails the submitter (the key's creator) about a run that took over a minute, and only then", async () => {
    const res = await api("POST", "/api/v1/runs", {
      key,
      body: { name: "long study", ...bellRequest() },
    });
    const run = await pollRun(key, res.body.id);
    expect(run.status).toBe("succeeded");
    await notifyIfLong(owner.orgId, run.id, NOTIFY_AFTER_MS - 1, () => {});
    expect(await getRunsQueue().getJob(`mail-${run.id}`)).toBeUndefined();
    const since = new Date(Date.now() - 1000);
    await notifyIfLong(owner.orgId, run.id, NOTIFY_AFTER_MS + 1, () => {});
    const mail = await waitForMail(owner.user.email, since);
    expect(mail.subject).toBe('Run "long study" finished');
    expect(mail.text).toContain(`/app/runs/${run.id}`);
    expect(mail.text).toContain("2.8284271"); // exact value 2√2, printed to 8 significant digits
  });
});

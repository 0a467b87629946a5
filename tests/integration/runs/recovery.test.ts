/**
 * Safety nets of the worker: the final failure of a run's job (retries
 * exhausted, e.g. the database unreachable) marks the run failed with a plain
 * problem; the sweeper re-queues a queued run whose job went missing and fails
 * a running run whose job is gone past its plan's time limit; usage totals
 * count each run's usage once.
 */
import type { Job } from "bullmq";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db";
import { JOB_ATTEMPTS } from "@/lib/queue/jobs";
import { closeQueue, getRunsQueue } from "@/lib/queue/enqueue";
import { closeRedis } from "@/lib/rate-limit/redis";
import { sweepOrphanRuns } from "@/lib/runs/sweep";
import { db } from "@/db";
import { usageEvents } from "@/db/schema";
import { recordRunUsage } from "@/lib/usage/mutations";
import { currentPeriod } from "@/lib/usage/period";
import { getUsageTotals } from "@/lib/usage/queries";
import { failRunAfterRetries } from "@/worker/give-up";
import { EngineThreadError } from "@/worker/engine-pool";
import { createUserWithOrg } from "../../support/factories";
import { cancelLeftoverRuns, insertRawRun, runRow, usageOf } from "./support/db-helpers";
import { bellRequest } from "./support/requests";

let owner: Awaited<ReturnType<typeof createUserWithOrg>>;

beforeAll(async () => {
  owner = await createUserWithOrg("recovery");
});

afterAll(async () => {
  await cancelLeftoverRuns([owner.orgId]);
  await closeQueue();
  await closeRedis();
  await closeDb();
});

const fakeJob = (runId: string, attemptsMade: number) =>
  ({
    name: "run.execute",
    data: { orgId: owner.orgId, runId },
    attemptsMade,
    opts: { attempts: JOB_ATTEMPTS },
  }) as unknown as Job;

describe("final job failure", () => {
  it("leaves the run alone while retries remain, then fails it with a plain reason", async () => {
    const runId = await insertRawRun(owner.orgId, bellRequest(), {
      status: "running",
      attempts: 1,
    });
    const dbDown = Object.assign(new Error("connect ECONNREFUSED 127.0.0.1:3307"), {
      code: "ECONNREFUSED",
    });
    await failRunAfterRetries(fakeJob(runId, JOB_ATTEMPTS - 1), dbDown);
    expect((await runRow(owner.orgId, runId)).status).toBe("running");
    await failRunAfterRetries(fakeJob(runId, JOB_ATTEMPTS), dbDown);
    const row = await runRow(owner.orgId, runId);
    expect(row.status).toBe("failed");
    expect(row.error?.type).toBe("/problems/run-infrastructure");
    expect(row.error?.detail).toContain(`after ${JOB_ATTEMPTS} attempts`);
    expect(row.error?.detail).toContain("the database was unreachable");
    expect(row.error?.detail).not.toContain("ECONNREFUSED");
    // Announced like every terminal transition: the webhook fan-out job exists.
    expect(await getRunsQueue().getJob(`hooks-${runId}`)).toBeDefined();
  });

  it("names a crashed engine and a stalled worker, and never touches a finished run", async () => {
    const crashed = await insertRawRun(owner.orgId, bellRequest(), { status: "running" });
    await failRunAfterRetries(
      fakeJob(crashed, JOB_ATTEMPTS),
      new EngineThreadError("engine thread exited with code 1"),
    );
    expect((await runRow(owner.orgId, crashed)).error?.detail).toContain(
      "the simulation engine stopped unexpectedly",
    );
    const stalled = await insertRawRun(owner.orgId, bellRequest(), { status: "running" });
    await failRunAfterRetries(
      fakeJob(stalled, 1),
      new Error("job stalled more than allowable limit"),
    );
    expect((await runRow(owner.orgId, stalled)).error?.detail).toContain(
      "its worker stopped responding",
    );
    const done = await insertRawRun(owner.orgId, bellRequest(), { status: "succeeded" });
    await failRunAfterRetries(fakeJob(done, JOB_ATTEMPTS), new Error("late"));
    expect((await runRow(owner.orgId, done)).status).toBe("succeeded");
    expect(await getRunsQueue().getJob(`hooks-${done}`)).toBeUndefined();
  });
});

describe("sweeper", () => {
  it("re-queues a queued run whose job is missing and fails a lost running run", async () => {
    const now = Date.now();
    const orphan = await insertRawRun(owner.orgId, bellRequest(), {
      queuedAt: new Date(now - 5 * 60_000),
    });
    const fresh = await insertRawRun(owner.orgId, bellRequest(), {
      queuedAt: new Date(now - 5_000),
    });
    // Sandbox runs stop after 60 s; this one started 10 minutes ago and has no job.
    const lost = await insertRawRun(owner.orgId, bellRequest(), {
      status: "running",
      startedAt: new Date(now - 10 * 60_000),
    });
    await sweepOrphanRuns(new Date(now));
    const queue = getRunsQueue();
    expect(await queue.getJob(orphan)).toBeDefined();
    expect(await queue.getJob(fresh)).toBeUndefined();
    const lostRow = await runRow(owner.orgId, lost);
    expect(lostRow.status).toBe("failed");
    expect(lostRow.error?.detail).toContain("its job was lost");
    expect(await queue.getJob(`hooks-${lost}`)).toBeDefined();
  });
});

describe("usage totals", () => {
  it("count a run's usage once however often it is written, and heal from the events", async () => {
    const org = await createUserWithOrg("totals");
    const period = currentPeriod();
    const first = await insertRawRun(org.orgId, bellRequest(), { status: "succeeded" });
    const usage = { runs: 1, shots: 1000, simulationSeconds: 0.25 };
    await db.transaction((tx) => recordRunUsage(tx, org.orgId, first, period, usage));
    await db.transaction((tx) => recordRunUsage(tx, org.orgId, first, period, usage));
    expect(await usageOf(org.orgId, first)).toHaveLength(3);
    expect(await getUsageTotals(org.orgId, period)).toEqual({
      runs: 1,
      shots: 1000,
      simulationSeconds: 0.25,
    });
    // A run whose shots event exists already: totals are rebuilt from the events.
    const second = await insertRawRun(org.orgId, bellRequest(), { status: "succeeded" });
    await db
      .insert(usageEvents)
      .values({ orgId: org.orgId, runId: second, metric: "shots", quantity: 500, period });
    await db.transaction((tx) =>
      recordRunUsage(tx, org.orgId, second, period, {
        runs: 1,
        shots: 500,
        simulationSeconds: 0.5,
      }),
    );
    expect(await getUsageTotals(org.orgId, period)).toEqual({
      runs: 2,
      shots: 1500,
      simulationSeconds: 0.75,
    });
  });
});

/**
 * Plan limits (numbers from lib/billing/plans.ts) and rate limits, each
 * refusal a problem that names the limit and the current figures:
 * 402 qubits per method, monthly shots, simulation-seconds; 429 for the
 * backlog of unfinished runs, the per-person submission budget (shared by a
 * person's keys) and the per-key request budget.
 */
import { afterAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db";
import { runs } from "@/db/schema";
import { getPlan } from "@/lib/billing/plans";
import { env } from "@/lib/env";
import { closeQueue } from "@/lib/queue/enqueue";
import { closeRedis } from "@/lib/rate-limit/redis";
import { requestHash } from "@/lib/runs/request-hash";
import { recordRunUsage } from "@/lib/usage/mutations";
import { currentPeriod } from "@/lib/usage/period";
import {
  createTestApiKey,
  createTestUser,
  createUserWithOrg,
  addMember,
} from "../../support/factories";
import { api } from "../runs/support/api";
import { cancelLeftoverRuns, insertRawRun, setPlan } from "../runs/support/db-helpers";
import { bellRequest } from "../runs/support/requests";

const orgIds: string[] = [];

afterAll(async () => {
  await cancelLeftoverRuns(orgIds);
  await closeQueue();
  await closeRedis();
  await closeDb();
});

async function orgWithKey(label: string) {
  const owner = await createUserWithOrg(label);
  const { key } = await createTestApiKey(owner.orgId, "member", owner.user.id);
  orgIds.push(owner.orgId);
  return { ...owner, key };
}

/** A circuit of n qubits: H on each. */
function wideRequest(n: number, extra: Record<string, unknown> = {}) {
  const source = `OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[${n}];\nh q;\n`;
  return {
    circuit: { format: "qasm2", source },
    observable: { format: "pauli", terms: "Z0" },
    ...extra,
  };
}

/** Meters usage as a finished run would (events + monthly totals, one transaction). */
async function addUsage(orgId: string, metric: "shots" | "simulation_seconds", quantity: number) {
  const runId = await insertRawRun(orgId, bellRequest(), { status: "succeeded" });
  const usage = metric === "shots" ? { shots: quantity } : { simulationSeconds: quantity };
  await db.transaction((tx) => recordRunUsage(tx, orgId, runId, currentPeriod(), usage));
}

describe("plan limits (402)", () => {
  const sandbox = getPlan("sandbox").limits;

  it("refuses more qubits than the plan allows for the method, and a larger plan accepts them", async () => {
    const org = await orgWithKey("qubits");
    const tooWide = await api("POST", "/api/v1/runs", {
      key: org.key,
      body: wideRequest(sandbox.maxStatevectorQubits + 1),
    });
    expect(tooWide.status).toBe(402);
    expect(tooWide.body.type).toBe("/problems/quota-exceeded");
    expect(tooWide.body.detail).toContain(`up to ${sandbox.maxStatevectorQubits} qubits`);
    expect(tooWide.body.detail).toContain(`has ${sandbox.maxStatevectorQubits + 1}`);
    const dm = await api("POST", "/api/v1/runs", {
      key: org.key,
      body: wideRequest(sandbox.maxDensityMatrixQubits + 1, { method: "density_matrix" }),
    });
    expect(dm.status).toBe(402);
    expect(dm.body.detail).toMatch(/density matrix circuits of up to 8 qubits/);
    await setPlan(org.orgId, "lab");
    const accepted = await api("POST", "/api/v1/runs", {
      key: org.key,
      body: wideRequest(sandbox.maxStatevectorQubits + 1),
    });
    expect(accepted.status).toBe(202);
  });

  it("refuses shots beyond the Sandbox month, counting shots of unfinished runs", async () => {
    const org = await orgWithKey("shots");
    await addUsage(org.orgId, "shots", sandbox.monthlyShots - 1500);
    const first = await api("POST", "/api/v1/runs", {
      key: org.key,
      body: bellRequest({ shots: 1000 }),
    });
    expect(first.status).toBe(202);
    const second = await api("POST", "/api/v1/runs", {
      key: org.key,
      body: bellRequest({ shots: 1000 }),
    });
    expect(second.status).toBe(402);
    expect(second.body.detail).toContain("1,000,000 shots a month");
    expect(second.body.detail).toContain("998,500 are used");
    expect(second.body.detail).toContain("1,000 are reserved by unfinished runs");
    expect(second.body.detail).toContain("500 remain");
    // Exact-only runs draw no shots and are still accepted.
    expect(
      (await api("POST", "/api/v1/runs", { key: org.key, body: bellRequest({ shots: 0 }) })).status,
    ).toBe(202);
    // Paid plans bill overage instead of refusing.
    await setPlan(org.orgId, "lab");
    await addUsage(org.orgId, "shots", getPlan("lab").limits.monthlyShots);
    expect(
      (await api("POST", "/api/v1/runs", { key: org.key, body: bellRequest({ shots: 1000 }) }))
        .status,
    ).toBe(202);
  });

  it("refuses runs once the Sandbox simulation-seconds are used up, and reports usage", async () => {
    const org = await orgWithKey("seconds");
    await addUsage(org.orgId, "simulation_seconds", sandbox.monthlySimulationSeconds);
    const res = await api("POST", "/api/v1/runs", {
      key: org.key,
      body: bellRequest({ shots: 0 }),
    });
    expect(res.status).toBe(402);
    expect(res.body.detail).toContain(`${sandbox.monthlySimulationSeconds} simulation-seconds`);
    const preview = await api("POST", "/api/v1/runs/preview", {
      key: org.key,
      body: bellRequest(),
    });
    expect(preview.body.quota.allowed).toBe(false);
    expect(preview.body.quota.refusals[0]).toMatchObject({
      limit: "monthly_simulation_seconds",
      status: 402,
    });
    const usage = await api("GET", "/api/v1/usage", { key: org.key });
    expect(usage.status).toBe(200);
    expect(usage.body.meters.simulationSeconds).toMatchObject({
      used: sandbox.monthlySimulationSeconds,
      remaining: 0,
      overage: false,
    });
    expect(usage.body.runs.concurrentLimit).toBe(sandbox.concurrentRuns);
  });
});

describe("429 limits", () => {
  it("refuses submissions when the organisation already has its maximum of unfinished runs", async () => {
    const org = await orgWithKey("backlog");
    const max = env.RUNS_MAX_UNFINISHED;
    await db.insert(runs).values(
      Array.from({ length: max }, () => ({
        id: crypto.randomUUID(),
        orgId: org.orgId,
        name: "waiting",
        request: bellRequest(),
        method: "statevector" as const,
        qubits: 2,
        shots: 0,
        seed: 1,
        requestHash: requestHash(bellRequest()),
      })),
    );
    const res = await api("POST", "/api/v1/runs", {
      key: org.key,
      body: bellRequest({ shots: 0 }),
    });
    expect(res.status).toBe(429);
    expect(res.body.type).toBe("/problems/too-many-runs");
    expect(res.body.detail).toContain(`${max} runs queued or running`);
    expect(Number(res.headers.get("retry-after"))).toBeGreaterThan(0);
  });

  it("limits submissions per person across all their keys, not across colleagues", async () => {
    const org = await orgWithKey("submit-rate");
    const [k1, k2] = [org.key, (await createTestApiKey(org.orgId, "member", org.user.id)).key];
    const colleague = await createTestUser("colleague");
    await addMember(org.orgId, colleague.id, "member");
    const k3 = (await createTestApiKey(org.orgId, "member", colleague.id)).key;
    await setPlan(org.orgId, "institute");
    const budget = env.RUN_SUBMIT_LIMIT_PER_MINUTE;
    const body = bellRequest({ shots: 0 });
    for (let i = 0; i < budget; i++) {
      const res = await api("POST", "/api/v1/runs", { key: i % 2 ? k1 : k2, body });
      expect(res.status, JSON.stringify(res.body)).toBe(202);
    }
    const over = await api("POST", "/api/v1/runs", { key: k2, body });
    expect(over.status).toBe(429);
    expect(over.body.detail).toMatch(/Too many runs submitted/);
    expect((await api("POST", "/api/v1/runs", { key: k3, body })).status).toBe(202);
  });

  it("limits requests per key", async () => {
    const org = await orgWithKey("key-rate");
    const budget = env.API_RATE_LIMIT_PER_MINUTE;
    for (let i = 0; i < budget; i++)
      expect((await api("GET", "/api/v1/usage", { key: org.key })).status).toBe(200);
    const over = await api("GET", "/api/v1/usage", { key: org.key });
    expect(over.status).toBe(429);
    expect(Number(over.headers.get("retry-after"))).toBeGreaterThan(0);
    const other = (await createTestApiKey(org.orgId, "viewer", org.user.id)).key;
    expect((await api("GET", "/api/v1/usage", { key: other })).status).toBe(200);
  });
});

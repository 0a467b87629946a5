/**
 * Shot accounting and refusals at POST /api/v1/runs (no worker: the run is executed
 * in-process with execute-run.ts):
 * - targetPrecision planned from the state's exact variances at submission: the run
 *   records shots = planned, shotsPlan = "state_aware", and after running
 *   shotsDrawn = planned = the metered (billed) shots (N = (Σ_g √Var_g)²/ε², McClean et
 *   al. 2016);
 * - a precision no plan reaches (1e-300) is a 422 naming the shots, on free and paid plans;
 * - readout mitigation with p1Given0 + p0Given1 ≥ 1 (singular assignment matrix) is a 422;
 * - a register of 10^30 qubits is "too many", a Pauli sum with '*' between factors is accepted.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db";
import { closeQueue } from "@/lib/queue/enqueue";
import { closeRedis } from "@/lib/rate-limit/redis";
import { executeRun } from "@/lib/runs/execute-run";
import { createTestApiKey, createUserWithOrg } from "../../support/factories";
import { api } from "../runs/support/api";
import { cancelLeftoverRuns, runRow, setPlan, usageOf } from "../runs/support/db-helpers";
import { inProcessEngine } from "../runs/support/in-process-engine";
import { bellRequest, smallRequest } from "../runs/support/requests";

let free: Awaited<ReturnType<typeof createUserWithOrg>>;
let paid: Awaited<ReturnType<typeof createUserWithOrg>>;
let freeKey: string;
let paidKey: string;

beforeAll(async () => {
  [free, paid] = await Promise.all([
    createUserWithOrg("refusals-free"),
    createUserWithOrg("refusals-paid"),
  ]);
  await setPlan(paid.orgId, "institute");
  freeKey = (await createTestApiKey(free.orgId, "member", free.user.id)).key;
  paidKey = (await createTestApiKey(paid.orgId, "member", paid.user.id)).key;
});

afterAll(async () => {
  if (free && paid) await cancelLeftoverRuns([free.orgId, paid.orgId]);
  await closeQueue();
  await closeRedis();
  await closeDb();
});

const post = (body: unknown, key = freeKey) => api("POST", "/api/v1/runs", { key, body });

describe("planned and drawn shots", () => {
  it("a targetPrecision run is quota-checked and recorded with the shots it will draw, and draws exactly those", async () => {
    const body = { ...smallRequest(3), shots: undefined, targetPrecision: 0.02 };
    const preview = await api("POST", "/api/v1/runs/preview", { key: freeKey, body });
    expect(preview.status, JSON.stringify(preview.body)).toBe(200);
    expect(preview.body.varianceSource).toBe("state_aware");
    expect(preview.body.quota.shots).toBe(preview.body.totalShots);
    const res = await post(body);
    expect(res.status, JSON.stringify(res.body)).toBe(202);
    expect(res.body).toMatchObject({
      shots: preview.body.totalShots,
      shotsPlan: "state_aware",
      shotsDrawn: null,
    });
    await executeRun({ orgId: free.orgId, runId: res.body.id }, inProcessEngine, () => {});
    const row = await runRow(free.orgId, res.body.id);
    expect(row.status).toBe("succeeded");
    expect(row.shotsDrawn).toBe(preview.body.totalShots);
    const shotsMetered = (await usageOf(free.orgId, res.body.id)).find((u) => u.metric === "shots");
    expect(Number(shotsMetered!.quantity)).toBe(row.shotsDrawn);
    const view = await api("GET", `/api/v1/runs/${res.body.id}`, { key: freeKey });
    expect(view.body).toMatchObject({
      shots: row.shots,
      shotsDrawn: row.shotsDrawn,
      shotsPlan: "state_aware",
    });
    const list = await api("GET", "/api/v1/runs", { key: freeKey });
    expect(list.body.data.find((r: { id: string }) => r.id === res.body.id)).toMatchObject({
      shotsDrawn: row.shotsDrawn,
      shotsPlan: "state_aware",
    });
  });

  it("a fixed-shots run says so", async () => {
    const res = await post(bellRequest());
    expect(res.body).toMatchObject({ shots: 1000, shotsPlan: "fixed" });
  });
});

describe("refused at submission", () => {
  it.each([
    ["Sandbox", () => freeKey],
    ["Institute (pays overage)", () => paidKey],
  ])(
    "targetPrecision 1e-300 on %s: 422 naming the shots it would need, no run created",
    async (_plan, key) => {
      const res = await post(
        { ...smallRequest(4), shots: undefined, targetPrecision: 1e-300 },
        key(),
      );
      expect(res.status, JSON.stringify(res.body)).toBe(422);
      expect(res.headers.get("content-type")).toBe("application/problem+json");
      expect(res.body.type).toBe("/problems/engine/infeasible");
      expect(res.body.detail).toMatch(
        /a standard error of 1e-300 needs about .*×10\^\d+ shots .* more than the limit of 100,000,000 per run/,
      );
      expect(res.body.errors[0].path).toBe("targetPrecision");
    },
  );

  it("readout mitigation with a singular assignment matrix: 422 on the field, also in the preview", async () => {
    const body = bellRequest({
      mitigateReadout: true,
      noise: { readout: { p1Given0: 0.4, p0Given1: 0.6 } },
    });
    for (const path of ["/api/v1/runs", "/api/v1/runs/preview"]) {
      const res = await api("POST", path, { key: freeKey, body });
      expect(res.status).toBe(422);
      expect(res.body.errors.map((e: { path: string }) => e.path)).toEqual([
        "mitigateReadout",
        "noise.readout.p0Given1",
      ]);
      expect(res.body.detail).toMatch(/p1Given0 \+ p0Given1 < 1/);
    }
  });

  it("a register of 10^30 qubits names the real problem (too many qubits) with line and column", async () => {
    const source =
      'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[1000000000000000000000000000000];\n';
    const res = await post(bellRequest({ circuit: { format: "qasm2", source } }));
    expect(res.status).toBe(400);
    expect(res.body.type).toBe("/problems/engine/too-large");
    expect(res.body.errors[0]).toMatchObject({ path: "circuit.source", line: 3, column: 8 });
    expect(res.body.detail).toMatch(
      /declares 1,000,000,000,000,000,000,000,000,000,000 qubits: too many/,
    );
  });

  it("accepts '*' between Pauli factors", async () => {
    const res = await post(
      bellRequest({
        observable: {
          format: "pauli",
          terms: "1.4142135623730951*Z0*Z1 + 1.4142135623730951 * X0 * X1",
        },
      }),
    );
    expect(res.status, JSON.stringify(res.body)).toBe(202);
  });
});

/**
 * `points` and `gradient` through the API and a real worker: bad lists and gradient
 * requests are refused at submission with their field path (4xx problems, nothing queued);
 * the preview shows the gradient's extra shots; a run with points and gradients finishes
 * with the result estimate() gives, and every point's shots — the shifted circuits'
 * included — are planned, stored and metered.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db";
import { estimate } from "@/lib/quantum";
import { closeQueue } from "@/lib/queue/enqueue";
import { closeRedis } from "@/lib/rate-limit/redis";
import { createTestApiKey, createUserWithOrg } from "../../support/factories";
import { api, pollRun } from "./support/api";
import { usageOf } from "./support/db-helpers";
import { startWorker, type WorkerProcess } from "./support/worker-process";

let worker: WorkerProcess;
let owner: Awaited<ReturnType<typeof createUserWithOrg>>;
let key: string;

beforeAll(async () => {
  [worker, owner] = await Promise.all([
    startWorker({ concurrency: 1 }),
    createUserWithOrg("points"),
  ]);
  key = (await createTestApiKey(owner.orgId, "member", owner.user.id)).key;
});

afterAll(async () => {
  await worker?.stop();
  await closeQueue();
  await closeRedis();
  await closeDb();
});

const SOURCE = [
  "OPENQASM 3.0;",
  'include "stdgates.inc";',
  "qubit[2] q;",
  "input float theta;",
  "input float phi;",
  "ry(theta) q[0];",
  "crx(0.5*phi + 0.1) q[0], q[1];",
  "rz(sin(theta)) q[1];",
].join("\n");

const request = (extra: Record<string, unknown> = {}) => ({
  circuit: { format: "qasm3", source: SOURCE },
  observable: { format: "pauli", terms: "Z0 Z1 + 0.5 X1" },
  shots: 200,
  seed: 4,
  ...extra,
});

describe("refused at submission", () => {
  it("a point with a missing or unknown input answers 400 with the point's path", async () => {
    let res = await api("POST", "/api/v1/runs", {
      key,
      body: request({ points: [{ theta: 1, phi: 2 }, { theta: 1 }] }),
    });
    expect(res.status).toBe(400);
    expect(res.body.errors[0].path).toBe("points[1].phi");
    res = await api("POST", "/api/v1/runs", {
      key,
      body: request({ points: [{ theta: 1, phi: 2, psi: 0 }] }),
    });
    expect(res.status).toBe(400);
    expect(res.body.errors[0].path).toBe("points[0].psi");
  });

  it("a non-numeric value, more than 10,000 points, or points with sweep answer 4xx naming the field", async () => {
    let res = await api("POST", "/api/v1/runs", {
      key,
      body: request({
        points: [
          { theta: 1, phi: 2 },
          { theta: "x", phi: 2 },
        ],
      }),
    });
    expect(res.status).toBe(422);
    expect(res.body.errors.map((e: { path: string }) => e.path)).toContain("points[1].theta");
    res = await api("POST", "/api/v1/runs", {
      key,
      body: request({ points: Array.from({ length: 10_001 }, () => ({ theta: 0, phi: 0 })) }),
    });
    expect(res.status).toBe(422);
    expect(res.body.errors.map((e: { path: string }) => e.path)).toContain("points");
    res = await api("POST", "/api/v1/runs", {
      key,
      body: request({ points: [{ theta: 1, phi: 2 }], sweep: { theta: [0, 1] } }),
    });
    expect(res.status).toBe(422);
  });

  it("gradient on a circuit without inputs answers 400 at gradient", async () => {
    const res = await api("POST", "/api/v1/runs", {
      key,
      body: {
        circuit: {
          format: "qasm2",
          source: 'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[1];\nh q[0];\n',
        },
        observable: { format: "pauli", terms: "Z0" },
        gradient: true,
      },
    });
    expect(res.status).toBe(400);
    expect(res.body.errors[0].path).toBe("gradient");
  });
});

describe("a run with points and gradients", () => {
  it("previews, runs and meters every point's shots, shifted circuits included", async () => {
    const points = [
      { theta: 0.3, phi: -0.4 },
      { theta: 1.1, phi: 0.9 },
      { theta: -0.5, phi: 2.0 },
    ];
    const body = request({ points, gradient: true });
    const preview = await api("POST", "/api/v1/runs/preview", { key, body });
    expect(preview.status, JSON.stringify(preview.body)).toBe(200);
    // ry and rz: two shifted circuits each; crx: four (controlled rotation) — 8 × 200 shots per point.
    expect(preview.body.gradient).toEqual({
      inputs: ["theta", "phi"],
      shiftedCircuits: 8,
      shotsPerPoint: 1600,
    });
    expect(preview.body.totalShots).toBe(3 * (200 + 1600));

    const res = await api("POST", "/api/v1/runs", { key, body });
    expect(res.status, JSON.stringify(res.body)).toBe(202);
    expect(res.body.shots).toBe(3 * 1800);
    const run = await pollRun(key, res.body.id);
    expect(run.status, JSON.stringify(run.error)).toBe("succeeded");
    const direct = await estimate(body as never);
    expect(run.result.sweep).toEqual(direct.sweep);
    expect(run.result.sweep.points.map((p: { params: unknown }) => p.params)).toEqual(points);
    expect(run.result.sweep.points[2].gradientShots).toBe(1600);
    const usage = Object.fromEntries(
      (await usageOf(owner.orgId, run.id)).map((u) => [u.metric, u.quantity]),
    );
    expect(usage.shots).toBe(3 * 1800);
  });
});

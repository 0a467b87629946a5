/**
 * GET /api/v1/runs/:id?wait=N (held until the run is terminal, woken by the
 * run-finished announcement on Redis, bounded per process, released when the
 * client goes away), the RateLimit-* answer fields
 * (draft-ietf-httpapi-ratelimit-headers-06) and the run exports
 * (terms.csv, counts.csv, points.csv, circuits.zip — the same bytes as the run
 * page's functions in lib/export). Runs are executed in-process, no worker.
 */
import { strFromU8, unzipSync } from "fflate";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db";
import { withOrg } from "@/lib/api/with-org";
import { env } from "@/lib/env";
import { countsCsv, sweepCsv, termsCsv } from "@/lib/export/run-export";
import { closeQueue } from "@/lib/queue/enqueue";
import { closeRedis } from "@/lib/rate-limit/redis";
import { executeRun } from "@/lib/runs/execute-run";
import { announceRunFinished } from "@/lib/runs/run-events";
import {
  activeWaiters,
  closeRunWaiters,
  MAX_WAITERS,
  registerRunWaiter,
  type RunWaiter,
} from "@/lib/runs/run-waiter";
import { createTestApiKey, createUserWithOrg, uniqueSuffix } from "../../support/factories";
import { api } from "../runs/support/api";
import { cancelLeftoverRuns } from "../runs/support/db-helpers";
import { inProcessEngine } from "../runs/support/in-process-engine";
import { BELL_QASM, bellRequest } from "../runs/support/requests";

let a: Awaited<ReturnType<typeof createUserWithOrg>>;
let b: Awaited<ReturnType<typeof createUserWithOrg>>;
let key: string;
let keyB: string;

beforeAll(async () => {
  [a, b] = await Promise.all([createUserWithOrg("wait-a"), createUserWithOrg("wait-b")]);
  key = (await createTestApiKey(a.orgId, "member", a.user.id)).key;
  keyB = (await createTestApiKey(b.orgId, "member", b.user.id)).key;
});

afterAll(async () => {
  if (a && b) await cancelLeftoverRuns([a.orgId, b.orgId]);
  await closeRunWaiters();
  await closeQueue();
  await closeRedis();
  await closeDb();
});

const submit = async (body: unknown) => {
  const res = await api("POST", "/api/v1/runs", { key, body });
  expect(res.status, JSON.stringify(res.body)).toBe(202);
  return res.body.id as string;
};
const run = (id: string) => executeRun({ orgId: a.orgId, runId: id }, inProcessEngine, () => {});

/** Resolves once `n` requests of this process are waiting (a condition, checked between event-loop turns). */
async function waitersReach(n: number): Promise<void> {
  while (activeWaiters() < n) await new Promise((r) => setImmediate(r));
}

describe("GET /runs/:id?wait=N", () => {
  it("holds the answer while the run is queued and answers the finished run once the worker announces it", async () => {
    const id = await submit(bellRequest());
    const before = activeWaiters();
    const waiting = api("GET", `/api/v1/runs/${id}?wait=30`, { key });
    await waitersReach(before + 1);
    await run(id);
    const res = await waiting;
    expect(res.status).toBe(200);
    expect(res.body.status).toBe("succeeded");
    // Tsirelson's bound: √2(ZZ + XX) on the Bell state is 2√2 (Cirel'son 1980).
    expect(res.body.result.exact.value).toBeCloseTo(2 * Math.SQRT2, 12);
    expect(activeWaiters()).toBe(before);
  });

  it("wakes a waiter on cancel too, and answers a terminal run at once without waiting", async () => {
    const id = await submit(bellRequest({ shots: 0 }));
    const waiting = api("GET", `/api/v1/runs/${id}?wait=30`, { key });
    await waitersReach(1);
    expect((await api("POST", `/api/v1/runs/${id}/cancel`, { key })).status).toBe(200);
    expect((await waiting).body.status).toBe("canceled");
    const again = api("GET", `/api/v1/runs/${id}?wait=30`, { key });
    expect(activeWaiters()).toBe(0);
    expect((await again).body.status).toBe("canceled");
  });

  it("releases the wait when the client goes away", async () => {
    const id = await submit(bellRequest({ shots: 0 }));
    const controller = new AbortController();
    const waiting = api("GET", `/api/v1/runs/${id}?wait=30`, { key, signal: controller.signal });
    await waitersReach(1);
    controller.abort();
    await waiting.catch(() => null);
    expect(activeWaiters()).toBe(0);
  });

  it("answers the run as it is when the wait is over (wait=0 waits not at all)", async () => {
    const id = await submit(bellRequest({ shots: 0 }));
    expect((await api("GET", `/api/v1/runs/${id}?wait=0`, { key })).body.status).toBe("queued");
    expect((await api("GET", `/api/v1/runs/${id}?wait=0.05`, { key })).body.status).toBe("queued");
    expect(activeWaiters()).toBe(0);
  });

  it("refuses a wait over 30 s, a negative or non-numeric one, and unknown query fields with 400 naming the field", async () => {
    const id = await submit(bellRequest({ shots: 0 }));
    for (const query of ["wait=31", "wait=-1", "wait=soon"]) {
      const res = await api("GET", `/api/v1/runs/${id}?${query}`, { key });
      expect(res.status, query).toBe(400);
      expect(res.body.type).toBe("/problems/bad-request");
      expect(res.body.errors[0].path).toBe("wait");
    }
    const unknown = await api("GET", `/api/v1/runs/${id}?timeout=5`, { key });
    expect(unknown.status).toBe(400);
    expect(unknown.body.errors[0]).toMatchObject({ path: "timeout", message: "unknown field" });
  });

  it("answers 404 for another organisation's run, also with wait", async () => {
    const id = await submit(bellRequest({ shots: 0 }));
    const res = await api("GET", `/api/v1/runs/${id}?wait=30`, { key: keyB });
    expect(res.status).toBe(404);
    expect(activeWaiters()).toBe(0);
  });

  it("wakes on the announcement (not on the deadline), and holds at most MAX_WAITERS waits per process", async () => {
    const runId = crypto.randomUUID();
    const waiter = await registerRunWaiter(runId);
    const outcome = waiter.until(60_000);
    await announceRunFinished(a.orgId, runId, "succeeded");
    expect(await outcome).toBe("finished");
    waiter.release();

    const held: RunWaiter[] = [];
    for (let i = held.length; i < MAX_WAITERS; i++)
      held.push(await registerRunWaiter(crypto.randomUUID()));
    expect(activeWaiters()).toBe(MAX_WAITERS);
    const refused = await registerRunWaiter(crypto.randomUUID());
    expect(await refused.until(60_000)).toBe("busy");
    for (const w of held) w.release();
    expect(activeWaiters()).toBe(0);
  });
});

describe("RateLimit header fields (draft-ietf-httpapi-ratelimit-headers-06)", () => {
  it("every answer of the API budget carries Limit, Remaining, Reset and Policy; Remaining counts down", async () => {
    const { key: fresh } = await createTestApiKey(a.orgId, "viewer");
    const first = await api("GET", "/api/v1/runs?limit=1", { key: fresh });
    const second = await api("GET", `/api/v1/runs/${crypto.randomUUID()}`, { key: fresh }); // a 404 problem
    const limit = env.API_RATE_LIMIT_PER_MINUTE;
    expect(first.headers.get("ratelimit-limit")).toBe(String(limit));
    expect(first.headers.get("ratelimit-remaining")).toBe(String(limit - 1));
    expect(first.headers.get("ratelimit-policy")).toBe(`${limit};w=60`);
    const reset = Number(first.headers.get("ratelimit-reset"));
    expect(reset).toBeGreaterThan(0);
    expect(reset).toBeLessThanOrEqual(60);
    expect(second.status).toBe(404);
    expect(second.headers.get("ratelimit-remaining")).toBe(String(limit - 2));
  });

  it("a 429 carries RateLimit-Remaining 0, the reset and Retry-After", async () => {
    const { orgId } = await createUserWithOrg(`rl-${uniqueSuffix()}`);
    const { key: k } = await createTestApiKey(orgId, "viewer");
    const route = withOrg(async () => new Response(null, { status: 204 }), {
      rateLimit: { points: 2, duration: 60 },
    });
    const call = () =>
      route(
        new Request("http://localhost/api/v1/x", { headers: { authorization: `Bearer ${k}` } }),
      );
    expect((await call()).headers.get("ratelimit-remaining")).toBe("1");
    expect((await call()).headers.get("ratelimit-remaining")).toBe("0");
    const limited = await call();
    expect(limited.status).toBe(429);
    expect(limited.headers.get("ratelimit-limit")).toBe("2");
    expect(limited.headers.get("ratelimit-remaining")).toBe("0");
    expect(limited.headers.get("ratelimit-policy")).toBe("2;w=60");
    const retry = Number(limited.headers.get("retry-after"));
    expect(retry).toBeGreaterThan(0);
    expect(Number(limited.headers.get("ratelimit-reset"))).toBe(retry);
  });
});

describe("run exports", () => {
  it("terms.csv, counts.csv and circuits.zip are the run page's bytes, for scripts", async () => {
    const id = await submit({ name: "Bell CHSH export", ...bellRequest() });
    await run(id);
    const view = (await api("GET", `/api/v1/runs/${id}`, { key })).body;

    const terms = await api("GET", `/api/v1/runs/${id}/terms.csv`, { key });
    expect(terms.status).toBe(200);
    expect(terms.headers.get("content-type")).toBe("text/csv;charset=utf-8");
    expect(terms.headers.get("content-disposition")).toMatch(
      /^attachment; filename="bell-chsh-export-[0-9a-f]{8}-terms\.csv"$/,
    );
    expect(terms.headers.get("ratelimit-limit")).not.toBeNull();
    expect(terms.body).toBe(termsCsv(view.result));
    // ⟨Z0 Z1⟩ = ⟨X0 X1⟩ = 1 on (|00⟩+|11⟩)/√2 (textbook Bell-state correlations).
    const rows = terms.body
      .trim()
      .split("\r\n")
      .map((l: string) => l.split(","));
    expect(rows[0].slice(0, 7)).toEqual([
      "pauli",
      "coefficient",
      "exact",
      "sampled_mean",
      "std_err",
      "setting",
      "setting_bases",
    ]);
    for (const row of rows.slice(1)) expect(Number(row[2])).toBeCloseTo(1, 12);

    const counts = await api("GET", `/api/v1/runs/${id}/counts.csv`, { key });
    expect(counts.body).toBe(countsCsv(view.result));
    const total = counts.body
      .trim()
      .split("\r\n")
      .slice(1)
      .reduce((s: number, l: string) => s + Number(l.split(",")[3]), 0);
    expect(total).toBe(1000);

    const zip = await api("GET", `/api/v1/runs/${id}/circuits.zip`, { key });
    expect(zip.headers.get("content-type")).toBe("application/zip");
    const files = unzipSync(zip.bytes);
    const names = Object.keys(files).sort();
    expect(names[0]).toBe("README.txt");
    expect(names.slice(1)).toEqual(
      view.result.groups
        .map((g: { bases: string }, i: number) => `setting-${i}-${g.bases}.qasm`)
        .sort(),
    );
    for (const name of names.slice(1)) expect(strFromU8(files[name])).toMatch(/^OPENQASM 2\.0;/);
    const again = await api("GET", `/api/v1/runs/${id}/circuits.zip`, { key });
    expect(Buffer.from(again.bytes).equals(Buffer.from(zip.bytes))).toBe(true);

    expect((await api("GET", `/api/v1/runs/${id}/terms.csv`, { key: keyB })).status).toBe(404);
    const noPoints = await api("GET", `/api/v1/runs/${id}/points.csv`, { key });
    expect(noPoints.status).toBe(404);
    expect(noPoints.body.type).toBe("/problems/export-unavailable");
  });

  it("points.csv of a sweep is sweepCsv of its result; an unfinished run answers 409, a canceled one 404", async () => {
    const source =
      'OPENQASM 3.0;\ninclude "stdgates.inc";\ninput float[64] t;\nqubit[1] q;\nry(t) q[0];\n';
    const id = await submit({
      circuit: { format: "qasm3", source },
      observable: { format: "pauli", terms: "Z0" },
      sweep: { t: [0, Math.PI / 2, Math.PI] },
    });
    const early = await api("GET", `/api/v1/runs/${id}/points.csv`, { key });
    expect(early.status).toBe(409);
    expect(early.body.type).toBe("/problems/run-not-finished");
    await run(id);
    const view = (await api("GET", `/api/v1/runs/${id}`, { key })).body;
    const points = await api("GET", `/api/v1/runs/${id}/points.csv`, { key });
    expect(points.body).toBe(sweepCsv(view.result.sweep));
    // ⟨Z⟩ after RY(t)|0⟩ is cos t (textbook rotation): 1, 0, −1.
    const exact = points.body
      .trim()
      .split("\r\n")
      .slice(1)
      .map((l: string) => Number(l.split(",")[2]));
    expect(exact[0]).toBeCloseTo(1, 12);
    expect(exact[1]).toBeCloseTo(0, 12);
    expect(exact[2]).toBeCloseTo(-1, 12);
    const counts = await api("GET", `/api/v1/runs/${id}/counts.csv`, { key });
    expect(counts.status).toBe(404); // exact only: no shots, no counts

    const canceled = await submit(bellRequest({ shots: 0 }));
    await api("POST", `/api/v1/runs/${canceled}/cancel`, { key });
    expect((await api("GET", `/api/v1/runs/${canceled}/terms.csv`, { key })).status).toBe(404);
  });

  it("circuits.zip whose text would pass the export cap is a 422 problem naming the sizes", async () => {
    // 50,000 unrolled gate applications × 40 settings (distinct full-support words never share a setting)
    const source = `OPENQASM 3.0;
include "stdgates.inc";
qubit[4] q;
for int i in [0:9999] { rx(0.01) q[0]; cx q[0], q[1]; ry(0.02) q[2]; cx q[2], q[3]; rz(0.03) q[1]; }
`;
    const words: string[] = [];
    for (let k = 0; words.length < 40; k++) {
      words.push([0, 1, 2, 3].map((i) => "XYZ"[Math.floor(k / 3 ** i) % 3]).join(""));
    }
    const terms = words.map(
      (w, j) => `${(j + 1) / 10} ${[...w].map((c, i) => `${c}${i}`).join(" ")}`,
    );
    const id = await submit({
      circuit: { format: "qasm3", source },
      observable: { format: "pauli", terms: terms.join(" + ") },
      shots: 0,
    });
    await run(id);
    const zip = await api("GET", `/api/v1/runs/${id}/circuits.zip`, { key });
    expect(zip.status).toBe(422);
    expect(zip.body.type).toBe("/problems/export-too-large");
    expect(zip.body.detail).toMatch(/40 settings × 0\.\d MB each\), more than the 20\.0 MB/);
    expect((await api("GET", `/api/v1/runs/${id}/terms.csv`, { key })).status).toBe(200);
  });

  it("circuits.zip of an eigenbasis-measured matrix observable is a 404 problem saying why", async () => {
    const id = await submit({
      circuit: { format: "qasm2", source: BELL_QASM },
      observable: {
        format: "matrix",
        real: [
          [1, 0, 0, 0],
          [0, 2, 0, 0],
          [0, 0, 3, 0],
          [0, 0, 0, 4],
        ],
      },
      shots: 10,
      seed: 1,
    });
    await run(id);
    const zip = await api("GET", `/api/v1/runs/${id}/circuits.zip`, { key });
    expect(zip.status).toBe(404);
    expect(zip.body.detail).toMatch(/eigenbasis/);
  });
});

/**
 * API v1 behaviour without a worker: request validation (unknown fields,
 * types, QASM line/column, Hermiticity, JSON, media type, body size), the
 * preview, pagination, roles, tenancy (another organisation's ids answer 404)
 * and the saved library. Errors are RFC 9457 problem documents.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db";
import { closeQueue } from "@/lib/queue/enqueue";
import { closeRedis } from "@/lib/rate-limit/redis";
import { createTestApiKey, createUserWithOrg } from "../../support/factories";
import { api } from "../runs/support/api";
import { cancelLeftoverRuns } from "../runs/support/db-helpers";
import { bellRequest, BELL_QASM, smallRequest } from "../runs/support/requests";

let a: Awaited<ReturnType<typeof createUserWithOrg>>;
let b: Awaited<ReturnType<typeof createUserWithOrg>>;
let keyA: string;
let keyB: string;
let viewerA: string;

beforeAll(async () => {
  [a, b] = await Promise.all([createUserWithOrg("api-a"), createUserWithOrg("api-b")]);
  keyA = (await createTestApiKey(a.orgId, "member", a.user.id)).key;
  viewerA = (await createTestApiKey(a.orgId, "viewer", a.user.id)).key;
  keyB = (await createTestApiKey(b.orgId, "member", b.user.id)).key;
});

afterAll(async () => {
  if (a && b) await cancelLeftoverRuns([a.orgId, b.orgId]);
  await closeQueue();
  await closeRedis();
  await closeDb();
});

const post = (body: unknown, key = keyA) => api("POST", "/api/v1/runs", { key, body });

describe("request validation", () => {
  it("rejects unknown fields, at any depth, naming each", async () => {
    const res = await post({
      ...bellRequest(),
      colour: "blue",
      observable: { format: "pauli", terms: "Z0", weight: 2 },
    });
    expect(res.status).toBe(422);
    expect(res.headers.get("content-type")).toBe("application/problem+json");
    expect(res.body.type).toBe("/problems/validation-failed");
    const paths = res.body.errors.map((e: { path: string }) => e.path);
    expect(paths).toContain("colour");
    expect(paths).toContain("observable.weight");
  });

  it("names the field of a wrong type or range", async () => {
    const res = await post(bellRequest({ shots: -5, noise: { depolarizing1q: 1.5 } }));
    expect(res.status).toBe(422);
    const paths = res.body.errors.map((e: { path: string }) => e.path);
    expect(paths).toEqual(expect.arrayContaining(["shots", "noise.depolarizing1q"]));
  });

  it("answers the engine's QASM error as 400 with line and column", async () => {
    const source = 'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[2];\nh q[0];\ncx q[0], q[5];\n';
    const res = await post(bellRequest({ circuit: { format: "qasm2", source } }));
    expect(res.status).toBe(400);
    expect(res.body.type).toMatch(/^\/problems\/engine\/qasm-/);
    expect(res.body.errors[0]).toMatchObject({ path: "circuit.source", line: 5 });
    expect(res.body.errors[0].column).toBeGreaterThan(0);
    expect(res.body.detail).toMatch(/q\[5\]|index|range/i);
  });

  it("answers a non-Hermitian matrix as 400 naming the entries", async () => {
    const res = await post({
      circuit: { format: "qasm2", source: BELL_QASM },
      observable: {
        format: "matrix",
        real: [
          [1, 2, 0, 0],
          [0, 1, 0, 0],
          [0, 0, 1, 0],
          [0, 0, 0, 1],
        ],
      },
    });
    expect(res.status).toBe(400);
    expect(res.body.type).toBe("/problems/engine/not-hermitian");
    expect(res.body.errors[0].path).toMatch(/^observable\.real/);
  });

  it("accepts a JSON term-list observable and points its errors at observable.terms[i].pauli", async () => {
    const terms = [
      { coefficient: 0.5, pauli: "Z0 Z1" },
      { coefficient: -1, pauli: "XX" },
    ];
    const ok = await api("POST", "/api/v1/runs/preview", {
      key: keyB,
      body: bellRequest({ observable: { format: "terms", terms } }),
    });
    expect(ok.status, JSON.stringify(ok.body)).toBe(200);
    expect(ok.body.observable.settings).toBe(2);
    const res = await post(
      bellRequest({
        observable: { format: "terms", terms: [terms[0], { coefficient: 1, pauli: "X0 X0" }] },
      }),
    );
    expect(res.status).toBe(400);
    expect(res.body.type).toBe("/problems/engine/observable-invalid");
    expect(res.body.errors[0].path).toBe("observable.terms[1].pauli");
    expect(res.body.errors[0].message).toContain("qubit 0 appears twice in one Pauli word");
    const shape = await post(
      bellRequest({ observable: { format: "terms", terms: [{ coefficient: "x", pauli: "Z0" }] } }),
    );
    expect(shape.status).toBe(422);
    expect(shape.body.errors.map((e: { path: string }) => e.path)).toContain(
      "observable.terms[0].coefficient",
    );
  });

  it("refuses bad circuit statements and misplaced noise with their line/column or field", async () => {
    const src3 = (body: string) => `OPENQASM 3.0;\ninclude "stdgates.inc";\nqubit[2] q;\n${body}\n`;
    const pow = await post(
      bellRequest({ circuit: { format: "qasm3", source: src3("pow(0.5) @ x q[0];") } }),
    );
    expect(pow.status).toBe(400);
    expect(pow.body.errors[0]).toMatchObject({ path: "circuit.source", line: 4, column: 5 });
    expect(pow.body.errors[0].message).toContain("only integer powers of gates are supported");
    const loop = await post(
      bellRequest({
        circuit: { format: "qasm3", source: src3("for int i in [0:99999999] { x q[0]; }") },
      }),
    );
    expect(loop.status).toBe(400);
    expect(loop.body.type).toBe("/problems/engine/too-large");
    expect(loop.body.errors[0].message).toContain("at most 10000 are accepted");
    const gateNoise = await post(bellRequest({ noise: { gates: { cx: { depolarizing: 0.1 } } } }));
    expect(gateNoise.status).toBe(400);
    expect(gateNoise.body.errors[0].path).toBe("noise.gates.cx.depolarizing");
    const readout = await post(
      bellRequest({ noise: { readout: { qubits: { "7": { p1Given0: 0.1 } } } } }),
    );
    expect(readout.status).toBe(400);
    expect(readout.body.errors[0].path).toBe("noise.readout.qubits.7");
  });

  it("answers malformed JSON 400, a non-JSON body 415 and a body over 4 MiB 413", async () => {
    const bad = await api("POST", "/api/v1/runs", {
      key: keyA,
      rawBody: "{ not json",
      headers: { "content-type": "application/json" },
    });
    expect(bad.status).toBe(400);
    const text = await api("POST", "/api/v1/runs", {
      key: keyA,
      rawBody: "shots=5",
      headers: { "content-type": "text/plain" },
    });
    expect(text.status).toBe(415);
    const huge = JSON.stringify(bellRequest({ name: "x".repeat(4 * 1024 * 1024) }));
    const large = await api("POST", "/api/v1/runs", {
      key: keyA,
      rawBody: huge,
      headers: { "content-type": "application/json" },
    });
    expect(large.status).toBe(413);
    expect(large.body.type).toBe("/problems/body-too-large");
  });

  it("rejects an Idempotency-Key with spaces", async () => {
    const res = await api("POST", "/api/v1/runs", {
      key: keyA,
      body: bellRequest(),
      headers: { "idempotency-key": "two words" },
    });
    expect(res.status).toBe(400);
    expect(res.body.errors[0].path).toBe("Idempotency-Key");
  });
});

describe("preview", () => {
  it("answers qubits, gate counts, settings, the shot plan and the quota verdict without queuing", async () => {
    const res = await api("POST", "/api/v1/runs/preview", {
      key: viewerA,
      body: { ...smallRequest(), shots: undefined, targetPrecision: 0.01 },
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toMatchObject({
      qubits: 4,
      method: "statevector",
      totalGates: 5,
      twoQubitGates: 2,
    });
    expect(res.body.gateCounts).toMatchObject({ h: 1, cx: 2, ry: 1, rz: 1 });
    expect(res.body.observable.settings).toBe(res.body.groups.length);
    // Worst-case bound (Σ|cᵢ|)²/ε² over the non-identity terms (McClean et al. 2016): (0.5+0.25+0.1+0.3)²/0.01² = 13,225.
    expect(res.body.shotPlan.worstCase.totalShots).toBeGreaterThanOrEqual(13_225);
    expect(res.body.quota).toMatchObject({ allowed: true, plan: { id: "sandbox" }, refusals: [] });
    const list = await api("GET", "/api/v1/runs", { key: keyA });
    expect(list.body.data).toHaveLength(0);
  });
});

describe("pagination", () => {
  it("pages newest first with an opaque cursor and filters by status", async () => {
    const ids: string[] = [];
    for (let i = 0; i < 5; i++)
      ids.push((await post({ ...smallRequest(i), shots: 0 }, keyB)).body.id);
    const seen: string[] = [];
    let cursor: string | null = null;
    let pages = 0;
    do {
      const res: Awaited<ReturnType<typeof api>> = await api(
        "GET",
        `/api/v1/runs?limit=2${cursor ? `&cursor=${cursor}` : ""}`,
        { key: keyB },
      );
      expect(res.status).toBe(200);
      seen.push(...res.body.data.map((r: { id: string }) => r.id));
      cursor = res.body.nextCursor;
      pages++;
    } while (cursor);
    expect(pages).toBe(3);
    expect(seen).toEqual([...ids].reverse());
    const queued = await api("GET", "/api/v1/runs?status=queued&limit=100", { key: keyB });
    expect(queued.body.data).toHaveLength(5);
    expect(
      (await api("GET", "/api/v1/runs?status=succeeded", { key: keyB })).body.data,
    ).toHaveLength(0);
    expect((await api("GET", "/api/v1/runs?cursor=garbage", { key: keyB })).status).toBe(400);
    expect((await api("GET", "/api/v1/runs?limit=0", { key: keyB })).status).toBe(400);
    expect((await api("GET", "/api/v1/runs?status=done", { key: keyB })).status).toBe(400);
  });
});

describe("roles and tenancy", () => {
  it("lets a viewer key read but not submit", async () => {
    expect((await api("GET", "/api/v1/runs", { key: viewerA })).status).toBe(200);
    const res = await post(bellRequest(), viewerA);
    expect(res.status).toBe(403);
  });

  it("never shows one organisation's runs or library to another (404, not 403)", async () => {
    const run = await post(bellRequest());
    expect(run.status).toBe(202);
    const circuit = await api("POST", "/api/v1/circuits", {
      key: keyA,
      body: { name: "bell", format: "qasm2", source: BELL_QASM },
    });
    expect(circuit.status).toBe(201);

    for (const [method, path] of [
      ["GET", `/api/v1/runs/${run.body.id}`],
      ["POST", `/api/v1/runs/${run.body.id}/cancel`],
      ["GET", `/api/v1/circuits/${circuit.body.id}`],
      ["DELETE", `/api/v1/circuits/${circuit.body.id}`],
      ["GET", "/api/v1/runs/not-a-uuid"],
    ] as const) {
      const res = await api(method, path, { key: keyB });
      expect(res.status, `${method} ${path}`).toBe(404);
      expect(res.body.type).toBe("/problems/not-found");
    }
    const listB = await api("GET", "/api/v1/runs?limit=100", { key: keyB });
    expect(listB.body.data.map((r: { id: string }) => r.id)).not.toContain(run.body.id);
    expect((await api("GET", "/api/v1/circuits", { key: keyB })).body.data).toHaveLength(0);
    expect((await api("GET", `/api/v1/runs/${run.body.id}`, { key: keyA })).status).toBe(200);
  });

  it("answers 401 to a malformed or unknown key", async () => {
    expect((await api("GET", "/api/v1/runs", { key: "kw_nope" })).status).toBe(401);
    expect(
      (await api("GET", "/api/v1/runs", { key: `kw_abcdefgh_${"B".repeat(32)}` })).status,
    ).toBe(401);
  });
});

describe("library", () => {
  it("saves, lists by tag, reads and deletes circuits; refuses bad QASM and taken names", async () => {
    const body = {
      name: "ghz-3",
      description: "GHZ state",
      tags: ["GHZ", "demo"],
      format: "qasm2",
      source:
        'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[3];\nh q[0];\ncx q[0],q[1];\ncx q[1],q[2];\n',
    };
    const created = await api("POST", "/api/v1/circuits", { key: keyB, body });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({
      name: "ghz-3",
      qubits: 3,
      tags: ["ghz", "demo"],
      format: "qasm2",
    });
    expect((await api("POST", "/api/v1/circuits", { key: keyB, body })).status).toBe(409);
    const bad = await api("POST", "/api/v1/circuits", {
      key: keyB,
      body: { ...body, name: "bad", source: "OPENQASM 2.0;\nqreg q[1];\nh q[0]\n" },
    });
    expect(bad.status).toBe(400);
    expect(bad.body.errors[0].path).toBe("source");
    expect(bad.body.errors[0].line).toBeGreaterThan(0);

    expect(
      (await api("GET", "/api/v1/circuits?tag=ghz", { key: keyB })).body.data.map(
        (c: { id: string }) => c.id,
      ),
    ).toEqual([created.body.id]);
    expect((await api("GET", "/api/v1/circuits?tag=other", { key: keyB })).body.data).toHaveLength(
      0,
    );
    const one = await api("GET", `/api/v1/circuits/${created.body.id}`, { key: keyB });
    expect(one.body.source).toBe(body.source);
    expect((await api("DELETE", `/api/v1/circuits/${created.body.id}`, { key: keyB })).status).toBe(
      204,
    );
    expect((await api("GET", `/api/v1/circuits/${created.body.id}`, { key: keyB })).status).toBe(
      404,
    );
  });

  it("saves Pauli and matrix observables, refusing a non-Hermitian matrix", async () => {
    const pauli = await api("POST", "/api/v1/observables", {
      key: keyB,
      body: { name: "zz", format: "pauli", terms: "0.5 Z0 Z3 - X1" },
    });
    expect(pauli.status).toBe(201);
    expect(pauli.body).toMatchObject({ qubits: 4, terms: "0.5 Z0 Z3 - X1" });
    // σ_y = [[0, −i], [i, 0]] is Hermitian (textbook Pauli matrix).
    const sigmaY = await api("POST", "/api/v1/observables", {
      key: keyB,
      body: {
        name: "sigma-y",
        format: "matrix",
        real: [
          [0, 0],
          [0, 0],
        ],
        imag: [
          [0, -1],
          [1, 0],
        ],
      },
    });
    expect(sigmaY.status).toBe(201);
    expect(sigmaY.body).toMatchObject({
      qubits: 1,
      imag: [
        [0, -1],
        [1, 0],
      ],
    });
    const bad = await api("POST", "/api/v1/observables", {
      key: keyB,
      body: {
        name: "bad",
        format: "matrix",
        real: [
          [0, 0],
          [0, 0],
        ],
        imag: [
          [0, 1],
          [1, 0],
        ],
      },
    });
    expect(bad.status).toBe(400);
    expect(bad.body.type).toBe("/problems/engine/not-hermitian");
    const listed = await api("POST", "/api/v1/observables", {
      key: keyB,
      body: {
        name: "from-terms",
        format: "terms",
        terms: [
          { coefficient: 0.5, pauli: "Z0 Z3" },
          { coefficient: -1, pauli: "X1" },
        ],
      },
    });
    expect(listed.status).toBe(201);
    expect(listed.body).toMatchObject({ qubits: 4, format: "pauli", terms: "0.5 Z0 Z3 - 1 X1" });
    const list = await api("GET", "/api/v1/observables", { key: keyB });
    expect(list.body.data.map((o: { name: string }) => o.name)).toEqual([
      "from-terms",
      "sigma-y",
      "zz",
    ]);
  });
});

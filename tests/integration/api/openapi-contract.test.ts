/**
 * API contract: every route's responses — successes and problems — validate
 * against the OpenAPI 3.1 document served at /api/v1/openapi.json (JSON
 * Schema 2020-12, checked with Ajv), every status the routes answer is
 * documented, and every documented operation exists as a route handler.
 */
import { readdirSync, statSync } from "node:fs";
import { join, relative } from "node:path";
import { Ajv2020 } from "ajv/dist/2020.js";
import addFormats from "ajv-formats";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db";
import { closeQueue } from "@/lib/queue/enqueue";
import { closeRedis } from "@/lib/rate-limit/redis";
import { executeRun } from "@/lib/runs/execute-run";
import { createTestApiKey, createUserWithOrg } from "../../support/factories";
import { api, recorded } from "../runs/support/api";
import { cancelLeftoverRuns, insertRawRun, setPlan } from "../runs/support/db-helpers";
import { inProcessEngine } from "../runs/support/in-process-engine";
import { BELL_QASM, bellRequest } from "../runs/support/requests";

type Doc = {
  openapi: string;
  paths: Record<
    string,
    Record<string, { responses: Record<string, { content?: Record<string, { schema: object }> }> }>
  >;
  components: object;
};

let doc: Doc;
let org: Awaited<ReturnType<typeof createUserWithOrg>>;
let other: Awaited<ReturnType<typeof createUserWithOrg>>;
let key: string;
let viewer: string;

beforeAll(async () => {
  [org, other] = await Promise.all([
    createUserWithOrg("contract"),
    createUserWithOrg("contract-other"),
  ]);
  key = (await createTestApiKey(org.orgId, "member", org.user.id)).key;
  viewer = (await createTestApiKey(org.orgId, "viewer", org.user.id)).key;
});

afterAll(async () => {
  await cancelLeftoverRuns([org.orgId, other.orgId]);
  await closeQueue();
  await closeRedis();
  await closeDb();
});

/** Drives every route through its main successes and problems. */
async function exercise(): Promise<void> {
  const docRes = await api("GET", "/api/v1/openapi.json");
  doc = docRes.body;

  // Runs: create, replay, every problem kind, preview, list, get, cancel.
  const created = await api("POST", "/api/v1/runs", {
    key,
    body: { name: "contract", ...bellRequest() },
    headers: { "idempotency-key": "contract-1" },
  });
  await api("POST", "/api/v1/runs", {
    key,
    body: { name: "contract", ...bellRequest() },
    headers: { "idempotency-key": "contract-1" },
  });
  await api("POST", "/api/v1/runs", { key, body: { ...bellRequest(), extra: 1 } }); // 422
  await api("POST", "/api/v1/runs", {
    key,
    body: bellRequest({
      circuit: { format: "qasm2", source: "OPENQASM 2.0;\nqreg q[1];\nfoo q[0];\n" },
    }),
  }); // 400
  await api("POST", "/api/v1/runs", {
    key,
    rawBody: "x",
    headers: { "content-type": "text/plain" },
  }); // 415
  await api("POST", "/api/v1/runs", {
    key,
    rawBody: `{"a":"${"x".repeat(4 * 1024 * 1024)}"}`,
    headers: { "content-type": "application/json" },
  }); // 413
  await api("POST", "/api/v1/runs", { key: viewer, body: bellRequest() }); // 403
  await api("POST", "/api/v1/runs", { body: bellRequest() }); // 401
  const wide = `OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[21];\nh q;\n`;
  await api("POST", "/api/v1/runs", {
    key,
    body: bellRequest({ circuit: { format: "qasm2", source: wide }, shots: 0 }),
  }); // 402
  await api("POST", "/api/v1/runs/preview", {
    key,
    body: { ...bellRequest(), shots: undefined, targetPrecision: 0.05 },
  });
  await api("POST", "/api/v1/runs/preview", { key, body: { ...bellRequest(), shots: "many" } }); // 422
  await api("POST", "/api/v1/runs/preview", {
    key,
    body: bellRequest({ observable: { format: "pauli", terms: "Z0 Q1" } }),
  }); // 400 with the outline
  await api("POST", "/api/v1/runs/preview?only=circuit", {
    key,
    body: { circuit: { format: "qasm2", source: BELL_QASM } },
  }); // the outline alone
  await api("POST", "/api/v1/runs/preview?only=circuit", {
    key,
    body: { circuit: { format: "qasm2", source: "OPENQASM 2.0;\nqreg q[1];\nfoo q[0];\n" } },
  }); // 400

  // A succeeded, a failed (engine) and a canceled run, executed in-process.
  await executeRun({ orgId: org.orgId, runId: created.body.id }, inProcessEngine, () => {});
  const badId = await insertRawRun(
    org.orgId,
    bellRequest({ circuit: { format: "qasm2", source: "OPENQASM 2.0;\nqreg q[2];\nh q[7];\n" } }),
  );
  await executeRun({ orgId: org.orgId, runId: badId }, inProcessEngine, () => {});
  const toCancel = await api("POST", "/api/v1/runs", { key, body: bellRequest({ shots: 0 }) });
  await api("POST", `/api/v1/runs/${toCancel.body.id}/cancel`, { key }); // 200
  await api("POST", `/api/v1/runs/${created.body.id}/cancel`, { key }); // 409
  await api("POST", `/api/v1/runs/${crypto.randomUUID()}/cancel`, { key }); // 404
  await api("GET", `/api/v1/runs/${created.body.id}`, { key });
  await api("GET", `/api/v1/runs/${created.body.id}?wait=5`, { key });
  await api("GET", `/api/v1/runs/${created.body.id}?wait=60`, { key }); // 400
  await api("GET", `/api/v1/runs/${badId}`, { key });
  // Exports: the files of the succeeded run, 404 for a missing kind of data and a failed run, 409 while queued.
  for (const file of ["terms.csv", "counts.csv", "circuits.zip", "points.csv"])
    await api("GET", `/api/v1/runs/${created.body.id}/${file}`, { key });
  await api("GET", `/api/v1/runs/${badId}/terms.csv`, { key }); // 404
  const queued = await api("POST", "/api/v1/runs", { key, body: bellRequest({ shots: 0 }) });
  await api("GET", `/api/v1/runs/${queued.body.id}/terms.csv`, { key }); // 409
  await api("GET", `/api/v1/runs/${toCancel.body.id}`, { key });
  await api("GET", `/api/v1/runs/${created.body.id}`, {
    key: (await createTestApiKey(other.orgId, "member")).key,
  }); // 404
  await api("GET", "/api/v1/runs?limit=2", { key });
  await api("GET", "/api/v1/runs?status=succeeded", { key });
  await api("GET", "/api/v1/runs?limit=abc", { key }); // 400

  // Library.
  const circuit = await api("POST", "/api/v1/circuits", {
    key,
    body: { name: "bell", tags: ["demo"], format: "qasm2", source: BELL_QASM },
  });
  await api("POST", "/api/v1/circuits", {
    key,
    body: { name: "bell", format: "qasm2", source: BELL_QASM },
  }); // 409
  await api("POST", "/api/v1/circuits", {
    key,
    body: { name: "broken", format: "qasm2", source: "qreg" },
  }); // 400
  await api("GET", "/api/v1/circuits", { key });
  await api("GET", `/api/v1/circuits/${circuit.body.id}`, { key });
  const pauli = await api("POST", "/api/v1/observables", {
    key,
    body: { name: "zz", format: "pauli", terms: "Z0 Z1" },
  });
  const matrix = await api("POST", "/api/v1/observables", {
    key,
    body: {
      name: "x",
      format: "matrix",
      real: [
        [0, 1],
        [1, 0],
      ],
    },
  });
  await api("POST", "/api/v1/observables", {
    key,
    body: {
      name: "bad",
      format: "matrix",
      real: [
        [0, 1],
        [2, 0],
      ],
    },
  }); // 400
  await api("GET", "/api/v1/observables?tag=none", { key });
  await api("GET", "/api/v1/observables", { key });
  await api("GET", `/api/v1/observables/${pauli.body.id}`, { key });
  await api("GET", `/api/v1/observables/${matrix.body.id}`, { key });
  await api("DELETE", `/api/v1/circuits/${circuit.body.id}`, { key });
  await api("DELETE", `/api/v1/circuits/${circuit.body.id}`, { key }); // 404
  await api("DELETE", `/api/v1/observables/${pauli.body.id}`, { key });
  await api("GET", `/api/v1/observables/${pauli.body.id}`, { key }); // 404

  // Usage, on a free and a paid plan.
  await api("GET", "/api/v1/usage", { key });
  await setPlan(org.orgId, "lab");
  await api("GET", "/api/v1/usage", { key: viewer });
}

function routeTemplates(dir = "app/api/v1"): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return routeTemplates(path);
    return name === "route.ts" ? [`/${relative("app", dir)}`.replace(/\[(\w+)\]/g, "{$1}")] : [];
  });
}

describe("OpenAPI contract", () => {
  it("every response of every route validates against the generated document", async () => {
    await exercise();
    expect(doc.openapi).toBe("3.1.0");
    const ajv = new Ajv2020({ strict: false, allErrors: true });
    addFormats.default(ajv);
    const failures: string[] = [];
    const seen = new Set<string>();
    for (const res of recorded) {
      const op = doc.paths[res.template]?.[res.method.toLowerCase()];
      seen.add(`${res.method.toLowerCase()} ${res.template}`);
      const documented = op?.responses[String(res.status)];
      if (!documented) {
        failures.push(
          `${res.method} ${res.template} answered ${res.status}, which is not documented`,
        );
        continue;
      }
      if (!documented.content) {
        if (res.body !== "")
          failures.push(`${res.method} ${res.template} ${res.status} has an undocumented body`);
        continue;
      }
      const type = (res.headers.get("content-type") ?? "").split(";")[0];
      const media = documented.content[type];
      if (!media) {
        failures.push(
          `${res.method} ${res.template} ${res.status} answered ${type}, documented ${Object.keys(documented.content)}`,
        );
        continue;
      }
      const validate = ajv.compile({ ...media.schema, components: doc.components });
      if (!validate(res.body)) {
        failures.push(
          `${res.method} ${res.template} ${res.status}: ${ajv.errorsText(validate.errors, { separator: "; " })}`,
        );
      }
    }
    expect(failures).toEqual([]);
    const statuses = new Set(recorded.map((r) => r.status));
    for (const status of [200, 201, 202, 204, 400, 401, 402, 403, 404, 409, 413, 415, 422])
      expect(statuses).toContain(status);

    // Documented operations and route handlers are the same set, and each was exercised.
    const documented = Object.entries(doc.paths).flatMap(([path, ops]) =>
      Object.keys(ops).map((m) => `${m} ${path}`),
    );
    expect(new Set(Object.keys(doc.paths))).toEqual(new Set(routeTemplates()));
    expect(documented.filter((op) => !seen.has(op))).toEqual([]);
  });
});

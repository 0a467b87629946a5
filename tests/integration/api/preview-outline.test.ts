/**
 * The preview endpoint answers the circuit's outline (what the new-run page draws),
 * computed on the preview threads from the same parse as the preview: with a full
 * preview, inside the problem when only the rest of the request is wrong, and alone
 * with `?only=circuit`. Expected operations follow the OpenQASM 2.0 programs below
 * (one top-level operation per statement; a register broadcast expands per qubit).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db";
import { closeQueue } from "@/lib/queue/enqueue";
import { closeRedis } from "@/lib/rate-limit/redis";
import { closePreviewPool } from "@/lib/runs/preview-pool";
import { createTestApiKey, createUserWithOrg } from "../../support/factories";
import { api } from "../runs/support/api";
import { BELL_QASM, bellRequest } from "../runs/support/requests";

let viewer: string;

beforeAll(async () => {
  const org = await createUserWithOrg("preview-outline");
  viewer = (await createTestApiKey(org.orgId, "viewer", org.user.id)).key;
});

afterAll(async () => {
  await closePreviewPool();
  await closeQueue();
  await closeRedis();
  await closeDb();
});

const BELL_OUTLINE = {
  qubits: 2,
  qubitLabels: ["q[0]", "q[1]"],
  inputs: [],
  ops: [
    { kind: "gate", name: "h", qubits: [0], params: [] },
    { kind: "gate", name: "cx", qubits: [0, 1], params: [] },
  ],
  omitted: 0,
  placeholders: [],
};

const QASM3 = [
  "OPENQASM 3.0;",
  'include "stdgates.inc";',
  "input angle theta;",
  "input float phi;",
  "qubit[2] q;",
  "bit[2] c;",
  "rx(theta) q[0];",
  "rz(phi) q[1];",
  "c[0] = measure q[0];",
].join("\n");

describe("POST /api/v1/runs/preview: the outline", () => {
  it("comes with a full preview", async () => {
    const res = await api("POST", "/api/v1/runs/preview", { key: viewer, body: bellRequest() });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.totalGates).toBe(2);
    expect(res.body.outline).toEqual(BELL_OUTLINE);
  });

  it("comes inside the problem when the observable is empty or wrong", async () => {
    const empty = await api("POST", "/api/v1/runs/preview", {
      key: viewer,
      body: bellRequest({ observable: { format: "pauli", terms: "" } }),
    });
    expect(empty.status).toBe(422);
    expect(empty.headers.get("content-type")).toBe("application/problem+json");
    expect(empty.body.errors.map((e: { path: string }) => e.path)).toContain("observable.terms");
    expect(empty.body.outline).toEqual(BELL_OUTLINE);

    const wrong = await api("POST", "/api/v1/runs/preview", {
      key: viewer,
      body: bellRequest({ observable: { format: "pauli", terms: "Z0 Z7" } }),
    });
    expect(wrong.status).toBe(400);
    expect(wrong.body.outline).toEqual(BELL_OUTLINE);
  });

  it("is absent when the circuit itself is wrong", async () => {
    const res = await api("POST", "/api/v1/runs/preview", {
      key: viewer,
      body: bellRequest({
        circuit: {
          format: "qasm2",
          source: 'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[1];\nh q[3];\n',
        },
      }),
    });
    expect(res.status).toBe(400);
    expect(res.body.errors[0]).toMatchObject({ path: "circuit.source", line: 4 });
    expect(res.body).not.toHaveProperty("outline");
  });

  it("binds the given inputs and draws the others at 0, listed as placeholders", async () => {
    const res = await api("POST", "/api/v1/runs/preview?only=circuit", {
      key: viewer,
      body: { circuit: { format: "qasm3", source: QASM3 }, parameters: { theta: 0.5 } },
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(Object.keys(res.body)).toEqual(["outline"]);
    expect(res.body.outline).toMatchObject({
      qubits: 2,
      inputs: [
        { name: "theta", type: "angle" },
        { name: "phi", type: "float" },
      ],
      ops: [
        { kind: "gate", name: "rx", qubits: [0], params: [0.5] },
        { kind: "gate", name: "rz", qubits: [1], params: [0] },
        { kind: "measure", qubit: 0, clbit: 0 },
      ],
      omitted: 0,
      placeholders: ["phi"],
    });
  });

  it("lists at most 400 operations and counts the rest", async () => {
    const source = `OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[1];\n${"x q[0];\n".repeat(450)}`;
    const res = await api("POST", "/api/v1/runs/preview?only=circuit", {
      key: viewer,
      body: { circuit: { format: "qasm2", source } },
    });
    expect(res.status).toBe(200);
    expect(res.body.outline.ops).toHaveLength(400);
    expect(res.body.outline.omitted).toBe(50);
  });

  it("circuit-only: the circuit's errors with line and column; other fields refused", async () => {
    const bad = await api("POST", "/api/v1/runs/preview?only=circuit", {
      key: viewer,
      body: { circuit: { format: "qasm2", source: "OPENQASM 2.0;\nqreg q[1];\nfoo q[0];\n" } },
    });
    expect(bad.status).toBe(400);
    expect(bad.body.errors[0]).toMatchObject({ path: "circuit.source", line: 3 });
    const extra = await api("POST", "/api/v1/runs/preview?only=circuit", {
      key: viewer,
      body: { circuit: { format: "qasm2", source: BELL_QASM }, observable: { format: "pauli" } },
    });
    expect(extra.status).toBe(422);
    expect(extra.body.errors).toEqual([{ path: "observable", message: "unknown field" }]);
    const mode = await api("POST", "/api/v1/runs/preview?only=everything", {
      key: viewer,
      body: bellRequest(),
    });
    expect(mode.status).toBe(400);
    expect(mode.body.errors[0].path).toBe("only");
  });
});

/**
 * The shipped Python client (public/clients/ketwise.py) against the live production
 * build and a real worker: the module is downloaded from the server as a user would,
 * then Debian's `python3` runs tests/e2e/python/client_check.py with it. The script
 * submits single runs, a list of points with gradients, a value-and-gradient call and a
 * sweep through the client (submit → wait via ?wait → result, exports, idempotency keys,
 * typed errors, RateLimit fields) and compares every value and gradient
 * with the engine's own result for the same request, computed here with
 * lib/quantum `estimate` (same engine, same seed: exact values to 1e-9, sampled
 * figures to 1e-12).
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { migrate } from "drizzle-orm/mysql2/migrator";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db";
import { estimate } from "@/lib/quantum";
import { closeRedis } from "@/lib/rate-limit/redis";
import { startWorker, type WorkerProcess } from "../integration/runs/support/worker-process";
import { E2E_URL } from "../support/e2e-config";
import { createTestApiKey, createUserWithOrg } from "../support/factories";

let worker: WorkerProcess;
let key: string;
let dir: string;

beforeAll(async () => {
  await migrate(db, { migrationsFolder: "drizzle" });
  const owner = await createUserWithOrg("e2e-python");
  key = (await createTestApiKey(owner.orgId, "member", owner.user.id)).key;
  worker = await startWorker({ concurrency: 2 });
  dir = mkdtempSync(join(tmpdir(), "ketwise-py-"));
});

afterAll(async () => {
  await worker?.stop();
  if (dir) rmSync(dir, { recursive: true, force: true });
  await closeRedis();
  await closeDb();
});

const BELL = 'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[2];\nh q[0];\ncx q[0],q[1];\n';
/** Two inputs, one of them in two gates and inside an affine expression. */
const ANSATZ = [
  "OPENQASM 3.0;",
  'include "stdgates.inc";',
  "input float[64] a;",
  "input float[64] b;",
  "qubit[2] q;",
  "ry(a) q[0];",
  "cx q[0], q[1];",
  "rx(0.4*b+0.1) q[1];",
  "rz(a) q[1];",
].join("\n");

type Case = {
  label: string;
  kind: "single" | "sweep" | "points" | "gradient";
  request: Record<string, unknown>;
  fd?: { at: number; plus: number; minus: number; input: string; h: number };
};

const CASES: Case[] = [
  {
    label: "Bell pair, CHSH operator, sampled",
    kind: "single",
    request: {
      circuit: { format: "qasm2", source: BELL },
      observable: { format: "pauli", terms: "1.4142135623730951 Z0 Z1 + 1.4142135623730951 X0 X1" },
      shots: 2000,
      seed: 17,
    },
  },
  {
    label: "two-input ansatz, noisy density matrix",
    kind: "single",
    request: {
      circuit: { format: "qasm3", source: ANSATZ },
      observable: { format: "pauli", terms: "Z0 Z1 + 0.5 X1 - 0.25 Y0" },
      parameters: { a: 0.3, b: -1.1 },
      method: "density_matrix",
      noise: { depolarizing1q: 0.01, depolarizing2q: 0.02 },
      shots: 1000,
      seed: 5,
    },
  },
  {
    label: "three points with gradients, sampled",
    kind: "points",
    request: {
      circuit: { format: "qasm3", source: ANSATZ },
      observable: { format: "pauli", terms: "Z0 Z1 + 0.5 X1 - 0.25 Y0" },
      // Points 3 and 4 are point 0 shifted by ±h in a: the script checks the exact gradient
      // against their central difference (O(h²) error, common practice).
      points: [
        { a: 0.1, b: 0.2 },
        { a: 0.7, b: -1.3 },
        { a: 2.0, b: 0.5 },
        { a: 0.1 + 1e-5, b: 0.2 },
        { a: 0.1 - 1e-5, b: 0.2 },
      ],
      gradient: true,
      shots: 400,
      seed: 9,
    },
    fd: { at: 0, plus: 3, minus: 4, input: "a", h: 1e-5 },
  },
  {
    label: "value and gradient at one point",
    kind: "gradient",
    request: {
      circuit: { format: "qasm3", source: ANSATZ },
      observable: { format: "pauli", terms: "Z0 Z1 + 0.5 X1" },
      parameters: { a: 0.3, b: -1.1 },
      gradient: true,
    },
  },
  {
    label: "sweep over a",
    kind: "sweep",
    request: {
      circuit: { format: "qasm3", source: ANSATZ },
      observable: { format: "pauli", terms: "Z0 Z1 + 0.5 X1" },
      parameters: { b: 0.2 },
      sweep: { a: [0, 0.5, 1, 1.5, 2, 2.5, 3] },
    },
  },
];

describe("Python client (Debian python3, standard library only)", () => {
  it("is served by the app, and a script using it gets the engine's numbers", async () => {
    const served = await fetch(`${E2E_URL}/clients/ketwise.py`);
    expect(served.status).toBe(200);
    const source = await served.text();
    expect(source).toBe(readFileSync("public/clients/ketwise.py", "utf8"));
    writeFileSync(join(dir, "ketwise.py"), source);

    const cases = [];
    for (const c of CASES)
      cases.push({ ...c, expected: await estimate(c.request as Parameters<typeof estimate>[0]) });
    const casesPath = join(dir, "cases.json");
    writeFileSync(casesPath, JSON.stringify({ cases }));

    const run = spawnSync("python3", ["tests/e2e/python/client_check.py", casesPath], {
      env: {
        ...process.env,
        PYTHONPATH: dir,
        KETWISE_URL: E2E_URL,
        KETWISE_API_KEY: key,
        PYTHONDONTWRITEBYTECODE: "1",
      },
      encoding: "utf8",
      timeout: 150_000,
    });
    const output = `${run.stdout}\n${run.stderr}`;
    expect(run.status, output).toBe(0);
    expect(output).toMatch(/^\d+ passed, 0 failed$/m);
    expect(output).not.toMatch(/^FAIL /m);
    // Every case was checked (one "ok" line per value), not skipped.
    for (const c of CASES) expect(output).toContain(`ok ${c.label}:`);
  });
});

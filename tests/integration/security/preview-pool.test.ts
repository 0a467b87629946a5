/**
 * Nothing heavy on the request's event loop: the reported hole was a viewer's
 * preview (a huge circuit and Pauli sum) parsed on the web server's event
 * loop, freezing every other request for 9 s. Previews and submissions now
 * run the engine on a worker-thread pool, within caps (422 naming the cap)
 * and a time budget (the thread is stopped, 422). No timing is asserted:
 * "off the event loop" is checked by ordering (a setImmediate callback runs
 * while the preview is still being computed).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db";
import { isProblemError } from "@/lib/api/problem";
import { closeRedis } from "@/lib/rate-limit/redis";
import { PREVIEW_CAPS } from "@/lib/runs/preview-caps";
import { closePreviewPool, PreviewPool } from "@/lib/runs/preview-pool";
import { previewOrThrow } from "@/lib/runs/preview-run";
import type { EstimateRequest } from "@/lib/quantum/schemas";
import { api } from "../runs/support/api";
import { createTestApiKey, createUserWithOrg } from "../../support/factories";

/** A 4-qubit circuit of `gates` gates (h/cx/rz in turn) — seconds of parsing for large counts. */
function circuitOf(gates: number): string {
  const lines = ["OPENQASM 2.0;", 'include "qelib1.inc";', "qreg q[4];"];
  for (let i = 0; i < gates; i++) {
    lines.push(
      i % 3 === 0
        ? `cx q[${i % 4}],q[${(i + 1) % 4}];`
        : i % 3 === 1
          ? `rz(0.25) q[${i % 4}];`
          : `h q[${i % 4}];`,
    );
  }
  return lines.join("\n");
}

const request = (source: string, terms = "Z0 Z1"): EstimateRequest =>
  ({
    circuit: { format: "qasm2", source },
    observable: { format: "pauli", terms },
  }) as EstimateRequest;

let key: string;

beforeAll(async () => {
  const owner = await createUserWithOrg("pool");
  key = (await createTestApiKey(owner.orgId, "viewer")).key;
});

afterAll(async () => {
  await closePreviewPool();
  await closeRedis();
  await closeDb();
});

describe("preview pool", () => {
  it("computes the preview off the event loop: the loop keeps turning while it runs", async () => {
    const order: string[] = [];
    const preview = previewOrThrow(request(circuitOf(3000))).then((p) => {
      order.push("preview");
      return p;
    });
    await new Promise((r) => setImmediate(r));
    order.push("event loop");
    expect((await preview).totalGates).toBe(3000);
    expect(order).toEqual(["event loop", "preview"]);
  });

  it("answers engine errors as before (400 with line and column)", async () => {
    const res = await api("POST", "/api/v1/runs/preview", {
      key,
      body: {
        circuit: { format: "qasm2", source: "OPENQASM 2.0;\nqreg q[2];\nfoo q[0];\n" },
        observable: { format: "pauli", terms: "Z0" },
      },
    });
    expect(res.status).toBe(400);
    expect(res.body.errors?.[0]).toMatchObject({ line: expect.any(Number) });
  });

  it("refuses a source over the cap with 422 naming it, before any parsing", async () => {
    const res = await api("POST", "/api/v1/runs/preview", {
      key,
      body: request("x".repeat(PREVIEW_CAPS.circuitSourceChars + 1)),
    });
    expect(res.status).toBe(422);
    expect(res.body.detail).toMatch(/characters of circuit source; the limit is 200,000/);
    expect(res.body.errors).toEqual([expect.objectContaining({ path: "circuit.source" })]);
  });

  it("refuses more Pauli terms than the cap with 422 naming it", async () => {
    // Distinct dense words on 8 qubits: word i spells i in base 4 over I, X, Y, Z.
    const words = Array.from({ length: PREVIEW_CAPS.terms + 1 }, (_, i) =>
      Array.from({ length: 8 }, (_, q) => "IXYZ"[Math.floor(i / 4 ** q) % 4]).join(""),
    );
    const eight = 'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[8];\nh q[0];\n';
    const error = await previewOrThrow(
      request(eight, words.map((w) => `0.5 ${w}`).join(" + ")),
    ).catch((e: unknown) => e);
    expect(isProblemError(error) && error.problem.status).toBe(422);
    expect(isProblemError(error) && error.problem.detail).toMatch(
      /Pauli terms; the limit is 5,000|measurement settings; the limit is 2,000/,
    );
  });

  it("stops a check past its time budget with 422, and the pool keeps answering", async () => {
    const pool = new PreviewPool({ size: 1, budgetMs: 100, maxQueue: 4 });
    try {
      const error = await pool.run(request(circuitOf(5000))).catch((e: unknown) => e);
      expect(isProblemError(error) && error.problem).toMatchObject({
        status: 422,
        type: "/problems/preview-budget-exceeded",
      });
      expect(isProblemError(error) && error.problem.detail).toMatch(/0.1-second budget/);
      const generous = new PreviewPool({ size: 1, budgetMs: 60_000, maxQueue: 4 });
      try {
        expect((await generous.run(request(circuitOf(3)))).totalGates).toBe(3);
      } finally {
        await generous.close();
      }
    } finally {
      await pool.close();
    }
  });

  it("answers 503 with Retry-After when every thread is busy and the queue is full", async () => {
    const pool = new PreviewPool({ size: 1, budgetMs: 60_000, maxQueue: 0 });
    try {
      const first = pool.run(request(circuitOf(2000)));
      const second = await pool.run(request(circuitOf(3))).catch((e: unknown) => e);
      expect(isProblemError(second) && second.problem).toMatchObject({
        status: 503,
        type: "/problems/preview-busy",
        retryAfter: 2,
      });
      expect((await first).totalGates).toBe(2000);
    } finally {
      await pool.close();
    }
  });
});

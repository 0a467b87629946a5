/**
 * Fuzzing the API (fast-check, fixed seeds): generated JSON bodies and raw
 * texts POSTed to /api/v1/runs/preview and /api/v1/runs answer a result or a
 * 4xx problem+json, never a 5xx. The preview's time budget turns anything
 * too costly into a 422, so no answer takes longer than the budget.
 */
import fc from "fast-check";
import { afterAll, beforeAll, describe, it } from "vitest";
import { POST as submit } from "@/app/api/v1/runs/route";
import { POST as preview } from "@/app/api/v1/runs/preview/route";
import { closeDb } from "@/db";
import { closeQueue } from "@/lib/queue/enqueue";
import { closeRedis } from "@/lib/rate-limit/redis";
import { closePreviewPool } from "@/lib/runs/preview-pool";
import { jsonBody } from "../../fuzz/arbitraries";
import { apiOutcome } from "../../fuzz/check";
import { createTestApiKey, createUserWithOrg } from "../../support/factories";

/** `npm run fuzz` sets FUZZ_API_RUNS (10⁴); `npm test` runs a few hundred. */
const API_RUNS = process.env.FUZZ_API_RUNS ? Number(process.env.FUZZ_API_RUNS) : 300;

let key: string;

beforeAll(async () => {
  const owner = await createUserWithOrg("fuzz");
  key = (await createTestApiKey(owner.orgId, "member")).key;
});

afterAll(async () => {
  await closePreviewPool();
  await closeQueue();
  await closeRedis();
  await closeDb();
});

describe("fuzzing the API", { timeout: 300_000 }, () => {
  it("POST /api/v1/runs/preview: JSON bodies", async () => {
    await fc.assert(
      fc.asyncProperty(
        jsonBody,
        async (body) => (await apiOutcome(preview, "/api/v1/runs/preview", key, body)).ok,
      ),
      { seed: 404, numRuns: API_RUNS },
    );
  });

  it("POST /api/v1/runs/preview: raw texts", async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.oneof(fc.string({ maxLength: 80 }), fc.json()),
        async (text) => (await apiOutcome(preview, "/api/v1/runs/preview", key, text, true)).ok,
      ),
      { seed: 505, numRuns: Math.ceil(API_RUNS / 2) },
    );
  });

  it("POST /api/v1/runs: JSON bodies", async () => {
    await fc.assert(
      fc.asyncProperty(
        jsonBody,
        async (body) => (await apiOutcome(submit, "/api/v1/runs", key, body)).ok,
      ),
      { seed: 606, numRuns: Math.ceil(API_RUNS / 3) },
    );
  });
});

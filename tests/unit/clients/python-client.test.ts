/**
 * The shipped Python client (public/clients/ketwise.py) run by Debian's python3 against a
 * scripted standard-library HTTP server (tests/unit/clients/client_behaviour.py): retries
 * of 429 after Retry-After with the same Idempotency-Key, RateLimit fields, ?wait,
 * the gradient helper's request, typed errors with the problem fields, RunFailed.
 */
import { spawnSync } from "node:child_process";
import { describe, expect, it } from "vitest";

describe("Python client behaviour", () => {
  it("passes every scripted check", () => {
    const run = spawnSync("python3", ["tests/unit/clients/client_behaviour.py", "public/clients"], {
      encoding: "utf8",
      env: { ...process.env, PYTHONDONTWRITEBYTECODE: "1" },
      timeout: 60_000,
    });
    const output = `${run.stdout}\n${run.stderr}`;
    expect(run.status, output).toBe(0);
    const [, passed] = /^(\d+) passed, 0 failed$/m.exec(output) ?? [];
    expect(Number(passed), output).toBe(14);
  });
});

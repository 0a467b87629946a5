/**
 * Dead shared states are freed while a process keeps allocating them (parallel/
 * memory-pressure.ts): 40 states of 64 MiB, one after the other, in a child process. Without
 * the collector nudge the process held all of them (2.6 GiB measured for the density
 * matrices); with it the peak stays near a few states.
 */
import { spawnSync } from "node:child_process";
import { describe, expect, it } from "vitest";

function peakMiB(env: Record<string, string>): number {
  const r = spawnSync(
    process.execPath,
    ["--import", "tsx", "tests/unit/quantum/statevector/support/shared-churn.ts"],
    { env: { ...process.env, ...env }, encoding: "utf8", timeout: 60_000 },
  );
  if (r.status !== 0) throw new Error(`child failed: ${r.stderr}`);
  return (JSON.parse(r.stdout.trim().split("\n").pop() ?? "{}") as { peakMiB: number }).peakMiB;
}

describe("shared memory and the collector", { timeout: 120_000 }, () => {
  it("40 density matrices of 64 MiB in turn stay under 1 GiB resident", () => {
    expect(peakMiB({ KIND: "density", COUNT: "40" })).toBeLessThan(1024);
  });

  it("40 shared 22-qubit states (plain SharedArrayBuffers) in turn stay under 1 GiB", () => {
    expect(peakMiB({ KIND: "shared", COUNT: "40", KETWISE_ENGINE_WASM: "0" })).toBeLessThan(1024);
  });
});

/**
 * Fuzzing as a test (fast-check, fixed seeds): generated OpenQASM programs,
 * Pauli texts and JSON bodies thrown at the engine's preview — validation and
 * both parsers — answer a result or the engine's typed error, never another
 * exception (common practice for parsers facing untrusted input). A few
 * thousand cases in `npm test`; `npm run fuzz` runs FUZZ_RUNS (10⁵) cases,
 * reports the slowest and fails when one took longer than the preview budget
 * (a timing check kept out of `npm test` on purpose).
 */
import fc from "fast-check";
import { afterAll, describe, expect, it } from "vitest";
import { env } from "@/lib/env";
import { jsonBody, pauliText, qasmProgram } from "../../fuzz/arbitraries";
import { previewOutcome } from "../../fuzz/check";

const BELL = {
  format: "qasm2",
  source: 'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[2];\nh q[0];\ncx q[0],q[1];\n',
};
const FULL = process.env.FUZZ_RUNS !== undefined;
const RUNS = FULL ? Math.ceil(Number(process.env.FUZZ_RUNS) / 3) : 800;
const slowest = { ms: 0, input: "" };

/** The outcome of one case, timing it for the full run's report. */
async function timed(body: unknown): Promise<boolean> {
  const started = performance.now();
  const { ok } = await previewOutcome(body);
  const ms = performance.now() - started;
  if (ms > slowest.ms) Object.assign(slowest, { ms, input: JSON.stringify(body).slice(0, 300) });
  return ok;
}

afterAll(() => {
  if (!FULL) return;
  console.log(
    `[fuzz] ${3 * RUNS} previews; slowest ${slowest.ms.toFixed(0)} ms (budget ${env.PREVIEW_BUDGET_MS} ms): ${slowest.input}`,
  );
  expect(slowest.ms, "a generated case took longer than the preview budget").toBeLessThan(
    env.PREVIEW_BUDGET_MS,
  );
});

describe("fuzzing the preview", { timeout: 120_000 }, () => {
  it("OpenQASM programs", async () => {
    await fc.assert(
      fc.asyncProperty(
        qasmProgram,
        async (circuit) =>
          (await previewOutcome({ circuit, observable: { format: "pauli", terms: "Z0" } })).ok,
      ),
      { seed: 101, numRuns: RUNS },
    );
  });

  it("Pauli-sum texts", async () => {
    await fc.assert(
      fc.asyncProperty(
        pauliText,
        async (terms) =>
          (await previewOutcome({ circuit: BELL, observable: { format: "pauli", terms } })).ok,
      ),
      { seed: 202, numRuns: RUNS },
    );
  });

  it("JSON bodies", async () => {
    await fc.assert(fc.asyncProperty(jsonBody, timed), { seed: 303, numRuns: RUNS });
  });
});

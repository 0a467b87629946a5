/**
 * Executing one run in the worker (job `run.execute`):
 *
 * 1. claim it (skip a missing or finished run; wait when the organisation's
 *    plan already runs `concurrentRuns` at once);
 * 2. validate the stored request (a malformed row fails the run, no retry);
 * 3. run the engine off the event loop with a throttled progress writer that
 *    also notices cancellation, and the plan's `maxRunSeconds` as a hard stop;
 * 4. write result or problem, status, timings and usage rows in one
 *    transaction guarded by the attempt number (exactly once).
 *
 * Usage: a succeeded run meters `runs` 1, the shots drawn and the engine's
 * wall-clock seconds; a run that failed in the engine, hit its time limit or
 * was canceled while running meters only the seconds it used. Infrastructure
 * faults throw, so the queue retries them with backoff.
 */
import "server-only";
import { estimateRequestSchema, type EstimateResult } from "@/lib/quantum/schemas";
import type { RunJob } from "@/lib/queue/jobs";
import { compactResult, shotsDrawn } from "./compact-result";
import type { EngineRunner } from "./engine-runner";
import {
  claimRun,
  failUnfinishedRun,
  finishRun,
  recordCanceledRunUsage,
} from "./execution-mutations";
import { notifyIfLong } from "./notify";
import { engineProblem, malformedRunProblem, timeLimitProblem } from "./problems";
import { startProgressTicker } from "./progress-ticker";

export type ExecuteOutcome =
  | { kind: "missing" }
  | { kind: "terminal" }
  | { kind: "busy"; running: number; limit: number }
  | { kind: "succeeded" | "failed" | "canceled" | "superseded"; elapsedMs: number };

export type Logger = (message: string, error?: unknown) => void;

export type ExecuteOptions = {
  /** Overrides the plan's maxRunSeconds (tests of the time limit). */
  timeLimitMs?: number;
};

export async function executeRun(
  job: RunJob,
  engine: EngineRunner,
  log: Logger,
  options: ExecuteOptions = {},
): Promise<ExecuteOutcome> {
  const { orgId, runId } = job;
  const claim = await claimRun(orgId, runId);
  if (claim.kind === "missing" || claim.kind === "terminal") return { kind: claim.kind };
  if (claim.kind === "busy") return claim;
  const { run, attempt, plan } = claim;
  log(`run ${runId}: attempt ${attempt} started${claim.redelivered ? " (re-delivered)" : ""}`);

  const parsed = estimateRequestSchema.safeParse({ ...run.request, seed: run.seed });
  if (!parsed.success) {
    const first = parsed.error.issues[0];
    await failUnfinishedRun(
      orgId,
      runId,
      malformedRunProblem(`${first.path.join(".") || "request"}: ${first.message}`),
    );
    return { kind: "failed", elapsedMs: 0 };
  }

  const controller = new AbortController();
  let stopReason: "canceled" | "time-limit" | null = null;
  const stop = (reason: "canceled" | "time-limit") => {
    stopReason ??= reason;
    controller.abort();
  };
  const ticker = startProgressTicker({ orgId, runId, attempt }, () => stop("canceled"), log);
  const timer = setTimeout(
    () => stop("time-limit"),
    options.timeLimitMs ?? plan.limits.maxRunSeconds * 1000,
  );
  let outcome;
  try {
    outcome = await engine.run(parsed.data, {
      onProgress: ticker.report,
      signal: controller.signal,
    });
  } finally {
    clearTimeout(timer);
    await ticker.stop();
  }
  const elapsedMs = outcome.elapsedMs;
  const seconds = elapsedMs / 1000;

  if (outcome.kind === "aborted") {
    if (stopReason === "time-limit") {
      const done = await finishRun(orgId, runId, attempt, {
        status: "failed",
        error: timeLimitProblem(plan.name, plan.limits.maxRunSeconds),
        usage: { simulationSeconds: seconds },
      });
      return { kind: done ? "failed" : "superseded", elapsedMs };
    }
    // Stopped because the run is no longer this attempt's: canceled by a person, or taken over by another worker.
    const canceled = await recordCanceledRunUsage(orgId, runId, seconds);
    return { kind: canceled ? "canceled" : "superseded", elapsedMs };
  }

  if (outcome.kind === "engine-error") {
    const done = await finishRun(orgId, runId, attempt, {
      status: "failed",
      error: engineProblem(outcome.error),
      usage: { simulationSeconds: seconds },
    });
    if (done) await notifyIfLong(orgId, runId, elapsedMs, log);
    return { kind: done ? "failed" : "superseded", elapsedMs };
  }

  const result: EstimateResult = compactResult(outcome.result);
  const done = await finishRun(orgId, runId, attempt, {
    status: "succeeded",
    result,
    timings: {
      parseMs: result.timings.parseMs,
      simulateMs: result.timings.simulateMs,
      sampleMs: result.timings.sampleMs,
    },
    shotsDrawn: shotsDrawn(result),
    usage: { runs: 1, shots: shotsDrawn(result), simulationSeconds: seconds },
  });
  if (!done) {
    // Canceled in the last instant, or another attempt owns the run now.
    await recordCanceledRunUsage(orgId, runId, seconds);
    return { kind: "superseded", elapsedMs };
  }
  await notifyIfLong(orgId, runId, elapsedMs, log);
  return { kind: "succeeded", elapsedMs };
}

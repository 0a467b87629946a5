/**
 * When a run's job fails for the last time (retries exhausted, or stalled too
 * often), the run is marked failed with a problem that says so in plain words.
 * The database may be the thing that is down, so the write is retried with
 * backoff for a few minutes; the sweeper catches anything left over.
 */
import type { Job } from "bullmq";
import { runJobSchema } from "@/lib/queue/jobs";
import { failUnfinishedRun } from "@/lib/runs/execution-mutations";
import { infrastructureProblem } from "@/lib/runs/problems";
import { EngineThreadError } from "./engine-pool";
import { log } from "./log";

const STALLED = /stalled more than allowable limit/i;

/** A short, safe description of the fault (no raw error text reaches users). */
export function describeFault(error: Error): string {
  if (STALLED.test(error.message)) return "its worker stopped responding";
  if (error instanceof EngineThreadError) return "the simulation engine stopped unexpectedly";
  for (let e: unknown = error; e; e = (e as { cause?: unknown }).cause) {
    const code = (e as { code?: string }).code ?? "";
    if (/^(ECONNREFUSED|ECONNRESET|ETIMEDOUT|PROTOCOL_CONNECTION_LOST|ER_)/.test(code))
      return "the database was unreachable";
  }
  return "an internal error";
}

export async function failRunAfterRetries(job: Job, error: Error): Promise<void> {
  if (job.name !== "run.execute") return;
  const payload = runJobSchema.safeParse(job.data);
  if (!payload.success) return;
  const final = STALLED.test(error.message) || job.attemptsMade >= (job.opts.attempts ?? 1);
  if (!final) return;
  const problem = infrastructureProblem(job.attemptsMade, describeFault(error));
  for (let attempt = 0; attempt < 8; attempt++) {
    try {
      if (await failUnfinishedRun(payload.data.orgId, payload.data.runId, problem)) {
        log(`run ${payload.data.runId}: failed — ${problem.detail}`);
      }
      return;
    } catch (writeError) {
      log(`could not mark run ${payload.data.runId} failed yet; retrying`, writeError);
      await new Promise((resolve) => setTimeout(resolve, Math.min(30_000, 1_000 * 2 ** attempt)));
    }
  }
}

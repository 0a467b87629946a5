/**
 * How the worker runs the engine: an `EngineRunner` executes one request off
 * the event loop (worker/engine-pool.ts uses worker threads), reports progress,
 * and stops at once when the signal aborts. It resolves for every outcome that
 * belongs to the run (result, engine error, abort) and rejects only for
 * infrastructure faults (a crashed engine thread), which the queue retries.
 */
import type { EngineErrorCode, EngineIssue } from "@/lib/quantum/errors";
import type { EstimateRequest, EstimateResult } from "@/lib/quantum/schemas";

export type EngineRunOutcome =
  | { kind: "result"; result: EstimateResult; elapsedMs: number }
  | {
      kind: "engine-error";
      error: { code: EngineErrorCode; message: string; issues: EngineIssue[] };
      elapsedMs: number;
    }
  | { kind: "aborted"; elapsedMs: number };

export type EngineRunOptions = {
  onProgress: (fraction: number, phase: string) => void;
  signal: AbortSignal;
};

export interface EngineRunner {
  run(request: EstimateRequest, options: EngineRunOptions): Promise<EngineRunOutcome>;
}

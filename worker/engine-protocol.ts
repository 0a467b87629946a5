/** Messages between the worker's main thread and its engine threads. */
import type { EngineErrorCode, EngineIssue } from "@/lib/quantum/errors";
import type { EstimateResult } from "@/lib/quantum/schemas";

export type ThreadRequest = { type: "run"; request: unknown };

export type ThreadReply =
  | { type: "ready" }
  | { type: "progress"; fraction: number; phase: string }
  | { type: "result"; result: EstimateResult; elapsedMs: number }
  | {
      type: "engine-error";
      error: { code: EngineErrorCode; message: string; issues: EngineIssue[] };
      elapsedMs: number;
    }
  | { type: "crash"; message: string; elapsedMs: number };

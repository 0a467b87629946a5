/**
 * Messages between the web process and its preview threads. A task asks for the
 * engine's preview of a request, the outline of its circuit (what the new-run
 * page draws), or both from one parse. Engine errors are part of the answer,
 * beside the outline computed before them.
 */
import type { EngineErrorCode, EngineIssue } from "@/lib/quantum/errors";
import type { CircuitOutline, PreviewResult } from "@/lib/quantum/schemas";

/** "preview": the engine's preview; "outline": the circuit's outline only; "both". */
export type PreviewWant = "preview" | "outline" | "both";

export type PreviewRequestMessage = {
  type: "preview";
  id: number;
  request: unknown;
  want: PreviewWant;
};

export type ThreadEngineError = { code: EngineErrorCode; message: string; issues: EngineIssue[] };

export type PreviewReply =
  | { type: "ready" }
  | {
      type: "result";
      id: number;
      preview: PreviewResult | null;
      outline: CircuitOutline | null;
      error: ThreadEngineError | null;
    }
  | { type: "crash"; id: number; message: string };

/** Messages between the web process and its preview threads. */
import type { EngineErrorCode, EngineIssue } from "@/lib/quantum/errors";
import type { PreviewResult } from "@/lib/quantum/schemas";

export type PreviewRequestMessage = { type: "preview"; id: number; request: unknown };

export type PreviewReply =
  | { type: "ready" }
  | { type: "result"; id: number; preview: PreviewResult }
  | {
      type: "engine-error";
      id: number;
      error: { code: EngineErrorCode; message: string; issues: EngineIssue[] };
    }
  | { type: "crash"; id: number; message: string };

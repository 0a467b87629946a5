/**
 * An EngineRunner that calls the real `estimate()` in this process, passing
 * the abort signal through (the engine checks it between chunks of work).
 * For tests that drive lib/runs/execute-run.ts directly; the worker process
 * uses its thread pool instead.
 */
import { estimate, isEngineError } from "@/lib/quantum";
import type { EngineRunner } from "@/lib/runs/engine-runner";

export const inProcessEngine: EngineRunner = {
  async run(request, { onProgress, signal }) {
    const started = performance.now();
    const elapsedMs = () => performance.now() - started;
    try {
      const result = await estimate(request, { onProgress, signal });
      return { kind: "result", result, elapsedMs: elapsedMs() };
    } catch (error) {
      if (signal.aborted) return { kind: "aborted", elapsedMs: elapsedMs() };
      if (isEngineError(error)) {
        return {
          kind: "engine-error",
          error: { code: error.code, message: error.message, issues: error.issues },
          elapsedMs: elapsedMs(),
        };
      }
      throw error;
    }
  },
};

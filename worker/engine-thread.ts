/**
 * One engine thread: runs `estimate()` for each "run" message, posting
 * progress (at most every 100 ms), then the result or the engine's typed error.
 * Pure CPU work, no I/O; the worker's main thread stays free for the queue
 * lock, the database and cancellation (it terminates this thread to stop it).
 */
import { parentPort } from "node:worker_threads";
import { estimate } from "@/lib/quantum";
import { isEngineError } from "@/lib/quantum/errors";
import type { EstimateRequest } from "@/lib/quantum/schemas";
import type { ThreadReply, ThreadRequest } from "./engine-protocol";

const port = parentPort;
if (!port) throw new Error("engine-thread.ts must run in a worker thread");

const reply = (message: ThreadReply) => port.postMessage(message);

port.on("message", async (message: ThreadRequest) => {
  if (message.type !== "run") return;
  const started = performance.now();
  let lastProgress = 0;
  try {
    const result = await estimate(message.request as EstimateRequest, {
      onProgress: (fraction: number, phase: string) => {
        const now = performance.now();
        if (now - lastProgress < 100) return;
        lastProgress = now;
        reply({ type: "progress", fraction, phase });
      },
    });
    reply({ type: "result", result, elapsedMs: performance.now() - started });
  } catch (error) {
    const elapsedMs = performance.now() - started;
    if (isEngineError(error)) {
      reply({
        type: "engine-error",
        error: { code: error.code, message: error.message, issues: error.issues },
        elapsedMs,
      });
    } else {
      reply({
        type: "crash",
        message: error instanceof Error ? (error.stack ?? error.message) : String(error),
        elapsedMs,
      });
    }
  }
});

reply({ type: "ready" });

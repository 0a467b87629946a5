/**
 * One preview thread of the web process (lib/runs/preview-pool.ts): runs the
 * engine's preview for each "preview" message and answers with the preview
 * or the engine's typed error. Pure CPU work, no I/O. In production this file
 * is bundled with the engine into `<dist>/preview-thread.mjs` at build time
 * (scripts/build-preview-thread.mjs); in development and tests it is loaded
 * through tsx.
 */
import { parentPort } from "node:worker_threads";
import { previewRequest } from "@/lib/quantum";
import { isEngineError } from "@/lib/quantum/errors";
import type { PreviewReply, PreviewRequestMessage } from "./preview-protocol";

const port = parentPort;
if (!port) throw new Error("preview-thread.ts must run in a worker thread");

const reply = (message: PreviewReply) => port.postMessage(message);

port.on("message", async (message: PreviewRequestMessage) => {
  if (message.type !== "preview") return;
  try {
    reply({ type: "result", id: message.id, preview: await previewRequest(message.request) });
  } catch (error) {
    if (isEngineError(error)) {
      reply({
        type: "engine-error",
        id: message.id,
        error: { code: error.code, message: error.message, issues: error.issues },
      });
    } else {
      reply({
        type: "crash",
        id: message.id,
        message: error instanceof Error ? (error.stack ?? error.message) : String(error),
      });
    }
  }
});

reply({ type: "ready" });

/**
 * One preview thread of the web process (lib/runs/preview-pool.ts): for each
 * "preview" message, parses the request's circuit once and answers with what
 * was asked — the engine's preview, the circuit's outline, or both — and the
 * engine's typed error, if any, beside the outline computed before it. Pure CPU
 * work, no I/O. In production this file is bundled with the engine into
 * `<dist>/preview-thread.mjs` at build time (scripts/build-preview-thread.mjs);
 * in development and tests it is loaded through tsx.
 */
import { parentPort } from "node:worker_threads";
import { circuitOutline, parseProgram, previewRequest, type ParsedProgram } from "@/lib/quantum";
import { isEngineError, type EngineError } from "@/lib/quantum/errors";
import type { CircuitOutline } from "@/lib/quantum/schemas";
import type { PreviewReply, PreviewRequestMessage, PreviewWant } from "./preview-protocol";

const port = parentPort;
if (!port) throw new Error("preview-thread.ts must run in a worker thread");

const reply = (message: PreviewReply) => port.postMessage(message);

type Draft = { circuit?: { format?: unknown; source?: unknown }; parameters?: unknown };

function answer(request: unknown, want: PreviewWant) {
  let program: ParsedProgram | undefined;
  let outline: CircuitOutline | null = null;
  let error: EngineError | null = null;
  if (want !== "preview") {
    const { circuit, parameters } = (request ?? {}) as Draft;
    try {
      program = parseProgram(circuit?.format as "qasm2", circuit?.source as string);
      outline = circuitOutline(
        program,
        typeof parameters === "object" && parameters !== null
          ? (parameters as Record<string, unknown>)
          : {},
      );
    } catch (e) {
      if (!isEngineError(e)) throw e;
      error = e;
    }
  }
  if (want === "outline") return { preview: null, outline, error };
  try {
    return { preview: previewRequest(request, { program }), outline, error: null };
  } catch (e) {
    if (!isEngineError(e)) throw e;
    return { preview: null, outline, error: e };
  }
}

port.on("message", (message: PreviewRequestMessage) => {
  if (message.type !== "preview") return;
  try {
    const { preview, outline, error } = answer(message.request, message.want);
    reply({
      type: "result",
      id: message.id,
      preview,
      outline,
      error: error ? { code: error.code, message: error.message, issues: error.issues } : null,
    });
  } catch (error) {
    reply({
      type: "crash",
      id: message.id,
      message: error instanceof Error ? (error.stack ?? error.message) : String(error),
    });
  }
});

reply({ type: "ready" });

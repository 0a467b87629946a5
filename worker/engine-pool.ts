/**
 * A fixed pool of engine threads (one per job the process runs at once).
 * `run()` takes a free thread, sends it the request and resolves with the
 * outcome. Aborting terminates the thread at once — the engine needs no
 * cooperation to stop — and a fresh thread replaces it in the background.
 * A thread that crashes or exits is an infrastructure fault: `run()` rejects
 * with `EngineThreadError` (the queue retries) and the thread is replaced.
 */
import { Worker } from "node:worker_threads";
import type { EngineRunner, EngineRunOptions, EngineRunOutcome } from "@/lib/runs/engine-runner";
import type { EstimateRequest } from "@/lib/quantum/schemas";
import type { ThreadReply } from "./engine-protocol";

export class EngineThreadError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "EngineThreadError";
  }
}

type Slot = { thread: Worker; ready: Promise<void>; busy: boolean };

const BOOT = new URL("./thread-boot.mjs", import.meta.url);
const ENTRY = new URL("./engine-thread.ts", import.meta.url).href;

function spawn(): Slot {
  const thread = new Worker(BOOT, { workerData: { entry: ENTRY } });
  const ready = new Promise<void>((resolve, reject) => {
    const onMessage = (m: ThreadReply) => {
      if (m.type === "ready") {
        thread.off("message", onMessage);
        thread.off("error", reject);
        resolve();
      }
    };
    thread.on("message", onMessage);
    thread.once("error", reject);
  });
  return { thread, ready, busy: false };
}

export class EnginePool implements EngineRunner {
  private slots: Slot[] = [];
  private waiters: ((slot: Slot) => void)[] = [];
  private closed = false;

  constructor(readonly size: number) {}

  /** Fraction of the pool's threads running a job now (metrics). */
  busyRatio(): number {
    return this.slots.length === 0
      ? 0
      : this.slots.filter((s) => s.busy).length / this.slots.length;
  }

  /** Starts every thread and waits until each has loaded the engine. */
  async start(): Promise<void> {
    this.slots = Array.from({ length: this.size }, spawn);
    await Promise.all(this.slots.map((s) => s.ready));
  }

  private async acquire(): Promise<Slot> {
    const free = this.slots.find((s) => !s.busy);
    const slot = free ?? (await new Promise<Slot>((resolve) => this.waiters.push(resolve)));
    slot.busy = true;
    try {
      await slot.ready;
    } catch (error) {
      this.release(this.replace(slot));
      throw new EngineThreadError(
        `engine thread did not start: ${error instanceof Error ? error.message : String(error)}`,
      );
    }
    return slot;
  }

  /** Hands the slot to the next waiter (still busy), or marks it free. */
  private release(slot: Slot): void {
    const next = this.waiters.shift();
    if (next) next(slot);
    else slot.busy = false;
  }

  /** Terminates a slot's thread and puts a fresh one in its place. */
  private replace(slot: Slot): Slot {
    void slot.thread.terminate();
    const fresh = spawn();
    fresh.busy = true; // released by the caller
    fresh.ready.catch(() => {});
    this.slots[this.slots.indexOf(slot)] = fresh;
    return fresh;
  }

  run(
    request: EstimateRequest,
    { onProgress, signal }: EngineRunOptions,
  ): Promise<EngineRunOutcome> {
    return this.acquire().then(
      (slot) =>
        new Promise<EngineRunOutcome>((resolve, reject) => {
          const started = performance.now();
          const elapsed = () => performance.now() - started;
          let settled = false;
          const finish = (replaceThread: boolean) => {
            settled = true;
            slot.thread.off("message", onMessage);
            slot.thread.off("error", onError);
            slot.thread.off("exit", onExit);
            signal.removeEventListener("abort", onAbort);
            if (this.closed) return;
            this.release(replaceThread ? this.replace(slot) : slot);
          };
          const onMessage = (m: ThreadReply) => {
            if (settled) return;
            if (m.type === "progress") {
              onProgress(m.fraction, m.phase);
            } else if (m.type === "result") {
              finish(false);
              resolve({ kind: "result", result: m.result, elapsedMs: m.elapsedMs });
            } else if (m.type === "engine-error") {
              finish(false);
              resolve({ kind: "engine-error", error: m.error, elapsedMs: m.elapsedMs });
            } else if (m.type === "crash") {
              finish(false);
              reject(new EngineThreadError(`engine crashed: ${m.message}`));
            }
          };
          const onError = (error: Error) => {
            if (settled) return;
            finish(true);
            reject(new EngineThreadError(`engine thread failed: ${error.message}`));
          };
          const onExit = (code: number) => {
            if (settled) return;
            finish(true);
            reject(new EngineThreadError(`engine thread exited with code ${code}`));
          };
          const onAbort = () => {
            if (settled) return;
            finish(true);
            resolve({ kind: "aborted", elapsedMs: elapsed() });
          };
          if (signal.aborted) return onAbort();
          slot.thread.on("message", onMessage);
          slot.thread.once("error", onError);
          slot.thread.once("exit", onExit);
          signal.addEventListener("abort", onAbort, { once: true });
          slot.thread.postMessage({ type: "run", request });
        }),
    );
  }

  /** Terminates every thread (shutdown). */
  async close(): Promise<void> {
    this.closed = true;
    await Promise.all(this.slots.map((s) => s.thread.terminate()));
  }
}

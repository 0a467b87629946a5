/**
 * A small pool of worker threads in the web process that run the engine's
 * preview (parse, grouping, shot plan) and the circuit's outline (what the
 * new-run page draws) for POST /runs/preview and POST /runs,
 * so no request's parsing runs on the event loop that serves everyone else.
 *
 * Each task has a time budget: past it the thread is terminated (the engine
 * needs no cooperation to stop), a fresh one replaces it, and the request
 * gets 422 naming the budget. A thread that runs out of memory is handled the
 * same way. When every thread is busy, tasks wait in a short queue; a full
 * queue, or a wait past the budget, answers 503 with Retry-After.
 *
 * The thread entry is lib/runs/preview-thread.ts: bundled with the engine into
 * `<NEXT_DIST_DIR>/preview-thread.mjs` by the production build
 * (scripts/build-preview-thread.mjs), loaded through tsx otherwise.
 */
import "server-only";
import { existsSync } from "node:fs";
import { availableParallelism } from "node:os";
import { join } from "node:path";
import { pathToFileURL } from "node:url";
import type { Worker } from "node:worker_threads";
import { ProblemError } from "@/lib/api/problem";
import { env } from "@/lib/env";
import { EngineError } from "@/lib/quantum/errors";
import type { CircuitOutline, PreviewResult } from "@/lib/quantum/schemas";
import type { PreviewReply, PreviewRequestMessage, PreviewWant } from "./preview-protocol";

export type { PreviewWant } from "./preview-protocol";

/** A thread's answer: what was asked (null when not asked or not computable) and the engine's error. */
export type PreviewAnswer = {
  preview: PreviewResult | null;
  outline: CircuitOutline | null;
  error: EngineError | null;
};

export type PreviewPoolOptions = { size: number; budgetMs: number; maxQueue: number };

type Slot = { worker: Worker; ready: Promise<void>; busy: boolean };
type Waiter = { grant: (slot: Slot) => void; timer: NodeJS.Timeout };

/** Heap per preview thread: a request that needs more is refused, not the process. */
const THREAD_HEAP_MB = 768;

export function defaultPreviewThreads(): number {
  return Math.max(1, Math.min(2, availableParallelism() - 1));
}

/**
 * The Worker class, fetched at run time: the bundler treats `new Worker(path)`
 * as a module reference to resolve at build time, which a path computed at
 * run time (the bundle in the build folder) cannot be.
 */
function workerClass(): typeof Worker {
  return process.getBuiltinModule("node:worker_threads").Worker;
}

let warned = false;
function warnOnce(message: string): void {
  if (warned) return;
  warned = true;
  console.warn(`[ketwise] ${message}`);
}

function spawnThread(): Worker {
  const root = process.cwd();
  const resourceLimits = { maxOldGenerationSizeMb: THREAD_HEAP_MB };
  const bundle = join(root, env.NEXT_DIST_DIR, "preview-thread.mjs");
  if (env.NODE_ENV === "production") {
    if (existsSync(bundle)) return new (workerClass())(bundle, { resourceLimits });
    warnOnce(
      `${bundle} is missing (\`npm run build\` bundles it after next build); loading the preview thread through tsx instead`,
    );
  }
  const entry = pathToFileURL(join(root, "lib/runs/preview-thread.ts")).href;
  return new (workerClass())(join(root, "worker/thread-boot.mjs"), {
    workerData: { entry },
    resourceLimits,
  });
}

const budgetProblem = (ms: number) =>
  new ProblemError({
    type: "/problems/preview-budget-exceeded",
    title: "Too costly to check",
    status: 422,
    detail: `Checking this request took longer than the ${ms / 1000}-second budget for checking a run, so it was stopped. Use fewer gates, terms or sweep points.`,
  });

const outOfMemoryProblem = () =>
  new ProblemError({
    type: "/problems/preview-too-large",
    title: "Too large to check",
    status: 422,
    detail:
      "Checking this request needed more memory than a check may use, so it was stopped. Use fewer gates, terms or sweep points.",
  });

const busyProblem = () =>
  new ProblemError({
    type: "/problems/preview-busy",
    title: "Service busy",
    status: 503,
    detail: "Every thread that checks runs is busy. Try again in a few seconds.",
    retryAfter: 2,
  });

export class PreviewPool {
  private slots: Slot[] = [];
  private waiters: Waiter[] = [];
  private nextId = 1;
  private closed = false;

  constructor(
    readonly options: PreviewPoolOptions,
    private readonly spawn: () => Worker = spawnThread,
  ) {}

  private makeSlot(): Slot {
    const worker = this.spawn();
    worker.unref();
    const ready = new Promise<void>((resolve, reject) => {
      const onMessage = (m: PreviewReply) => {
        if (m.type !== "ready") return;
        worker.off("message", onMessage);
        worker.off("error", reject);
        resolve();
      };
      worker.on("message", onMessage);
      worker.once("error", reject);
    });
    ready.catch(() => {});
    return { worker, ready, busy: false };
  }

  private acquire(): Promise<Slot> {
    if (this.slots.length === 0)
      this.slots = Array.from({ length: this.options.size }, () => this.makeSlot());
    const free = this.slots.find((s) => !s.busy);
    if (free) {
      free.busy = true;
      return Promise.resolve(free);
    }
    if (this.waiters.length >= this.options.maxQueue) return Promise.reject(busyProblem());
    return new Promise<Slot>((resolve, reject) => {
      const waiter: Waiter = {
        grant: (slot) => {
          clearTimeout(waiter.timer);
          resolve(slot);
        },
        timer: setTimeout(() => {
          this.waiters = this.waiters.filter((w) => w !== waiter);
          reject(busyProblem());
        }, this.options.budgetMs),
      };
      this.waiters.push(waiter);
    });
  }

  private release(slot: Slot): void {
    if (this.closed) return;
    const next = this.waiters.shift();
    if (next) next.grant(slot);
    else slot.busy = false;
  }

  /** Terminates a slot's thread and puts a fresh (busy) one in its place. */
  private replace(slot: Slot): Slot {
    void slot.worker.terminate();
    const fresh = this.makeSlot();
    fresh.busy = true;
    const i = this.slots.indexOf(slot);
    if (i >= 0) this.slots[i] = fresh;
    return fresh;
  }

  /** The engine's preview of `request` on a pool thread within the budget; engine errors are thrown. */
  async run(request: unknown): Promise<PreviewResult> {
    const answer = await this.check(request, "preview");
    if (answer.error) throw answer.error;
    if (!answer.preview) throw new Error("preview thread answered without a preview");
    return answer.preview;
  }

  /**
   * What `want` asks of `request` (preview, circuit outline or both, from one parse), on a
   * pool thread within the budget. Engine errors are part of the answer, beside the outline
   * computed before them; the budget, memory and a full pool are thrown as problems.
   */
  async check(request: unknown, want: PreviewWant): Promise<PreviewAnswer> {
    if (this.closed) throw new Error("the preview pool is closed");
    let slot = await this.acquire();
    try {
      await slot.ready;
    } catch (error) {
      this.release(this.replace(slot));
      throw new Error(
        `preview thread did not start: ${error instanceof Error ? error.message : String(error)}`,
      );
    }
    const id = this.nextId++;
    return new Promise<PreviewAnswer>((resolve, reject) => {
      const { worker } = slot;
      const done = (replaceThread: boolean) => {
        clearTimeout(timer);
        worker.off("message", onMessage);
        worker.off("error", onError);
        worker.off("exit", onExit);
        if (replaceThread) slot = this.replace(slot);
        this.release(slot);
      };
      const onMessage = (m: PreviewReply) => {
        if (m.type === "ready" || m.id !== id) return;
        done(false);
        if (m.type === "result") {
          const { preview, outline, error } = m;
          resolve({
            preview,
            outline,
            error: error ? new EngineError(error.code, error.message, error.issues) : null,
          });
        } else if (/^RangeError: Maximum call stack/.test(m.message)) {
          reject(
            new ProblemError({
              type: "/problems/preview-too-large",
              title: "Too large to check",
              status: 422,
              detail:
                "The request is nested too deeply to check (for example, an expression with thousands of parentheses).",
            }),
          );
        } else reject(new Error(`preview thread failed: ${m.message}`));
      };
      const onError = (error: Error & { code?: string }) => {
        done(true);
        reject(
          error.code === "ERR_WORKER_OUT_OF_MEMORY"
            ? outOfMemoryProblem()
            : new Error(`preview thread failed: ${error.message}`),
        );
      };
      const onExit = (code: number) => {
        done(true);
        reject(new Error(`preview thread exited (code ${code})`));
      };
      const timer = setTimeout(() => {
        done(true);
        reject(budgetProblem(this.options.budgetMs));
      }, this.options.budgetMs);
      worker.on("message", onMessage);
      worker.once("error", onError);
      worker.once("exit", onExit);
      worker.postMessage({ type: "preview", id, request, want } satisfies PreviewRequestMessage);
    });
  }

  async close(): Promise<void> {
    this.closed = true;
    for (const w of this.waiters) clearTimeout(w.timer);
    this.waiters = [];
    await Promise.all(this.slots.map((s) => s.worker.terminate()));
    this.slots = [];
  }
}

const holder = globalThis as { __ketwisePreviewPool?: PreviewPool };

/** The web process's pool (PREVIEW_THREADS threads, PREVIEW_BUDGET_MS per task), started on first use. */
export function previewPool(): PreviewPool {
  holder.__ketwisePreviewPool ??= new PreviewPool({
    size: env.PREVIEW_THREADS || defaultPreviewThreads(),
    budgetMs: env.PREVIEW_BUDGET_MS,
    maxQueue: 256,
  });
  return holder.__ketwisePreviewPool;
}

/** Stops the pool's threads (tests, scripts). */
export async function closePreviewPool(): Promise<void> {
  const pool = holder.__ketwisePreviewPool;
  holder.__ketwisePreviewPool = undefined;
  await pool?.close();
}

/**
 * Waiting for a run to become terminal without polling (`GET /api/v1/runs/:id?wait=N`).
 *
 * One Redis subscriber connection per process listens on the run-finished
 * channel (./run-events.ts); each waiting request registers a callback for its
 * run id and is woken by the message, by its deadline, or by its client going
 * away (the request's AbortSignal). At most MAX_WAITERS requests wait at once
 * per process; past that (or while Redis is unreachable) `waitForRun` answers
 * "busy"/"unavailable" at once and the route answers the run as it is, so a
 * wait never hangs and never costs more than one timer and one map entry.
 *
 *   const wait = await registerRunWaiter(runId);   // subscribe first …
 *   … read the run; if it is not terminal yet:
 *   const outcome = await wait.until(ms, req.signal);   // … then wait
 *   wait.release();                                      // always (finally)
 */
import "server-only";
import { Redis } from "ioredis";
import { env } from "@/lib/env";
import { runFinishedChannel } from "./run-events";

/** Requests one process holds waiting at once. */
export const MAX_WAITERS = 500;
/** Longest wait a request may ask for, in seconds. */
export const MAX_WAIT_SECONDS = 30;

export type WaitOutcome = "finished" | "timeout" | "aborted" | "busy" | "unavailable";

type State = {
  subscriber?: Redis;
  ready?: Promise<boolean>;
  waiters: Map<string, Set<() => void>>;
  count: number;
};

const state: State = ((globalThis as { __ketwiseRunWaiters?: State }).__ketwiseRunWaiters ??= {
  waiters: new Map(),
  count: 0,
});

function wake(runId: string): void {
  const set = state.waiters.get(runId);
  if (!set) return;
  for (const callback of [...set]) callback();
}

/** Subscribes once per process; resolves false when Redis does not answer within 2 s. */
function ensureSubscribed(): Promise<boolean> {
  if (!state.ready) {
    const subscriber = new Redis(env.REDIS_URL, {
      maxRetriesPerRequest: 1,
      connectTimeout: 2_000,
      enableOfflineQueue: true,
    });
    subscriber.on("error", () => {}); // the shared client (lib/rate-limit/redis.ts) already logs outages
    subscriber.on("message", (_channel: string, runId: string) => wake(runId));
    state.subscriber = subscriber;
    const timeout = new Promise<boolean>((resolve) =>
      setTimeout(() => resolve(false), 2_000).unref(),
    );
    state.ready = Promise.race([
      subscriber.subscribe(runFinishedChannel()).then(() => true),
      timeout,
    ]).catch(() => false);
    void state.ready.then((ok) => {
      if (ok) return;
      // Try again on the next wait instead of keeping a dead subscription.
      state.ready = undefined;
      state.subscriber = undefined;
      subscriber.disconnect();
    });
  }
  return state.ready;
}

export type RunWaiter = {
  /** Resolves when the run's finish is announced, the time is up, or `signal` aborts. */
  until: (ms: number, signal?: AbortSignal) => Promise<WaitOutcome>;
  release: () => void;
};

const immediate = (outcome: WaitOutcome): RunWaiter => ({
  until: async () => outcome,
  release: () => {},
});

/** Registers interest in `runId` before the caller reads the run (no lost wake-up between read and wait). */
export async function registerRunWaiter(runId: string): Promise<RunWaiter> {
  if (state.count >= MAX_WAITERS) return immediate("busy");
  state.count++;
  let released = false;
  let fired = false;
  let notify: (() => void) | null = null;
  const callback = () => {
    fired = true;
    notify?.();
  };
  const set = state.waiters.get(runId) ?? new Set();
  set.add(callback);
  state.waiters.set(runId, set);
  const release = () => {
    if (released) return;
    released = true;
    state.count--;
    set.delete(callback);
    if (set.size === 0 && state.waiters.get(runId) === set) state.waiters.delete(runId);
  };
  if (!(await ensureSubscribed())) {
    release();
    return immediate("unavailable");
  }
  return {
    release,
    until: (ms, signal) =>
      new Promise<WaitOutcome>((resolve) => {
        if (fired) return resolve("finished");
        if (signal?.aborted) return resolve("aborted");
        const done = (outcome: WaitOutcome) => {
          clearTimeout(timer);
          signal?.removeEventListener("abort", onAbort);
          notify = null;
          resolve(outcome);
        };
        const onAbort = () => done("aborted");
        const timer = setTimeout(() => done("timeout"), Math.max(0, ms));
        signal?.addEventListener("abort", onAbort, { once: true });
        notify = () => done("finished");
      }),
  };
}

/** Requests waiting in this process now (tests and diagnostics). */
export function activeWaiters(): number {
  return state.count;
}

/** Closes the subscriber connection (tests and scripts). */
export async function closeRunWaiters(): Promise<void> {
  const subscriber = state.subscriber;
  state.subscriber = undefined;
  state.ready = undefined;
  if (subscriber) await subscriber.quit().catch(() => subscriber.disconnect());
}

/**
 * "A run became terminal" — announced once by whoever ended it (the worker on
 * success or failure, the request path on cancel, the sweeper for lost runs):
 *
 * 1. published on the Redis channel `<queue prefix>:run-finished` (message: the
 *    run id), so `GET /api/v1/runs/:id?wait=N` answers at once (./run-waiter.ts);
 *
 * Best effort: a Redis fault is logged, never thrown — the run's row is already
 * written and waiters still answer when their wait ends. Redis pub/sub ignores
 * database numbers, hence the per-database prefix.
 */
import "server-only";
import { queuePrefix } from "@/lib/queue/connection";
import { getRedis } from "@/lib/rate-limit/redis";
import type { TerminalRunStatus } from "./constants";

export function runFinishedChannel(): string {
  return `${queuePrefix()}:run-finished`;
}

export async function announceRunFinished(
  orgId: string,
  runId: string,
  status: TerminalRunStatus,
): Promise<void> {
  void orgId;
  const results = await Promise.allSettled([
    withTimeout(getRedis().publish(runFinishedChannel(), runId)),
  ]);
  for (const r of results) {
    if (r.status === "rejected")
      console.error(`[ketwise] run ${runId} ${status}: could not announce it`, r.reason);
  }
}

/** A Redis call that gives up after 2 s (the caller has already written the run). */
function withTimeout<T>(promise: Promise<T>, ms = 2_000): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`no answer from Redis within ${ms} ms`)), ms);
    promise.then(
      (value) => (clearTimeout(timer), resolve(value)),
      (error: unknown) => (clearTimeout(timer), reject(error)),
    );
  });
}

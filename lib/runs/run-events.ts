/**
 * "A run became terminal" — announced once by whoever ended it (the worker on
 * success or failure, the request path on cancel, the sweeper for lost runs):
 *
 * 1. published on the Redis channel `<queue prefix>:run-finished` (message: the
 *    run id), so `GET /api/v1/runs/:id?wait=N` answers at once (./run-waiter.ts);
 * 2. handed to the webhooks: a `webhook.fanout` job (id `hooks-<run>`, so at most
 *    one per run) makes one signed delivery per enabled endpoint
 *    (lib/webhooks/deliveries.ts).
 *
 * Best effort: a Redis fault is logged, never thrown — the run's row is already
 * written, waiters still answer when their wait ends, and webhooks are
 * notifications, not the record (the run itself is). Redis pub/sub ignores
 * database numbers, hence the per-database prefix.
 */
import "server-only";
import { queuePrefix } from "@/lib/queue/connection";
import { enqueue, withTimeout } from "@/lib/queue/enqueue";
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
  const results = await Promise.allSettled([
    withTimeout(getRedis().publish(runFinishedChannel(), runId), 2_000),
    enqueue("webhook.fanout", { orgId, runId, status }, { jobId: `hooks-${runId}` }),
  ]);
  for (const r of results) {
    if (r.status === "rejected")
      console.error(`[ketwise] run ${runId} ${status}: could not announce it`, r.reason);
  }
}

/**
 * Redis connection options for BullMQ, from REDIS_URL.
 *
 * - Workers block on Redis and must never give up on a command:
 *   `maxRetriesPerRequest: null` (BullMQ requires it).
 * - Producers (the web app) must fail fast when Redis is down, so a submission
 *   answers 503 instead of hanging: no offline queue, one retry, short timeouts.
 */
import type { ConnectionOptions } from "bullmq";
import { env } from "@/lib/env";

/**
 * Key prefix of the queues: one per database (`kw:<database>`), so the
 * development app, the test suite and a benchmark sharing one Redis never take
 * each other's jobs.
 */
export function queuePrefix(): string {
  const name = /\/(\w+)(?:\?.*)?$/.exec(env.DATABASE_URL)?.[1] ?? "app";
  return `kw:${name}`;
}

export function workerConnection(): ConnectionOptions {
  return { url: env.REDIS_URL, maxRetriesPerRequest: null };
}

export function producerConnection(): ConnectionOptions {
  return {
    url: env.REDIS_URL,
    maxRetriesPerRequest: 1,
    enableOfflineQueue: false,
    connectTimeout: 2_000,
    commandTimeout: 3_000,
    // Keep retrying the connection in the background (capped), so the app recovers when Redis returns.
    retryStrategy: (times: number) => Math.min(times * 200, 2_000),
  };
}

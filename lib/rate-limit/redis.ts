/**
 * The app's shared ioredis connection for request-path work (rate limits).
 * BullMQ keeps its own connections (it needs `maxRetriesPerRequest: null`).
 */
import "server-only";
import { Redis } from "ioredis";
import { env } from "@/lib/env";

const holder = ((globalThis as { __ketwiseRedis?: { client?: Redis } }).__ketwiseRedis ??= {});

export function getRedis(): Redis {
  holder.client ??= new Redis(env.REDIS_URL, { maxRetriesPerRequest: 2, enableAutoPipelining: true });
  return holder.client;
}

/** Closes the shared connection (scripts and tests). */
export async function closeRedis(): Promise<void> {
  const client = holder.client;
  holder.client = undefined;
  if (client) await client.quit();
}

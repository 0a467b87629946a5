/**
 * The app's shared ioredis connection for request-path work (rate limits).
 * BullMQ keeps its own connections (it needs `maxRetriesPerRequest: null`).
 */
import "server-only";
import { Redis } from "ioredis";
import { env } from "@/lib/env";

const holder = ((globalThis as { __ketwiseRedis?: { client?: Redis } }).__ketwiseRedis ??= {});

let lastLogged = 0;

export function getRedis(): Redis {
  if (!holder.client) {
    const client = new Redis(env.REDIS_URL, {
      maxRetriesPerRequest: 2,
      enableAutoPipelining: true,
    });
    // Without a listener ioredis reports every failed reconnect as an unhandled
    // error event; callers already turn failed commands into 503s, so log once
    // a minute while Redis is unreachable.
    client.on("error", (error: Error) => {
      if (Date.now() - lastLogged < 60_000) return;
      lastLogged = Date.now();
      console.error(`[ketwise] Redis unreachable (${env.REDIS_URL}): ${error.message}`);
    });
    holder.client = client;
  }
  return holder.client;
}

/** Closes the shared connection (scripts and tests). */
export async function closeRedis(): Promise<void> {
  const client = holder.client;
  holder.client = undefined;
  if (client) await client.quit();
}

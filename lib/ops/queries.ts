/**
 * Readiness probes of the shared state: the database answers and carries every
 * migration this build ships, Redis answers. Each probe has its own short
 * timeout so `/api/ready` answers within ~2 s even when a dependency hangs. A
 * failure is described in plain words (timeout, migration missing, unreachable);
 * the driver's own message, which may name hosts and users, is only logged.
 */
import "server-only";
import { sql } from "drizzle-orm";
import { db } from "@/db";
import journal from "@/drizzle/meta/_journal.json";
import { logger } from "@/lib/observability/logger";
import { getRedis } from "@/lib/rate-limit/redis";

export type Check = { ok: boolean; detail: string; ms: number };

/** A probe failure whose message is safe to show on the public readiness answer. */
class ProbeFailure extends Error {}

const PROBE_TIMEOUT_MS = 2_000;

async function timed(probe: () => Promise<string>): Promise<Check> {
  const started = performance.now();
  let timer: NodeJS.Timeout | undefined;
  try {
    const timeout = new Promise<never>((_, reject) => {
      timer = setTimeout(
        () => reject(new ProbeFailure(`no answer within ${PROBE_TIMEOUT_MS} ms`)),
        PROBE_TIMEOUT_MS,
      );
    });
    const detail = await Promise.race([probe(), timeout]);
    return { ok: true, detail, ms: Math.round(performance.now() - started) };
  } catch (error) {
    // /api/ready is public: driver messages (host names, addresses, user names) go to the log only.
    if (!(error instanceof ProbeFailure)) logger().error({ err: error }, "readiness probe failed");
    return {
      ok: false,
      detail: error instanceof ProbeFailure ? error.message : "unreachable (see the server log)",
      ms: Math.round(performance.now() - started),
    };
  } finally {
    clearTimeout(timer);
  }
}

/** The newest migration this build ships (the drizzle journal's last entry). */
export const LATEST_MIGRATION = journal.entries[journal.entries.length - 1];

export function checkDatabase(): Promise<Check> {
  return timed(async () => {
    await db.execute(sql`select 1`);
    return "reachable";
  });
}

export function checkMigrations(): Promise<Check> {
  return timed(async () => {
    const [rows] = (await db.execute(
      sql`select max(created_at) as latest from __drizzle_migrations`,
    )) as unknown as [{ latest: string | number | null }[]];
    const applied = Number(rows[0]?.latest ?? 0);
    if (applied < LATEST_MIGRATION.when)
      throw new ProbeFailure(`migration ${LATEST_MIGRATION.tag} is not applied yet`);
    return `current (${LATEST_MIGRATION.tag})`;
  });
}

export function checkRedis(): Promise<Check> {
  return timed(async () => {
    const answer = await getRedis().ping();
    if (answer !== "PONG") throw new ProbeFailure(`unexpected answer ${answer}`);
    return "reachable";
  });
}

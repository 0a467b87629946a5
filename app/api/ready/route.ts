/**
 * GET /api/ready — readiness: the database answers and carries every migration
 * of this build, Redis answers. 200 when all hold, else 503 problem+json naming
 * the failing checks (load balancers stop sending traffic until it is 200).
 */
import { checkDatabase, checkMigrations, checkRedis } from "@/lib/ops/queries";

export const dynamic = "force-dynamic";

export async function GET(): Promise<Response> {
  const [database, migrations, redis] = await Promise.all([
    checkDatabase(),
    checkMigrations(),
    checkRedis(),
  ]);
  const checks = { database, migrations, redis };
  const failing = Object.entries(checks).filter(([, c]) => !c.ok);
  const headers = { "cache-control": "no-store" };
  if (failing.length === 0) return Response.json({ status: "ready", checks }, { headers });
  return Response.json(
    {
      type: "/problems/not-ready",
      title: "Not ready",
      status: 503,
      detail: failing.map(([name, c]) => `${name}: ${c.detail}`).join("; "),
      checks,
    },
    { status: 503, headers: { ...headers, "content-type": "application/problem+json" } },
  );
}

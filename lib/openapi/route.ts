/**
 * `v1Route(handler, { role })` — an API v1 route handler behind `withOrg`
 * (key or session → organisation → role → per-actor rate limit) with the v1
 * request budget. The wrapper is built on the first request, so importing a
 * route module (e.g. during `next build`) reads no environment.
 */
import "server-only";
import { badRequest } from "@/lib/api/problem";
import { withOrg, type OrgContext } from "@/lib/api/with-org";
import type { Role } from "@/lib/orgs/roles";
import { apiBudget } from "@/lib/runs/limits";
import { idempotencyKeySchema } from "@/lib/runs/schemas";

type Handler<P> = (req: Request, ctx: OrgContext<P>) => Promise<Response> | Response;
type RouteContext<P> = { params: Promise<P> };

export function v1Route<P = Record<string, string>>(handler: Handler<P>, options: { role?: Role } = {}) {
  let wrapped: ((req: Request, route?: RouteContext<P>) => Promise<Response>) | undefined;
  return (req: Request, route?: RouteContext<P>): Promise<Response> => {
    wrapped ??= withOrg<P>(handler, { role: options.role ?? "viewer", rateLimit: apiBudget() });
    return wrapped(req, route);
  };
}

/** The `Idempotency-Key` header, validated; null when absent. */
export function readIdempotencyKey(req: Request): string | null {
  const raw = req.headers.get("idempotency-key");
  if (raw === null) return null;
  const parsed = idempotencyKeySchema.safeParse(raw.trim());
  if (!parsed.success) {
    throw badRequest("The Idempotency-Key header is not valid.", [
      { path: "Idempotency-Key", message: parsed.error.issues[0]?.message ?? "invalid" },
    ]);
  }
  return parsed.data;
}

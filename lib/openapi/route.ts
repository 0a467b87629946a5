/**
 * `v1Route(handler, { role })` — an API v1 route handler behind `withOrg`
 * (key or session → organisation → role → per-actor rate limit of
 * API_RATE_LIMIT_PER_MINUTE), observed by `observeRequest` (request id, latency
 * metric). Reads default to the viewer role.
 */
import "server-only";
import { badRequest } from "@/lib/api/problem";
import { withOrg, type OrgContext } from "@/lib/api/with-org";
import { observeRequest } from "@/lib/observability/http";
import type { Role } from "@/lib/orgs/roles";
import { idempotencyKeySchema } from "@/lib/runs/schemas";

type Handler<P> = (req: Request, ctx: OrgContext<P>) => Promise<Response> | Response;

export function v1Route<P = Record<string, string>>(
  handler: Handler<P>,
  options: { role?: Role } = {},
) {
  const inner = withOrg<P>(handler, { role: options.role ?? "viewer" });
  return (req: Request, route?: { params: Promise<P> }): Promise<Response> =>
    observeRequest(req, () => inner(req, route));
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

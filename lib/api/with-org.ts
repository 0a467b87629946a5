/**
 * The route-handler wrapper for org-scoped endpoints (`/api/v1/**`):
 *
 *   export const GET = withOrg(async (req, { org, role, actor, params }) => Response.json(…),
 *                              { role: "member" });
 *
 * Per request it (1) authenticates — `Authorization: Bearer kw_…` API key, else
 * the session cookie; (2) resolves the organisation — the key's own, or for a
 * session the `X-Ketwise-Org` header (id or slug), else the `kw_org` cookie,
 * else the user's oldest membership; (3) checks the role (for keys the lower of
 * the key's role and its creator's current role — a key whose creator left is
 * disabled; for users the membership's); (4) spends one point of the actor's rate
 * budget; then runs the handler. Every failure answers problem+json:
 * 401 no/expired credentials, 404 not a member, 403 role too weak, 429 rate.
 * Every answer after step (4) — successes, problems and 429s alike — carries
 * the RateLimit-* fields of the budget (lib/rate-limit/headers.ts); a 429 from
 * another budget inside the handler (run submissions) carries that budget's.
 */
import "server-only";
import { getSessionUserFromRequest } from "@/lib/auth/session";
import { ORG_COOKIE, accessFrom, pickCurrentOrg } from "@/lib/auth/guards";
import { hashApiKey, looksLikeApiKey } from "@/lib/orgs/api-key-format";
import { keyStanding } from "@/lib/api-keys/effective-role";
import { touchApiKey } from "@/lib/api-keys/mutations";
import {
  findActiveApiKeyByHash,
  listMembershipsForUser,
  type OrgSummary,
} from "@/lib/orgs/queries";
import { ROLE_LABELS, roleAtLeast, type Role } from "@/lib/orgs/roles";
import { env } from "@/lib/env";
import { consume, type Budget, type RateLimitState } from "@/lib/rate-limit";
import { applyRateLimitHeaders } from "@/lib/rate-limit/headers";
import { editHeaders } from "./response-headers";
import { forbidden, problemResponse, sessionExpired, toProblem, unauthorized } from "./problem";

export type Actor =
  | { kind: "user"; userId: string }
  | { kind: "api_key"; apiKeyId: string; createdById: string | null };

export type OrgContext<P = Record<string, string>> = {
  org: OrgSummary;
  role: Role;
  actor: Actor;
  params: P;
};

export type WithOrgOptions = {
  /** Weakest role allowed (default viewer). */
  role?: Role;
  /** Per-actor budget (default API_RATE_LIMIT_PER_MINUTE per minute); false turns the limit off. */
  rateLimit?: Budget | false;
};

type RouteContext<P> = { params: Promise<P> };

function readCookie(req: Request, name: string): string | null {
  const header = req.headers.get("cookie");
  if (!header) return null;
  for (const part of header.split(";")) {
    const [key, ...rest] = part.trim().split("=");
    if (key === name) return decodeURIComponent(rest.join("="));
  }
  return null;
}

async function fromApiKey(token: string, min: Role): Promise<Omit<OrgContext, "params">> {
  if (!looksLikeApiKey(token))
    throw unauthorized("The API key is malformed; keys look like kw_xxxxxxxx_….");
  const found = await findActiveApiKeyByHash(hashApiKey(token));
  if (!found) throw unauthorized("The API key is unknown or has been revoked.");
  const { key, org } = found;
  // Rights are the lower of the key's role and its creator's current role, checked on every request.
  const standing = keyStanding(key.role, found.creatorRole);
  if (standing.state === "disabled") {
    throw forbidden(
      `This API key is disabled: the person who created it is no longer a member of ${org.name}. Create a new key.`,
    );
  }
  if (!roleAtLeast(standing.role, min)) {
    const why =
      standing.state === "capped"
        ? ` (the key is ${ROLE_LABELS[key.role]}, but its creator is now ${ROLE_LABELS[standing.creatorRole]})`
        : "";
    throw forbidden(
      `This needs a key with the ${ROLE_LABELS[min]} role or higher; this key acts as ${ROLE_LABELS[standing.role]}${why}.`,
    );
  }
  if (!key.lastUsedAt || Date.now() - key.lastUsedAt.getTime() > 60_000)
    await touchApiKey(org.id, key.id);
  return {
    org: { id: org.id, name: org.name, slug: org.slug, plan: org.plan },
    role: standing.role,
    actor: { kind: "api_key", apiKeyId: key.id, createdById: key.createdById },
  };
}

async function fromSession(req: Request, min: Role): Promise<Omit<OrgContext, "params">> {
  const { user, expired } = await getSessionUserFromRequest(req);
  if (!user) throw expired ? sessionExpired() : unauthorized();
  const wanted = req.headers.get("x-ketwise-org");
  const memberships = await listMembershipsForUser(user.id);
  const picked = wanted
    ? memberships.find((m) => m.org.id === wanted || m.org.slug === wanted)
    : pickCurrentOrg(memberships, readCookie(req, ORG_COOKIE));
  // The membership just read is the one checked: no second lookup.
  const access = accessFrom(user.id, picked, min);
  return { org: access.org, role: access.role, actor: { kind: "user", userId: user.id } };
}

/** Resolves actor, organisation and role for a request; throws ProblemError. Exported for tests. */
export async function resolveOrgContext(
  req: Request,
  min: Role = "viewer",
): Promise<Omit<OrgContext, "params">> {
  const authorization = req.headers.get("authorization");
  if (authorization) {
    const match = /^Bearer\s+(\S+)$/i.exec(authorization.trim());
    if (!match) throw unauthorized("Send the API key as `Authorization: Bearer kw_…`.");
    return fromApiKey(match[1], min);
  }
  return fromSession(req, min);
}

export function withOrg<P = Record<string, string>>(
  handler: (req: Request, ctx: OrgContext<P>) => Promise<Response> | Response,
  options: WithOrgOptions = {},
) {
  return async (req: Request, route?: RouteContext<P>): Promise<Response> => {
    let rate: RateLimitState | undefined;
    try {
      const ctx = await resolveOrgContext(req, options.role ?? "viewer");
      if (options.rateLimit !== false) {
        const actorKey =
          ctx.actor.kind === "user" ? `u:${ctx.actor.userId}` : `k:${ctx.actor.apiKeyId}`;
        const budget = options.rateLimit ?? { points: env.API_RATE_LIMIT_PER_MINUTE, duration: 60 };
        rate = await consume("api", budget, actorKey, "Too many API requests.");
      }
      const params = (route ? await route.params : {}) as P;
      const res = await handler(req, { ...ctx, params });
      const spent = rate;
      return spent ? editHeaders(res, (h) => applyRateLimitHeaders(h, spent)) : res;
    } catch (error) {
      const problem = toProblem(error, `${req.method} ${new URL(req.url).pathname}`);
      return problemResponse(
        problem.rateLimit || !rate ? problem : { ...problem, rateLimit: rate },
      );
    }
  };
}

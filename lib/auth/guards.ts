/**
 * Authorisation for server actions and pages — the one place that answers
 * "may this user act in this organisation with at least this role?".
 *
 *   requireMembership(orgId)      → OrgAccess, or 401 / 404
 *   requireRole(orgId, "admin")   → OrgAccess, or 401 / 404 / 403
 *   getCurrentOrg()               → the organisation chosen in the UI (cookie)
 *   getCurrentOrgOrRedirect()     → the same for pages (signed out → /sign-in)
 *
 * Not a member (or no such organisation) answers 404, never 403, so ids of
 * other tenants leak nothing. 403 only when the user is a member whose role
 * is too weak for the action.
 */
import "server-only";
import { cookies } from "next/headers";
import { cache } from "react";
import { forbidden, notFound } from "@/lib/api/problem";
import {
  getMembership,
  listMembershipsForUser,
  type MembershipWithOrg,
  type OrgSummary,
} from "@/lib/orgs/queries";
import { ROLE_LABELS, roleAtLeast, type Role } from "@/lib/orgs/roles";
import { requireUser, requireUserOrRedirect, type SessionUser } from "./session";

export type OrgAccess = { userId: string; org: OrgSummary; role: Role };

/** The cookie holding the id of the organisation chosen in the org switcher. */
export const ORG_COOKIE = "kw_org";

/** DB check behind every guard: membership of `userId` in `orgId` with at least `min`. */
export async function authorizeMember(
  userId: string,
  orgId: string,
  min: Role = "viewer",
): Promise<OrgAccess> {
  return accessFrom(userId, await getMembership(orgId, userId), min);
}

/** The same check on a membership already read (404 when there is none, 403 when too weak). */
export function accessFrom(
  userId: string,
  membership: MembershipWithOrg | null | undefined,
  min: Role,
): OrgAccess {
  if (!membership) throw notFound("No such organisation, or you are not a member of it.");
  if (!roleAtLeast(membership.role, min)) {
    throw forbidden(
      `This needs the ${ROLE_LABELS[min]} role or higher in ${membership.org.name}; you are ${ROLE_LABELS[membership.role]}.`,
    );
  }
  return { userId, org: membership.org, role: membership.role };
}

export async function requireMembership(orgId: string): Promise<OrgAccess> {
  const user = await requireUser();
  return authorizeMember(user.id, orgId, "viewer");
}

export async function requireRole(orgId: string, role: Role): Promise<OrgAccess> {
  const user = await requireUser();
  return authorizeMember(user.id, orgId, role);
}

/**
 * Picks the current organisation among the user's memberships: the preferred
 * id when the user belongs to it, else the oldest membership; null when none.
 */
export function pickCurrentOrg(
  memberships: MembershipWithOrg[],
  preferredOrgId: string | null | undefined,
) {
  return memberships.find((m) => m.org.id === preferredOrgId) ?? memberships[0] ?? null;
}

export type CurrentOrg = {
  user: SessionUser;
  current: OrgAccess | null;
  memberships: MembershipWithOrg[];
};

// Once per request and user: memberships plus the one chosen by the org cookie.
const currentOrgFor = cache(async (userId: string) => {
  const memberships = await listMembershipsForUser(userId);
  const preferred = (await cookies()).get(ORG_COOKIE)?.value;
  const picked = pickCurrentOrg(memberships, preferred);
  const current: OrgAccess | null = picked ? { userId, org: picked.org, role: picked.role } : null;
  return { current, memberships };
});

/** For actions: the signed-in user, their memberships and the organisation chosen in the UI; 401 when signed out. */
export async function getCurrentOrg(): Promise<CurrentOrg> {
  const user = await requireUser();
  return { user, ...(await currentOrgFor(user.id)) };
}

/** For pages and layouts: the same, but signed-out visitors are redirected to sign-in. */
export async function getCurrentOrgOrRedirect(callbackPath = "/app"): Promise<CurrentOrg> {
  const user = await requireUserOrRedirect(callbackPath);
  return { user, ...(await currentOrgFor(user.id)) };
}

/** For actions on "the current organisation": OrgAccess with at least `role`, or 401/404/403. */
export async function requireCurrentOrg(role: Role = "viewer"): Promise<OrgAccess> {
  const { user, current } = await getCurrentOrg();
  if (!current) throw notFound("You don't belong to any organisation yet.");
  return authorizeMember(user.id, current.org.id, role);
}

/** Invitation reads: the pending list of an organisation, and what a link points at. */
import "server-only";
import { and, desc, eq, gt, isNull } from "drizzle-orm";
import { db } from "@/db";
import { invitations, organizations, users } from "@/db/schema";
import { env } from "@/lib/env";
import { invitationLinkProblem, type LinkProblem } from "./problems";
import { hashInvitationToken, verifyInvitationToken } from "./token";

/** Pending = not accepted, not revoked. Expired ones are listed too (they can be re-sent). */
export async function listOpenInvitations(orgId: string) {
  return db
    .select({
      id: invitations.id,
      email: invitations.email,
      role: invitations.role,
      expiresAt: invitations.expiresAt,
      createdAt: invitations.createdAt,
      invitedByName: users.name,
      invitedByEmail: users.email,
    })
    .from(invitations)
    .leftJoin(users, eq(users.id, invitations.invitedById))
    .where(
      and(
        eq(invitations.orgId, orgId),
        isNull(invitations.acceptedAt),
        isNull(invitations.revokedAt),
      ),
    )
    .orderBy(desc(invitations.createdAt));
}

export async function hasPendingInvitation(
  orgId: string,
  email: string,
  now = new Date(),
): Promise<boolean> {
  const rows = await db
    .select({ id: invitations.id })
    .from(invitations)
    .where(
      and(
        eq(invitations.orgId, orgId),
        eq(invitations.email, email),
        isNull(invitations.acceptedAt),
        isNull(invitations.revokedAt),
        gt(invitations.expiresAt, now),
      ),
    )
    .limit(1);
  return rows.length > 0;
}

export type InvitationPreview =
  | {
      ok: true;
      id: string;
      email: string;
      role: (typeof invitations.$inferSelect)["role"];
      orgId: string;
      orgName: string;
      inviterName: string | null;
      expiresAt: Date;
    }
  | { ok: false; problem: LinkProblem; detail: string };

/** What an invitation link points at, or why it cannot be used (for the invite page). */
export async function previewInvitation(
  token: string,
  now = new Date(),
): Promise<InvitationPreview> {
  const fail = (problem: LinkProblem): InvitationPreview => ({
    ok: false,
    problem,
    detail: invitationLinkProblem(problem).problem.detail,
  });
  const verified = verifyInvitationToken(env.AUTH_SECRET, token, now);
  if (!verified.ok) return fail(verified.problem);
  const rows = await db
    .select({ inv: invitations, orgName: organizations.name, inviterName: users.name })
    .from(invitations)
    .innerJoin(organizations, eq(organizations.id, invitations.orgId))
    .leftJoin(users, eq(users.id, invitations.invitedById))
    .where(eq(invitations.tokenHash, hashInvitationToken(token)))
    .limit(1);
  const row = rows[0];
  if (!row || row.inv.id !== verified.invitationId) return fail("unknown");
  if (row.inv.acceptedAt) return fail("used");
  if (row.inv.revokedAt) return fail("revoked");
  if (row.inv.expiresAt <= now) return fail("expired");
  return {
    ok: true,
    id: row.inv.id,
    email: row.inv.email,
    role: row.inv.role,
    orgId: row.inv.orgId,
    orgName: row.orgName,
    inviterName: row.inviterName,
    expiresAt: row.inv.expiresAt,
  };
}

/**
 * Invitation writes. Creating and re-sending lock the organisation row, count
 * seats (members + pending invitations) against the limit, store only the
 * token's hash, record the audit event and send the e-mail — all inside one
 * transaction, so a refused e-mail leaves no invitation behind. Accepting
 * locks the invitation row, so a link used twice in parallel joins once.
 */
import "server-only";
import { and, eq, gt, isNull } from "drizzle-orm";
import { db, type Tx } from "@/db";
import { invitations, memberships, users, type Invitation } from "@/db/schema";
import { conflict, notFound } from "@/lib/api/problem";
import type { OrgAccess } from "@/lib/auth/guards";
import { getUserById } from "@/lib/auth/queries";
import { getPlan } from "@/lib/billing/plans";
import { env } from "@/lib/env";
import { invitationMail } from "@/lib/mail/templates";
import { sendMail } from "@/lib/mail/transport";
import { getSeatUsage, lockOrganization } from "@/lib/members/seats";
import { recordAuditEvent } from "@/lib/orgs/mutations";
import { ROLE_LABELS } from "@/lib/orgs/roles";
import { invitationLinkProblem, seatsExhausted, wrongRecipient } from "./problems";
import type { InviteInput } from "./schemas";
import {
  hashInvitationToken,
  invitationExpiry,
  signInvitationToken,
  verifyInvitationToken,
} from "./token";
import { formatDateTime } from "@/lib/format";

export function invitationUrl(token: string): string {
  return `${env.APP_URL.replace(/\/$/, "")}/invite/${token}`;
}

const formatExpiry = (d: Date) => formatDateTime(d, { long: true, zone: true });

async function assertSeatFree(tx: Tx, orgId: string, now: Date) {
  const org = await lockOrganization(tx, orgId);
  if (!org) throw notFound();
  const seats = await getSeatUsage(org, tx, now);
  if (seats.used >= seats.limit) throw seatsExhausted(getPlan(org.plan), seats, seats.paid);
  return org;
}

async function issueAndSend(
  tx: Tx,
  access: OrgAccess,
  invitation: Pick<Invitation, "id" | "email" | "role">,
  now: Date,
) {
  const expiresAt = invitationExpiry(now);
  const token = signInvitationToken(env.AUTH_SECRET, invitation.id, expiresAt);
  await tx
    .update(invitations)
    .set({ tokenHash: hashInvitationToken(token), expiresAt })
    .where(eq(invitations.id, invitation.id));
  const inviter = await getUserById(access.userId);
  const mail = invitationMail({
    orgName: access.org.name,
    inviterName: inviter?.name ?? inviter?.email ?? "An admin",
    roleLabel: ROLE_LABELS[invitation.role],
    url: invitationUrl(token),
    expires: formatExpiry(expiresAt),
  });
  await sendMail({ to: invitation.email, ...mail });
  return { token, expiresAt };
}

export async function createInvitation(access: OrgAccess, input: InviteInput, now = new Date()) {
  return db.transaction(async (tx) => {
    if (!(await lockOrganization(tx, access.org.id))) throw notFound();
    const member = await tx
      .select({ id: memberships.id })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.orgId, access.org.id), eq(users.email, input.email)))
      .limit(1);
    if (member.length)
      throw conflict(`${input.email} is already a member.`, [
        { path: "email", message: "Already a member of this organisation." },
      ]);
    const pending = await tx
      .select({ id: invitations.id })
      .from(invitations)
      .where(
        and(
          eq(invitations.orgId, access.org.id),
          eq(invitations.email, input.email),
          isNull(invitations.acceptedAt),
          isNull(invitations.revokedAt),
          gt(invitations.expiresAt, now),
        ),
      )
      .limit(1);
    if (pending.length) {
      throw conflict(
        `${input.email} already has a pending invitation. Re-send it from the list below.`,
        [{ path: "email", message: "Already invited; use Re-send in the pending list." }],
      );
    }
    await assertSeatFree(tx, access.org.id, now);
    const id = crypto.randomUUID();
    // A placeholder hash, replaced by issueAndSend in the same transaction.
    await tx.insert(invitations).values({
      id,
      orgId: access.org.id,
      email: input.email,
      role: input.role,
      tokenHash: hashInvitationToken(`pending-${id}`),
      invitedById: access.userId,
      expiresAt: now,
    });
    await recordAuditEvent(
      access.org.id,
      {
        action: "invitation.created",
        actorUserId: access.userId,
        targetType: "invitation",
        targetId: id,
        metadata: { email: input.email, role: input.role },
      },
      tx,
    );
    const issued = await issueAndSend(
      tx,
      access,
      { id, email: input.email, role: input.role },
      now,
    );
    return { id, ...issued };
  });
}

async function lockOpenInvitation(tx: Tx, orgId: string, invitationId: string) {
  const rows = await tx
    .select()
    .from(invitations)
    .where(and(eq(invitations.id, invitationId), eq(invitations.orgId, orgId)))
    .for("update");
  const row = rows[0];
  if (!row) throw notFound("No such invitation in this organisation.");
  if (row.acceptedAt) throw conflict(`${row.email} has already accepted this invitation.`);
  if (row.revokedAt)
    throw conflict(`This invitation was revoked. Invite ${row.email} again instead.`);
  return row;
}

/** Sends a fresh link (new token, new expiry); the old link stops working. */
export async function resendInvitation(access: OrgAccess, invitationId: string, now = new Date()) {
  return db.transaction(async (tx) => {
    const row = await lockOpenInvitation(tx, access.org.id, invitationId);
    // An expired invitation holds no seat, so renewing it needs a free one.
    if (row.expiresAt <= now) await assertSeatFree(tx, access.org.id, now);
    await recordAuditEvent(
      access.org.id,
      {
        action: "invitation.resent",
        actorUserId: access.userId,
        targetType: "invitation",
        targetId: row.id,
        metadata: { email: row.email },
      },
      tx,
    );
    const issued = await issueAndSend(tx, access, row, now);
    return { email: row.email, ...issued };
  });
}

export async function revokeInvitation(access: OrgAccess, invitationId: string) {
  return db.transaction(async (tx) => {
    const row = await lockOpenInvitation(tx, access.org.id, invitationId);
    await tx.update(invitations).set({ revokedAt: new Date() }).where(eq(invitations.id, row.id));
    await recordAuditEvent(
      access.org.id,
      {
        action: "invitation.revoked",
        actorUserId: access.userId,
        targetType: "invitation",
        targetId: row.id,
        metadata: { email: row.email },
      },
      tx,
    );
    return { email: row.email };
  });
}

/**
 * Accepts an invitation for a signed-in user whose e-mail matches it: creates
 * the membership with the invited role and marks the invitation used.
 */
export async function acceptInvitation(
  token: string,
  user: { id: string; email: string | null },
  now = new Date(),
) {
  const verified = verifyInvitationToken(env.AUTH_SECRET, token, now);
  if (!verified.ok) throw invitationLinkProblem(verified.problem);
  return db.transaction(async (tx) => {
    const rows = await tx
      .select()
      .from(invitations)
      .where(eq(invitations.tokenHash, hashInvitationToken(token)))
      .for("update");
    const row = rows[0];
    if (!row || row.id !== verified.invitationId) throw invitationLinkProblem("unknown");
    if (row.acceptedAt) throw invitationLinkProblem("used");
    if (row.revokedAt) throw invitationLinkProblem("revoked");
    if (row.expiresAt <= now) throw invitationLinkProblem("expired");
    if (!user.email || user.email.toLowerCase() !== row.email.toLowerCase())
      throw wrongRecipient(row.email, user.email);
    const existing = await tx
      .select({ id: memberships.id })
      .from(memberships)
      .where(and(eq(memberships.orgId, row.orgId), eq(memberships.userId, user.id)))
      .limit(1);
    if (existing.length) throw conflict("You are already a member of this organisation.");
    await tx.insert(memberships).values({ orgId: row.orgId, userId: user.id, role: row.role });
    await tx.update(invitations).set({ acceptedAt: now }).where(eq(invitations.id, row.id));
    await recordAuditEvent(
      row.orgId,
      {
        action: "invitation.accepted",
        actorUserId: user.id,
        targetType: "invitation",
        targetId: row.id,
        metadata: { email: row.email, role: row.role },
      },
      tx,
    );
    return { orgId: row.orgId, role: row.role };
  });
}

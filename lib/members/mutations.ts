/**
 * Member changes, each in one transaction that locks the organisation's
 * membership rows first, so two admins acting at once cannot remove the last
 * owner between them. Rules (roles are cumulative: viewer < member < admin < owner):
 *   - only an owner may change or remove another owner;
 *   - the last owner can be neither demoted nor removed;
 *   - ownership moves only by an explicit transfer (new owner, old owner → admin);
 *   - a removed member's personal API keys are revoked with the membership.
 */
import "server-only";
import { and, eq, isNull } from "drizzle-orm";
import { db, type Executor, type Tx } from "@/db";
import { apiKeys, memberships, users } from "@/db/schema";
import { conflict, forbidden, notFound } from "@/lib/api/problem";
import type { OrgAccess } from "@/lib/auth/guards";
import { recordAuditEvent } from "@/lib/orgs/mutations";
import { ROLE_LABELS, roleAtLeast, type Role } from "@/lib/orgs/roles";
import type { AssignableRole } from "./schemas";

async function lockMembers(tx: Tx, orgId: string) {
  return tx
    .select({
      userId: memberships.userId,
      role: memberships.role,
      email: users.email,
      name: users.name,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.orgId, orgId))
    .for("update");
}

type Locked = Awaited<ReturnType<typeof lockMembers>>;

function targetOf(members: Locked, userId: string) {
  const target = members.find((m) => m.userId === userId);
  if (!target) throw notFound("That person is not a member of this organisation.");
  return target;
}

function guardOwner(access: OrgAccess, members: Locked, target: Locked[number], verb: string) {
  if (target.role !== "owner") return;
  if (access.role !== "owner") throw forbidden(`Only an owner can ${verb} an owner.`);
  if (members.filter((m) => m.role === "owner").length <= 1) {
    throw conflict(
      `${target.name ?? target.email} is the last owner. Transfer ownership to someone else first.`,
    );
  }
}

export async function changeMemberRole(access: OrgAccess, userId: string, role: AssignableRole) {
  return db.transaction(async (tx) => {
    const members = await lockMembers(tx, access.org.id);
    const target = targetOf(members, userId);
    if (target.role === role) return { changed: false, target };
    guardOwner(access, members, target, "change the role of");
    await tx
      .update(memberships)
      .set({ role })
      .where(and(eq(memberships.orgId, access.org.id), eq(memberships.userId, userId)));
    await auditKeysOfCreator(tx, access, userId, role);
    await recordAuditEvent(
      access.org.id,
      {
        action: "member.role_changed",
        actorUserId: access.userId,
        targetType: "user",
        targetId: userId,
        metadata: { email: target.email, from: target.role, to: role },
      },
      tx,
    );
    return { changed: true, target };
  });
}

/**
 * Keys act with the lower of their role and their creator's current role
 * (lib/api-keys/effective-role.ts). When a member is demoted below one of
 * their active keys, or leaves, each such key gets an audit entry saying it is
 * now capped or disabled (`newRole` null = no longer a member).
 */
async function auditKeysOfCreator(tx: Tx, access: OrgAccess, userId: string, newRole: Role | null) {
  const keys = await tx
    .select({
      id: apiKeys.id,
      name: apiKeys.name,
      prefix: apiKeys.prefix,
      role: apiKeys.role,
      scope: apiKeys.scope,
    })
    .from(apiKeys)
    .where(
      and(
        eq(apiKeys.orgId, access.org.id),
        eq(apiKeys.createdById, userId),
        isNull(apiKeys.revokedAt),
      ),
    );
  for (const key of keys) {
    if (newRole && roleAtLeast(newRole, key.role)) continue;
    await recordAuditEvent(
      access.org.id,
      {
        action: newRole ? "api_key.capped" : "api_key.disabled",
        actorUserId: access.userId,
        targetType: "api_key",
        targetId: key.id,
        metadata: {
          name: key.name,
          prefix: key.prefix,
          scope: key.scope,
          keyRole: key.role,
          ...(newRole ? { actsAs: newRole } : {}),
        },
      },
      tx,
    );
  }
}

/** Revokes the personal keys one user holds in one organisation (organisation keys stay). */
export async function revokePersonalKeys(
  executor: Executor,
  orgId: string,
  userId: string,
): Promise<number> {
  const [result] = await executor
    .update(apiKeys)
    .set({ revokedAt: new Date() })
    .where(
      and(
        eq(apiKeys.orgId, orgId),
        eq(apiKeys.createdById, userId),
        eq(apiKeys.scope, "personal"),
        isNull(apiKeys.revokedAt),
      ),
    );
  return result.affectedRows;
}

export async function removeMember(access: OrgAccess, userId: string) {
  return db.transaction(async (tx) => {
    const members = await lockMembers(tx, access.org.id);
    const target = targetOf(members, userId);
    guardOwner(access, members, target, "remove");
    await tx
      .delete(memberships)
      .where(and(eq(memberships.orgId, access.org.id), eq(memberships.userId, userId)));
    const revokedKeys = await revokePersonalKeys(tx, access.org.id, userId);
    await auditKeysOfCreator(tx, access, userId, null);
    await recordAuditEvent(
      access.org.id,
      {
        action: "member.removed",
        actorUserId: access.userId,
        targetType: "user",
        targetId: userId,
        metadata: {
          email: target.email,
          role: target.role,
          revokedKeys,
          self: userId === access.userId,
        },
      },
      tx,
    );
    return { target, revokedKeys };
  });
}

/** Makes `userId` an owner and the acting owner an admin. */
export async function transferOwnership(access: OrgAccess, userId: string) {
  if (access.role !== "owner") throw forbidden("Only an owner can transfer ownership.");
  if (userId === access.userId)
    throw conflict("You already own this organisation; choose another member.");
  return db.transaction(async (tx) => {
    const members = await lockMembers(tx, access.org.id);
    const target = targetOf(members, userId);
    const me = targetOf(members, access.userId);
    if (me.role !== "owner") throw forbidden("Only an owner can transfer ownership.");
    if (target.role === "owner")
      throw conflict(`${target.name ?? target.email} is already an owner.`);
    const setRole = (id: string, role: Role) =>
      tx
        .update(memberships)
        .set({ role })
        .where(and(eq(memberships.orgId, access.org.id), eq(memberships.userId, id)));
    await setRole(userId, "owner");
    await setRole(access.userId, "admin");
    await recordAuditEvent(
      access.org.id,
      {
        action: "org.ownership_transferred",
        actorUserId: access.userId,
        targetType: "user",
        targetId: userId,
        metadata: { email: target.email, previousRole: target.role, formerOwnerNowRole: "admin" },
      },
      tx,
    );
    return { target };
  });
}

export function describeRole(role: Role): string {
  return ROLE_LABELS[role];
}

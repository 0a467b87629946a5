/**
 * Reads for organisations, memberships, API keys and the audit trail.
 * Every tenant-data read takes the organisation id; the two lookups that
 * establish tenancy (a user's memberships, an API key by its hash) say so.
 */
import "server-only";
import { and, asc, desc, eq, isNull } from "drizzle-orm";
import { db } from "@/db";
import { apiKeys, auditEvents, memberships, organizations, users } from "@/db/schema";
import type { Role } from "./roles";

export type OrgSummary = { id: string; name: string; slug: string; plan: string };
export type MembershipWithOrg = { org: OrgSummary; role: Role };

const orgSummary = {
  id: organizations.id,
  name: organizations.name,
  slug: organizations.slug,
  plan: organizations.plan,
};

/** The user's role in the organisation, with the organisation; null when not a member. */
export async function getMembership(
  orgId: string,
  userId: string,
): Promise<MembershipWithOrg | null> {
  const rows = await db
    .select({ org: orgSummary, role: memberships.role })
    .from(memberships)
    .innerJoin(organizations, eq(organizations.id, memberships.orgId))
    .where(and(eq(memberships.orgId, orgId), eq(memberships.userId, userId)))
    .limit(1);
  return rows[0] ?? null;
}

/** Tenancy lookup: every organisation the user belongs to, oldest membership first. */
export async function listMembershipsForUser(userId: string): Promise<MembershipWithOrg[]> {
  return db
    .select({ org: orgSummary, role: memberships.role })
    .from(memberships)
    .innerJoin(organizations, eq(organizations.id, memberships.orgId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(memberships.createdAt), asc(organizations.name));
}

export async function getOrganization(orgId: string) {
  const rows = await db.select().from(organizations).where(eq(organizations.id, orgId)).limit(1);
  return rows[0] ?? null;
}

export async function listMembers(orgId: string) {
  return db
    .select({
      userId: users.id,
      name: users.name,
      email: users.email,
      role: memberships.role,
      joinedAt: memberships.createdAt,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.orgId, orgId))
    .orderBy(asc(memberships.createdAt));
}

export async function countMembers(orgId: string): Promise<number> {
  const rows = await db
    .select({ id: memberships.id })
    .from(memberships)
    .where(eq(memberships.orgId, orgId));
  return rows.length;
}

/**
 * Tenancy lookup: an unrevoked API key by the SHA-256 of the presented key,
 * with its organisation and its creator's current role there (null when the
 * creator is no longer a member).
 */
export async function findActiveApiKeyByHash(hash: string) {
  const rows = await db
    .select({ key: apiKeys, org: organizations, creatorRole: memberships.role })
    .from(apiKeys)
    .innerJoin(organizations, eq(organizations.id, apiKeys.orgId))
    .leftJoin(
      memberships,
      and(eq(memberships.orgId, apiKeys.orgId), eq(memberships.userId, apiKeys.createdById)),
    )
    .where(and(eq(apiKeys.hash, hash), isNull(apiKeys.revokedAt)))
    .limit(1);
  return rows[0] ?? null;
}

export async function listApiKeys(orgId: string) {
  return db
    .select({
      id: apiKeys.id,
      name: apiKeys.name,
      prefix: apiKeys.prefix,
      role: apiKeys.role,
      createdById: apiKeys.createdById,
      lastUsedAt: apiKeys.lastUsedAt,
      revokedAt: apiKeys.revokedAt,
      createdAt: apiKeys.createdAt,
    })
    .from(apiKeys)
    .where(eq(apiKeys.orgId, orgId))
    .orderBy(desc(apiKeys.createdAt));
}

export async function listAuditEvents(orgId: string, limit = 50) {
  return db
    .select()
    .from(auditEvents)
    .where(eq(auditEvents.orgId, orgId))
    .orderBy(desc(auditEvents.createdAt), desc(auditEvents.id))
    .limit(limit);
}

/** API keys as the API-keys page lists them: admins see every key, others their own personal keys. */
import "server-only";
import { and, desc, eq } from "drizzle-orm";
import { db } from "@/db";
import { apiKeys, memberships, users } from "@/db/schema";
import { roleAtLeast, type Role } from "@/lib/orgs/roles";

export async function listVisibleKeys(orgId: string, viewer: { userId: string; role: Role }) {
  const scope = roleAtLeast(viewer.role, "admin")
    ? eq(apiKeys.orgId, orgId)
    : and(
        eq(apiKeys.orgId, orgId),
        eq(apiKeys.createdById, viewer.userId),
        eq(apiKeys.scope, "personal"),
      );
  return db
    .select({
      id: apiKeys.id,
      name: apiKeys.name,
      prefix: apiKeys.prefix,
      role: apiKeys.role,
      scope: apiKeys.scope,
      createdById: apiKeys.createdById,
      createdByName: users.name,
      createdByEmail: users.email,
      /** The creator's current role here; null when they are no longer a member (the key is then disabled). */
      creatorRole: memberships.role,
      lastUsedAt: apiKeys.lastUsedAt,
      revokedAt: apiKeys.revokedAt,
      createdAt: apiKeys.createdAt,
    })
    .from(apiKeys)
    .leftJoin(users, eq(users.id, apiKeys.createdById))
    .leftJoin(
      memberships,
      and(eq(memberships.orgId, apiKeys.orgId), eq(memberships.userId, apiKeys.createdById)),
    )
    .where(scope)
    .orderBy(desc(apiKeys.createdAt));
}

export type VisibleKey = Awaited<ReturnType<typeof listVisibleKeys>>[number];

/**
 * The one module that writes API keys (the API-keys page, the demo seed, tests and
 * benches all create and revoke through it). The full key (`kw_<prefix>_<secret>`,
 * lib/orgs/api-key-format.ts) is returned once; only the prefix and SHA-256 of the key
 * are stored. Creation and revocation are audited in the same transaction.
 */
import "server-only";
import { and, eq, isNull } from "drizzle-orm";
import { db } from "@/db";
import { apiKeys } from "@/db/schema";
import { forbidden, notFound } from "@/lib/api/problem";
import type { OrgAccess } from "@/lib/auth/guards";
import { generateApiKey } from "@/lib/orgs/api-key-format";
import { recordAuditEvent } from "@/lib/orgs/mutations";
import { ROLE_LABELS, roleAtLeast } from "@/lib/orgs/roles";
import type { CreateApiKeyInput } from "./schemas";

/** A key acting for `access` (at most its role; organisation keys need an admin). */
export async function createKey(access: OrgAccess, input: CreateApiKeyInput) {
  if (!roleAtLeast(access.role, input.role)) {
    throw forbidden(
      `A key cannot have more rights than you: you are ${ROLE_LABELS[access.role]}, the key asks for ${ROLE_LABELS[input.role]}.`,
    );
  }
  if (input.scope === "organization" && !roleAtLeast(access.role, "admin")) {
    throw forbidden("Only admins can create organisation keys; create a personal key instead.");
  }
  const { key, prefix, hash } = generateApiKey();
  const id = crypto.randomUUID();
  await db.transaction(async (tx) => {
    await tx.insert(apiKeys).values({
      id,
      orgId: access.org.id,
      name: input.name,
      prefix,
      hash,
      role: input.role,
      scope: input.scope,
      createdById: access.userId,
    });
    await recordAuditEvent(
      access.org.id,
      {
        action: "api_key.created",
        actorUserId: access.userId,
        targetType: "api_key",
        targetId: id,
        metadata: { name: input.name, prefix, role: input.role, scope: input.scope },
      },
      tx,
    );
  });
  return { id, key, prefix };
}

/** Admins revoke any key of the organisation; others only their own personal keys. */
export async function revokeKey(access: OrgAccess, keyId: string) {
  return db.transaction(async (tx) => {
    const rows = await tx
      .select()
      .from(apiKeys)
      .where(and(eq(apiKeys.id, keyId), eq(apiKeys.orgId, access.org.id)))
      .for("update");
    const key = rows[0];
    if (!key) throw notFound("No such API key in this organisation.");
    const own = key.createdById === access.userId && key.scope === "personal";
    if (!own && !roleAtLeast(access.role, "admin"))
      throw forbidden("You can revoke only your own personal keys; ask an admin for this one.");
    if (key.revokedAt) return { key, changed: false };
    await tx
      .update(apiKeys)
      .set({ revokedAt: new Date() })
      .where(and(eq(apiKeys.id, keyId), isNull(apiKeys.revokedAt)));
    await recordAuditEvent(
      access.org.id,
      {
        action: "api_key.revoked",
        actorUserId: access.userId,
        targetType: "api_key",
        targetId: keyId,
        metadata: { name: key.name, prefix: key.prefix },
      },
      tx,
    );
    return { key, changed: true };
  });
}

/** Marks a key as used now (best effort, at most once a minute per key is enough). */
export async function touchApiKey(orgId: string, keyId: string): Promise<void> {
  await db
    .update(apiKeys)
    .set({ lastUsedAt: new Date() })
    .where(and(eq(apiKeys.orgId, orgId), eq(apiKeys.id, keyId)));
}

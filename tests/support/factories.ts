/**
 * Test data for integration tests, made through the app's own data-access
 * layer against the real test database. Every call uses fresh unique names,
 * so test files never depend on each other or on order.
 *
 *   const { user, orgId } = await createUserWithOrg();           // owner of a new org
 *   await addMember(orgId, other.id, "viewer");
 *   const { key } = await createTestApiKey(orgId, "member");     // "kw_…" for Authorization
 *   const cookie = await sessionCookie(user.id);                 // "authjs.session-token=…"
 */
import { encode } from "next-auth/jwt";
import { db } from "@/db";
import { and, asc, eq } from "drizzle-orm";
import { memberships, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { startServerSession } from "@/lib/auth/server-sessions";
import { createKey } from "@/lib/api-keys/mutations";
import { KEY_ROLES } from "@/lib/api-keys/schemas";
import { authorizeMember } from "@/lib/auth/guards";
import { createOrganization, upsertMembership } from "@/lib/orgs/mutations";
import type { Role } from "@/lib/orgs/roles";

export const TEST_PASSWORD = "correct horse battery";
let passwordHash: Promise<string> | undefined;

export function uniqueSuffix(): string {
  return `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 8)}`;
}

export function uniqueEmail(label = "user"): string {
  return `${label}-${uniqueSuffix()}@test.example`;
}

export async function createTestUser(label = "user") {
  passwordHash ??= hashPassword(TEST_PASSWORD);
  const user = { id: crypto.randomUUID(), name: `Test ${label}`, email: uniqueEmail(label) };
  // confirmed address, like an account whose sign-up link was used
  await db
    .insert(users)
    .values({ ...user, passwordHash: await passwordHash, emailVerified: new Date() });
  return user;
}

export async function createUserWithOrg(label = "owner") {
  const user = await createTestUser(label);
  const name = `Org ${uniqueSuffix()}`;
  const org = await createOrganization({ name, ownerUserId: user.id });
  return { user, orgId: org.id, slug: org.slug, name };
}

export async function addMember(orgId: string, userId: string, role: Role): Promise<void> {
  await upsertMembership(orgId, userId, role);
}

/**
 * A key of `orgId` with `role`, made by `createdById` — by default the
 * organisation's first owner (a key acts with at most its creator's role, and
 * a key without a member behind it is disabled).
 */
export async function createTestApiKey(
  orgId: string,
  role: Role,
  createdById?: string,
  scope: "personal" | "organization" = "personal",
) {
  const creator = createdById ?? (await firstOwner(orgId));
  // Through the same module as the API-keys page: the key's role is at most its creator's.
  const keyRole = KEY_ROLES.find((r) => r === role);
  if (!keyRole) throw new Error(`an API key cannot have the ${role} role`);
  return createKey(await authorizeMember(creator, orgId), {
    name: `test ${role} key`,
    role: keyRole,
    scope,
  });
}

async function firstOwner(orgId: string): Promise<string> {
  const rows = await db
    .select({ userId: memberships.userId })
    .from(memberships)
    .where(and(eq(memberships.orgId, orgId), eq(memberships.role, "owner")))
    .orderBy(asc(memberships.createdAt))
    .limit(1);
  if (!rows[0]) throw new Error(`organisation ${orgId} has no owner`);
  return rows[0].userId;
}

/** A session cookie as Auth.js would set it after sign-in (JWT with a live server-side session id, salt = cookie name). */
export async function sessionCookie(
  userId: string,
  options: { maxAgeSeconds?: number } = {},
): Promise<string> {
  const name = "authjs.session-token";
  const secret = process.env.AUTH_SECRET;
  if (!secret) throw new Error("AUTH_SECRET is not set");
  const maxAge = options.maxAgeSeconds ?? 3600;
  const sid = await startServerSession(userId, Math.max(maxAge, 60));
  const value = await encode({
    token: { sub: userId, sid },
    secret,
    salt: name,
    maxAge,
  });
  return `${name}=${value}`;
}

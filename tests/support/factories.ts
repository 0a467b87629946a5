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
import { users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { createApiKey, createOrganization, upsertMembership } from "@/lib/orgs/mutations";
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
  await db.insert(users).values({ ...user, passwordHash: await passwordHash });
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

export async function createTestApiKey(orgId: string, role: Role, createdById: string | null = null) {
  return createApiKey(orgId, { name: `test ${role} key`, role, createdById });
}

/** A session cookie as Auth.js would set it after sign-in (JWT, salt = cookie name). */
export async function sessionCookie(userId: string, options: { maxAgeSeconds?: number } = {}): Promise<string> {
  const name = "authjs.session-token";
  const secret = process.env.AUTH_SECRET;
  if (!secret) throw new Error("AUTH_SECRET is not set");
  const value = await encode({
    token: { sub: userId },
    secret,
    salt: name,
    maxAge: options.maxAgeSeconds ?? 3600,
  });
  return `${name}=${value}`;
}

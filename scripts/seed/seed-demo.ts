/**
 * Idempotent demo seed: the demo organisation, its three users with their
 * roles, then a personal organisation for each user (so the org switcher has
 * something to switch). Re-running keeps ids and resets the demo password.
 */
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { organizations, users } from "@/db/schema";
import { hashPassword, verifyPassword } from "@/lib/auth/password";
import { personalOrgName } from "@/lib/auth/sign-up";
import { createOrganization, upsertMembership } from "@/lib/orgs/mutations";
import { listMembershipsForUser } from "@/lib/orgs/queries";
import { DEMO_ORG, DEMO_PASSWORD, DEMO_USERS } from "./demo-data";

async function ensureUser(name: string, email: string, passwordHash: string): Promise<string> {
  const [existing] = await db.select().from(users).where(eq(users.email, email)).limit(1);
  if (existing) {
    if (!(await verifyPassword(DEMO_PASSWORD, existing.passwordHash))) {
      await db.update(users).set({ passwordHash }).where(eq(users.id, existing.id));
    }
    return existing.id;
  }
  const id = crypto.randomUUID();
  await db.insert(users).values({ id, name, email, passwordHash, emailVerified: new Date() });
  return id;
}

export async function seedDemo(): Promise<{ orgId: string }> {
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  const ids: string[] = [];
  for (const user of DEMO_USERS) ids.push(await ensureUser(user.name, user.email, passwordHash));
  let [org] = await db
    .select()
    .from(organizations)
    .where(eq(organizations.slug, DEMO_ORG.slug))
    .limit(1);
  if (!org) {
    await createOrganization({ name: DEMO_ORG.name, slug: DEMO_ORG.slug, ownerUserId: ids[0] });
    [org] = await db
      .select()
      .from(organizations)
      .where(eq(organizations.slug, DEMO_ORG.slug))
      .limit(1);
  }
  for (const [i, user] of DEMO_USERS.entries()) await upsertMembership(org.id, ids[i], user.role);
  // Personal organisations come after the demo one, so the demo is what opens first.
  for (const [i, user] of DEMO_USERS.entries()) {
    const memberships = await listMembershipsForUser(ids[i]);
    if (!memberships.some((m) => m.role === "owner" && m.org.slug !== DEMO_ORG.slug)) {
      await createOrganization({
        name: personalOrgName(user.name, user.email),
        ownerUserId: ids[i],
      });
    }
  }
  return { orgId: org.id };
}

/** The cluster check's organisation: Institute plan (no quota gets in the way) and a member API key. */
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { organizations, users } from "@/db/schema";
import { createKey } from "@/lib/api-keys/mutations";
import { getMembership } from "@/lib/orgs/queries";
import { createOrganization } from "@/lib/orgs/mutations";

export async function setupBenchOrg(): Promise<{ orgId: string; apiKey: string }> {
  const userId = crypto.randomUUID();
  await db
    .insert(users)
    .values({ id: userId, name: "Cluster check", email: `cluster-${userId}@cluster.example` });
  const { id: orgId } = await createOrganization({ name: "Cluster check", ownerUserId: userId });
  await db.update(organizations).set({ plan: "institute" }).where(eq(organizations.id, orgId));
  // Scripts run under plain Node: read the membership directly (the page/action guards need a request).
  const membership = await getMembership(orgId, userId);
  if (!membership) throw new Error(`${userId} is not a member of organisation ${orgId}`);
  const access = { userId: userId, ...membership };
  const { key } = await createKey(access, { name: "cluster", role: "member", scope: "personal" });
  return { orgId, apiKey: key };
}

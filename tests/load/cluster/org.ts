/** The cluster check's organisation: Institute plan (no quota gets in the way) and a member API key. */
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { organizations, users } from "@/db/schema";
import { createApiKey, createOrganization } from "@/lib/orgs/mutations";

export async function setupBenchOrg(): Promise<{ orgId: string; apiKey: string }> {
  const userId = crypto.randomUUID();
  await db
    .insert(users)
    .values({ id: userId, name: "Cluster check", email: `cluster-${userId}@cluster.example` });
  const { id: orgId } = await createOrganization({ name: "Cluster check", ownerUserId: userId });
  await db.update(organizations).set({ plan: "institute" }).where(eq(organizations.id, orgId));
  const { key } = await createApiKey(orgId, {
    name: "cluster",
    role: "member",
    createdById: userId,
  });
  return { orgId, apiKey: key };
}

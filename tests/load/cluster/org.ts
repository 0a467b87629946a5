/** The cluster check's organisation: Institute plan (no quota gets in the way) and a member API key. */
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { organizations, users } from "@/db/schema";
import { createKey } from "@/lib/api-keys/mutations";
import { authorizeMember } from "@/lib/auth/guards";
import { createOrganization } from "@/lib/orgs/mutations";

export async function setupBenchOrg(): Promise<{ orgId: string; apiKey: string }> {
  const userId = crypto.randomUUID();
  await db
    .insert(users)
    .values({ id: userId, name: "Cluster check", email: `cluster-${userId}@cluster.example` });
  const { id: orgId } = await createOrganization({ name: "Cluster check", ownerUserId: userId });
  await db.update(organizations).set({ plan: "institute" }).where(eq(organizations.id, orgId));
  const access = await authorizeMember(userId, orgId, "owner");
  const { key } = await createKey(access, { name: "cluster", role: "member", scope: "personal" });
  return { orgId, apiKey: key };
}

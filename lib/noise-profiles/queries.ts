/** Reads of the noise profiles of an organisation (every function takes the org id). */
import "server-only";
import { asc, eq } from "drizzle-orm";
import { db } from "@/db";
import { noiseProfiles } from "@/db/schema";
import type { NoiseProfileView } from "./schemas";

export async function listNoiseProfiles(orgId: string): Promise<NoiseProfileView[]> {
  const rows = await db
    .select()
    .from(noiseProfiles)
    .where(eq(noiseProfiles.orgId, orgId))
    .orderBy(asc(noiseProfiles.name));
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    noise: r.noise,
    updatedAt: r.updatedAt.toISOString(),
  }));
}

/**
 * Writes of noise profiles. Saving under an existing name replaces that profile's noise
 * model (this is how a profile is edited); a new name adds one, up to MAX_NOISE_PROFILES.
 */
import "server-only";
import { and, count, eq } from "drizzle-orm";
import { db } from "@/db";
import { noiseProfiles } from "@/db/schema";
import { conflict } from "@/lib/api/problem";
import { isDuplicateKey } from "@/lib/runs/mutations";
import { MAX_NOISE_PROFILES, type NoiseProfileInput } from "./schemas";

export async function saveNoiseProfile(
  orgId: string,
  userId: string,
  input: NoiseProfileInput,
): Promise<{ created: boolean }> {
  try {
    return await upsert(orgId, userId, input);
  } catch (error) {
    // Two saves of a new name at the same moment: the unique key keeps one.
    if (isDuplicateKey(error))
      throw conflict(
        `A profile named "${input.name}" was just saved by someone else; save again to replace it.`,
      );
    throw error;
  }
}

function upsert(
  orgId: string,
  userId: string,
  input: NoiseProfileInput,
): Promise<{ created: boolean }> {
  return db.transaction(async (tx) => {
    const [existing] = await tx
      .select({ id: noiseProfiles.id })
      .from(noiseProfiles)
      .where(and(eq(noiseProfiles.orgId, orgId), eq(noiseProfiles.name, input.name)))
      .for("update");
    if (existing) {
      await tx
        .update(noiseProfiles)
        .set({ noise: input.noise })
        .where(eq(noiseProfiles.id, existing.id));
      return { created: false };
    }
    const [{ n }] = await tx
      .select({ n: count() })
      .from(noiseProfiles)
      .where(eq(noiseProfiles.orgId, orgId));
    if (n >= MAX_NOISE_PROFILES) {
      throw conflict(
        `This organisation already keeps ${MAX_NOISE_PROFILES} noise profiles; delete one first.`,
      );
    }
    await tx
      .insert(noiseProfiles)
      .values({ orgId, createdByUserId: userId, name: input.name, noise: input.noise });
    return { created: true };
  });
}

export async function deleteNoiseProfile(orgId: string, id: string): Promise<boolean> {
  const [result] = await db
    .delete(noiseProfiles)
    .where(and(eq(noiseProfiles.orgId, orgId), eq(noiseProfiles.id, id)));
  return result.affectedRows > 0;
}

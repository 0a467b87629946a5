"use server";
/**
 * Noise profiles of the current organisation for the new-run page: list (any role), save
 * and delete (members and above). Inputs are checked with the engine's noise schema.
 */
import { requireCurrentOrg } from "@/lib/auth/guards";
import { isProblemError } from "@/lib/api/problem";
import { deleteNoiseProfile, saveNoiseProfile } from "@/lib/noise-profiles/mutations";
import { listNoiseProfiles } from "@/lib/noise-profiles/queries";
import { noiseProfileInputSchema, type NoiseProfileView } from "@/lib/noise-profiles/schemas";

export type NoiseActionAnswer = { ok: true; message: string } | { ok: false; message: string };

function failure(error: unknown, what: string): NoiseActionAnswer {
  if (isProblemError(error)) return { ok: false, message: error.problem.detail };
  console.error(`[ketwise] noise profile ${what} failed`, error);
  return { ok: false, message: `The profile could not be ${what}.` };
}

export async function listNoiseProfilesAction(): Promise<NoiseProfileView[]> {
  const access = await requireCurrentOrg("viewer");
  return listNoiseProfiles(access.org.id);
}

export async function saveNoiseProfileAction(input: unknown): Promise<NoiseActionAnswer> {
  const parsed = noiseProfileInputSchema.safeParse(input);
  if (!parsed.success)
    return {
      ok: false,
      message: parsed.error.issues
        .map((i) => `${i.path.join(".") || "profile"}: ${i.message}`)
        .join("; "),
    };
  try {
    const access = await requireCurrentOrg("member");
    const { created } = await saveNoiseProfile(access.org.id, access.userId, parsed.data);
    return {
      ok: true,
      message: created ? `Saved “${parsed.data.name}”.` : `Updated “${parsed.data.name}”.`,
    };
  } catch (error) {
    return failure(error, "saved");
  }
}

export async function deleteNoiseProfileAction(id: string): Promise<NoiseActionAnswer> {
  try {
    const access = await requireCurrentOrg("member");
    const gone = await deleteNoiseProfile(access.org.id, String(id));
    return gone
      ? { ok: true, message: "Deleted." }
      : { ok: false, message: "No such profile in this organisation." };
  } catch (error) {
    return failure(error, "deleted");
  }
}

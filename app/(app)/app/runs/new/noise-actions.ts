"use server";
/**
 * Noise profiles of the current organisation for the new-run page: list (any role), save
 * and delete (members and above). JSON actions through the one action wrapper; inputs
 * are checked with the noise-profile schemas (the engine's noise schema inside).
 */
import { z } from "zod";
import { orgAction } from "@/lib/api/action";
import { notFound } from "@/lib/api/problem";
import { deleteNoiseProfile, saveNoiseProfile } from "@/lib/noise-profiles/mutations";
import { listNoiseProfiles } from "@/lib/noise-profiles/queries";
import {
  noiseProfileIdSchema,
  noiseProfileInputSchema,
  type NoiseProfileView,
} from "@/lib/noise-profiles/schemas";

export const listNoiseProfilesAction = orgAction<z.ZodObject, NoiseProfileView[]>(
  z.strictObject({}),
  { role: "viewer", input: "json" },
  async (_input, access) => ({ status: "success", data: await listNoiseProfiles(access.org.id) }),
);

export const saveNoiseProfileAction = orgAction(
  noiseProfileInputSchema,
  { role: "member", input: "json" },
  async (input, access) => {
    const { created } = await saveNoiseProfile(access.org.id, access.userId, input);
    return {
      status: "success",
      message: created ? `Saved “${input.name}”.` : `Updated “${input.name}”.`,
    };
  },
);

export const deleteNoiseProfileAction = orgAction(
  noiseProfileIdSchema,
  { role: "member", input: "json" },
  async ({ id }, access) => {
    if (!(await deleteNoiseProfile(access.org.id, id)))
      throw notFound("No such profile in this organisation.");
    return { status: "success", message: "Deleted." };
  },
);

/**
 * A noise profile: a name and the engine's own noise model (lib/quantum/schemas.ts,
 * strict: probabilities in [0, 1], unknown fields rejected). Shared by the new-run form’s
 * server actions and their tests.
 */
import { z } from "zod";
import { noiseModelSchema } from "@/lib/quantum/schemas";
import { nameSchema } from "@/lib/validation/names";

export const NOISE_PROFILE_NAME_MAX = 80;
/** Profiles an organisation may keep (a picker, not a database). */
export const MAX_NOISE_PROFILES = 50;

export const noiseProfileInputSchema = z.strictObject({
  name: nameSchema({
    max: NOISE_PROFILE_NAME_MAX,
    empty: "give the profile a name",
    tooLong: `at most ${NOISE_PROFILE_NAME_MAX} characters`,
  }),
  noise: noiseModelSchema,
});

export type NoiseProfileInput = z.infer<typeof noiseProfileInputSchema>;

/** Which profile to delete. */
export const noiseProfileIdSchema = z.strictObject({ id: z.uuid("not a profile id") });

export type NoiseProfileView = {
  id: string;
  name: string;
  noise: NoiseProfileInput["noise"];
  updatedAt: string;
};

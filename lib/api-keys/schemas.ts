/**
 * Request shapes of the API-keys page (client-safe). A key's role is at most
 * its creator's; `organization` keys (shared automation) are for admins.
 */
import { z } from "zod";
import { nameSchema } from "@/lib/validation/names";

export const KEY_ROLES = ["viewer", "member", "admin"] as const;

export const createApiKeySchema = z.object({
  name: nameSchema({
    max: 80,
    empty: "Name the key (e.g. the notebook or pipeline that uses it).",
  }),
  role: z.enum(KEY_ROLES, { error: "Choose the key's role." }),
  scope: z
    .enum(["personal", "organization"], { error: "Choose personal or organisation key." })
    .default("personal"),
});

export const revokeApiKeySchema = z.object({ keyId: z.uuid({ error: "Choose a key." }) });

export type CreateApiKeyInput = z.infer<typeof createApiKeySchema>;

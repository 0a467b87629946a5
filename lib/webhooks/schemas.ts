/**
 * Request shapes of the webhooks settings page (client-safe): one schema per form,
 * shared by the form and its server action.
 */
import { z } from "zod";
import { isCleanName, NAME_CHARACTERS_MESSAGE } from "@/lib/validation/names";

export const createWebhookSchema = z.object({
  url: z
    .string()
    .trim()
    .min(1, "Enter the URL that receives the POSTs.")
    .max(2048, "Use at most 2,048 characters.")
    .refine(
      (v) => URL.canParse(v) && /^https?:$/.test(new URL(v).protocol),
      "Enter a full http(s) URL, e.g. https://example.com/hooks/ketwise.",
    ),
  description: z
    .string()
    .trim()
    .max(120, "Use at most 120 characters.")
    .refine(isCleanName, NAME_CHARACTERS_MESSAGE)
    .optional()
    .transform((v) => v || null),
});
export type CreateWebhookInput = z.infer<typeof createWebhookSchema>;

export const webhookEndpointIdSchema = z.object({
  endpointId: z.uuid({ error: "Choose an endpoint." }),
});

export const setWebhookEnabledSchema = webhookEndpointIdSchema.extend({
  enabled: z
    .enum(["true", "false"], { error: "Choose enable or disable." })
    .transform((v) => v === "true"),
});

/** The event every delivery carries in `type` (the only one for now). */
export const RUN_FINISHED_EVENT = "run.finished";

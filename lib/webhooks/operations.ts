/** Webhook endpoint operations of the settings page (shape: lib/api/operation.ts); admins only. */
import "server-only";
import { defineOperation } from "@/lib/api/operation";
import { createEndpoint, deleteEndpoint, setEndpointEnabled } from "./mutations";
import { createWebhookSchema, setWebhookEnabledSchema, webhookEndpointIdSchema } from "./schemas";

export type CreatedWebhook = { id: string; url: string; secret: string };

export const createWebhookOp = defineOperation({
  name: "webhook.create",
  role: "admin",
  schema: createWebhookSchema,
  run: async (input, access) => {
    const { id, secret } = await createEndpoint(access, input);
    return {
      status: "success" as const,
      message: "Copy the signing secret now: it is shown only once.",
      data: { id, url: input.url, secret } satisfies CreatedWebhook,
    };
  },
});

export const setWebhookEnabledOp = defineOperation({
  name: "webhook.set-enabled",
  role: "admin",
  schema: setWebhookEnabledSchema,
  run: async (input, access) => {
    const { endpoint, changed } = await setEndpointEnabled(access, input.endpointId, input.enabled);
    const state = input.enabled ? "enabled" : "disabled";
    return {
      status: "success",
      message: changed ? `${endpoint.url} is ${state}.` : `${endpoint.url} was already ${state}.`,
    };
  },
});

export const deleteWebhookOp = defineOperation({
  name: "webhook.delete",
  role: "admin",
  schema: webhookEndpointIdSchema,
  run: async (input, access) => {
    const endpoint = await deleteEndpoint(access, input.endpointId);
    return { status: "success", message: `${endpoint.url} was deleted with its delivery history.` };
  },
});

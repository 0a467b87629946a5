/** API-key operations (shape: lib/api/operation.ts). Members make personal keys; admins also organisation keys. */
import "server-only";
import { defineOperation } from "@/lib/api/operation";
import { createKey, revokeKey } from "./mutations";
import { createApiKeySchema, revokeApiKeySchema } from "./schemas";

export type CreatedKey = { id: string; key: string; prefix: string; name: string };

export const createApiKeyOp = defineOperation({
  name: "api-key.create",
  role: "member",
  schema: createApiKeySchema,
  run: async (input, access) => {
    const created = await createKey(access, input);
    return {
      status: "success" as const,
      message: "Copy the key now: it is shown only once.",
      data: { ...created, name: input.name } satisfies CreatedKey,
    };
  },
});

export const revokeApiKeyOp = defineOperation({
  name: "api-key.revoke",
  role: "member",
  schema: revokeApiKeySchema,
  run: async (input, access) => {
    const { key, changed } = await revokeKey(access, input.keyId);
    return {
      status: "success",
      message: changed
        ? `Key "${key.name}" (${key.prefix}) was revoked.`
        : `Key "${key.name}" was already revoked.`,
    };
  },
});

"use server";

import { createApiKeyOp, revokeApiKeyOp } from "@/lib/api-keys/operations";
import { operationAction } from "@/lib/api/operation";

export const createApiKeyAction = operationAction(createApiKeyOp, "/app/api-keys");
export const revokeApiKeyAction = operationAction(revokeApiKeyOp, "/app/api-keys");

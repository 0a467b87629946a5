"use server";

import { operationAction } from "@/lib/api/operation";
import { createWebhookOp, deleteWebhookOp, setWebhookEnabledOp } from "@/lib/webhooks/operations";

export const createWebhookAction = operationAction(createWebhookOp, "/app/webhooks");
export const setWebhookEnabledAction = operationAction(setWebhookEnabledOp, "/app/webhooks");
export const deleteWebhookAction = operationAction(deleteWebhookOp, "/app/webhooks");

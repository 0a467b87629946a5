/**
 * Admin changes to webhook endpoints, each audited in the same transaction
 * (`webhook.created|enabled|disabled|deleted`, metadata: the URL, never the secret).
 * Every query is scoped by the organisation id; another organisation's endpoint is 404.
 */
import "server-only";
import { and, eq } from "drizzle-orm";
import { db, type Tx } from "@/db";
import { webhookEndpoints, type WebhookEndpoint } from "@/db/schema";
import { notFound, validationFailed } from "@/lib/api/problem";
import type { OrgAccess } from "@/lib/auth/guards";
import { env } from "@/lib/env";
import { recordAuditEvent } from "@/lib/orgs/mutations";
import { parseNetworks } from "./address-guard";
import { checkDestination, DestinationRefused } from "./outbound";
import type { CreateWebhookInput } from "./schemas";
import { encryptSecret, generateWebhookSecret } from "./secret";

/** Endpoints one organisation may register. */
export const MAX_ENDPOINTS_PER_ORG = 10;

export function allowedNetworks() {
  return parseNetworks(env.WEBHOOK_ALLOWED_NETWORKS);
}

/** Registers an endpoint; returns its id and the signing secret (shown once, stored encrypted). */
export async function createEndpoint(
  access: OrgAccess,
  input: CreateWebhookInput,
): Promise<{ id: string; secret: string }> {
  try {
    await checkDestination(input.url, allowedNetworks());
  } catch (error) {
    if (error instanceof DestinationRefused) {
      throw validationFailed(`Ketwise cannot deliver to this URL: ${error.message}.`, [
        { path: "url", message: `Not allowed: ${error.message}.` },
      ]);
    }
    throw error;
  }
  const secret = generateWebhookSecret();
  const id = crypto.randomUUID();
  await db.transaction(async (tx) => {
    const existing = await tx
      .select({ id: webhookEndpoints.id })
      .from(webhookEndpoints)
      .where(eq(webhookEndpoints.orgId, access.org.id))
      .for("update");
    if (existing.length >= MAX_ENDPOINTS_PER_ORG) {
      throw validationFailed(
        `An organisation can register at most ${MAX_ENDPOINTS_PER_ORG} endpoints; delete one first.`,
        [{ path: "url", message: `At most ${MAX_ENDPOINTS_PER_ORG} endpoints.` }],
      );
    }
    await tx.insert(webhookEndpoints).values({
      id,
      orgId: access.org.id,
      createdByUserId: access.userId,
      url: input.url,
      description: input.description,
      secretCipher: encryptSecret(secret),
      secretPrefix: secret.slice(0, 12),
    });
    await recordAuditEvent(
      access.org.id,
      {
        action: "webhook.created",
        actorUserId: access.userId,
        targetType: "webhook",
        targetId: id,
        metadata: { url: input.url },
      },
      tx,
    );
  });
  return { id, secret };
}

async function lockedEndpoint(tx: Tx, orgId: string, endpointId: string): Promise<WebhookEndpoint> {
  const [row] = await tx
    .select()
    .from(webhookEndpoints)
    .where(and(eq(webhookEndpoints.orgId, orgId), eq(webhookEndpoints.id, endpointId)))
    .for("update");
  if (!row) throw notFound("No such webhook endpoint in this organisation.");
  return row;
}

/** Enables or disables an endpoint (a disabled one receives nothing; pending retries stop). */
export async function setEndpointEnabled(access: OrgAccess, endpointId: string, enabled: boolean) {
  return db.transaction(async (tx) => {
    const row = await lockedEndpoint(tx, access.org.id, endpointId);
    if (row.enabled === enabled) return { endpoint: row, changed: false };
    await tx
      .update(webhookEndpoints)
      .set({ enabled })
      .where(and(eq(webhookEndpoints.orgId, access.org.id), eq(webhookEndpoints.id, endpointId)));
    await recordAuditEvent(
      access.org.id,
      {
        action: enabled ? "webhook.enabled" : "webhook.disabled",
        actorUserId: access.userId,
        targetType: "webhook",
        targetId: endpointId,
        metadata: { url: row.url },
      },
      tx,
    );
    return { endpoint: { ...row, enabled }, changed: true };
  });
}

/** Deletes an endpoint with its deliveries and attempts. */
export async function deleteEndpoint(access: OrgAccess, endpointId: string) {
  return db.transaction(async (tx) => {
    const row = await lockedEndpoint(tx, access.org.id, endpointId);
    await tx
      .delete(webhookEndpoints)
      .where(and(eq(webhookEndpoints.orgId, access.org.id), eq(webhookEndpoints.id, endpointId)));
    await recordAuditEvent(
      access.org.id,
      {
        action: "webhook.deleted",
        actorUserId: access.userId,
        targetType: "webhook",
        targetId: endpointId,
        metadata: { url: row.url },
      },
      tx,
    );
    return row;
  });
}

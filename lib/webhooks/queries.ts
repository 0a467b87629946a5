/** Reads of webhook endpoints and deliveries for the settings page; every query is scoped by organisation. */
import "server-only";
import { and, desc, eq, sql } from "drizzle-orm";
import { db } from "@/db";
import { webhookDeliveries, webhookEndpoints } from "@/db/schema";

/** Endpoints, newest first, each with its latest delivery (status, attempts, last answer). */
export async function listEndpoints(orgId: string) {
  const endpoints = await db
    .select({
      id: webhookEndpoints.id,
      url: webhookEndpoints.url,
      description: webhookEndpoints.description,
      secretPrefix: webhookEndpoints.secretPrefix,
      enabled: webhookEndpoints.enabled,
      createdAt: webhookEndpoints.createdAt,
    })
    .from(webhookEndpoints)
    .where(eq(webhookEndpoints.orgId, orgId))
    .orderBy(desc(webhookEndpoints.createdAt));
  const latest = await db
    .select({
      endpointId: webhookDeliveries.endpointId,
      status: webhookDeliveries.status,
      attempts: webhookDeliveries.attempts,
      lastResponseStatus: webhookDeliveries.lastResponseStatus,
      lastError: webhookDeliveries.lastError,
      lastAttemptAt: webhookDeliveries.lastAttemptAt,
      createdAt: webhookDeliveries.createdAt,
    })
    .from(webhookDeliveries)
    .where(
      and(
        eq(webhookDeliveries.orgId, orgId),
        sql`${webhookDeliveries.createdAt} = (SELECT MAX(d2.created_at) FROM webhook_deliveries d2 WHERE d2.endpoint_id = ${webhookDeliveries.endpointId})`,
      ),
    );
  const byEndpoint = new Map(latest.map((d) => [d.endpointId, d]));
  return endpoints.map((e) => ({ ...e, lastDelivery: byEndpoint.get(e.id) ?? null }));
}

export type EndpointRow = Awaited<ReturnType<typeof listEndpoints>>[number];

/** The organisation's most recent deliveries across endpoints. */
export async function listRecentDeliveries(orgId: string, limit = 20) {
  return db
    .select({
      id: webhookDeliveries.id,
      endpointId: webhookDeliveries.endpointId,
      url: webhookEndpoints.url,
      runId: webhookDeliveries.runId,
      event: webhookDeliveries.event,
      status: webhookDeliveries.status,
      attempts: webhookDeliveries.attempts,
      lastResponseStatus: webhookDeliveries.lastResponseStatus,
      lastError: webhookDeliveries.lastError,
      lastAttemptAt: webhookDeliveries.lastAttemptAt,
      createdAt: webhookDeliveries.createdAt,
    })
    .from(webhookDeliveries)
    .innerJoin(webhookEndpoints, eq(webhookEndpoints.id, webhookDeliveries.endpointId))
    .where(eq(webhookDeliveries.orgId, orgId))
    .orderBy(desc(webhookDeliveries.createdAt))
    .limit(limit);
}

/**
 * The audit log of one organisation, newest first, filtered by action group,
 * actor and UTC day range, paged by keyset on the event id (ids grow with time).
 */
import "server-only";
import { and, desc, eq, gte, inArray, lt, sql, type SQL } from "drizzle-orm";
import { db } from "@/db";
import { apiKeys, auditEvents, users } from "@/db/schema";
import { actionsInGroup } from "./catalog";
import type { AuditFilter } from "./schemas";

export const AUDIT_PAGE_SIZE = 50;

export async function listAuditLog(orgId: string, filter: AuditFilter, limit = AUDIT_PAGE_SIZE) {
  const where: SQL[] = [eq(auditEvents.orgId, orgId)];
  if (filter.group) where.push(inArray(auditEvents.action, actionsInGroup(filter.group)));
  if (filter.actor) where.push(eq(auditEvents.actorUserId, filter.actor));
  if (filter.from) where.push(gte(auditEvents.createdAt, new Date(`${filter.from}T00:00:00Z`)));
  if (filter.to)
    where.push(
      lt(
        auditEvents.createdAt,
        new Date(new Date(`${filter.to}T00:00:00Z`).getTime() + 86_400_000),
      ),
    );
  if (filter.before) where.push(lt(auditEvents.id, filter.before));
  const rows = await db
    .select({
      id: auditEvents.id,
      action: auditEvents.action,
      actorUserId: auditEvents.actorUserId,
      actorName: users.name,
      actorEmail: users.email,
      apiKeyName: apiKeys.name,
      targetType: auditEvents.targetType,
      targetId: auditEvents.targetId,
      metadata: sql<unknown>`${auditEvents.metadata}`,
      createdAt: auditEvents.createdAt,
    })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorUserId))
    .leftJoin(apiKeys, eq(apiKeys.id, auditEvents.actorApiKeyId))
    .where(and(...where))
    .orderBy(desc(auditEvents.id))
    .limit(limit + 1);
  const page = rows.slice(0, limit).map((r) => ({ ...r, metadata: parseMetadata(r.metadata) }));
  return { events: page, nextBefore: rows.length > limit ? page[page.length - 1].id : null };
}

/** MariaDB hands JSON columns back as text. */
function parseMetadata(value: unknown): Record<string, unknown> {
  if (value && typeof value === "object") return value as Record<string, unknown>;
  if (typeof value !== "string") return {};
  try {
    const parsed = JSON.parse(value) as unknown;
    return parsed && typeof parsed === "object" ? (parsed as Record<string, unknown>) : {};
  } catch {
    return {};
  }
}

export type AuditRow = Awaited<ReturnType<typeof listAuditLog>>["events"][number];

/** Billing reads: organisations by provider id, billing contacts, and usage over a period for the chart. */
import "server-only";
import { and, eq, inArray, sql } from "drizzle-orm";
import { db } from "@/db";
import { memberships, organizations, runs, usageEvents, users } from "@/db/schema";

export async function getOrgByCustomer(customerId: string) {
  const rows = await db
    .select()
    .from(organizations)
    .where(eq(organizations.stripeCustomerId, customerId))
    .limit(1);
  return rows[0] ?? null;
}

/** Owners and admins with an e-mail address: who gets billing mail. */
export async function listBillingContacts(
  orgId: string,
): Promise<{ email: string; name: string | null }[]> {
  const rows = await db
    .select({ email: users.email, name: users.name })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.orgId, orgId), inArray(memberships.role, ["owner", "admin"])));
  return rows.filter((r): r is { email: string; name: string | null } => !!r.email);
}

export type DailyUsage = { day: string; runs: number; shots: number; simulationSeconds: number };

/**
 * Usage per UTC day of one period (`YYYY-MM`), oldest first; only days with
 * usage appear. With `userId`, only runs that person submitted (in the UI or
 * through their API keys) count — what a non-admin member sees.
 */
export async function getDailyUsage(
  orgId: string,
  period: string,
  userId?: string,
): Promise<DailyUsage[]> {
  const day = sql<string>`DATE_FORMAT(${usageEvents.createdAt}, '%Y-%m-%d')`;
  const base = db
    .select({ day, metric: usageEvents.metric, total: sql<string>`SUM(${usageEvents.quantity})` })
    .from(usageEvents);
  const where = and(eq(usageEvents.orgId, orgId), eq(usageEvents.period, period));
  const rows = userId
    ? await base
        .innerJoin(runs, eq(runs.id, usageEvents.runId))
        .where(and(where, eq(runs.createdByUserId, userId)))
        .groupBy(day, usageEvents.metric)
    : await base.where(where).groupBy(day, usageEvents.metric);
  const byDay = new Map<string, DailyUsage>();
  for (const r of rows) {
    const entry = byDay.get(r.day) ?? { day: r.day, runs: 0, shots: 0, simulationSeconds: 0 };
    const value = Number(r.total);
    if (r.metric === "runs") entry.runs = value;
    else if (r.metric === "shots") entry.shots = value;
    else entry.simulationSeconds = value;
    byDay.set(r.day, entry);
  }
  return [...byDay.values()].sort((a, b) => a.day.localeCompare(b.day));
}

/**
 * Overage reporting: once a usage period (UTC calendar month, lib/usage/period.ts)
 * is over, the shots and simulation-seconds an organisation on a paid plan used
 * above the plan's included amounts are reported to the provider as meter
 * events, once per (organisation, period, metric):
 *
 *   shots   = max(0, used − included)             (the price bills per started 1,000)
 *   seconds = max(0, ⌈used − included⌉)            (whole seconds, rounded up)
 *
 * Exactly-once in three layers: the `overage_reports` row (unique per org,
 * period, metric) fixes the quantity and the meter event's `identifier` before
 * anything is sent; the SDK call carries the same value as its idempotency key;
 * the provider counts an identifier once. A failed send leaves the row
 * `pending` (attempts, last error) and throws, so the job is retried; a `sent`
 * row is never sent again. When every metric of the period is settled the
 * period's usage rows get `reported_at`.
 * The events land on the subscription period current at the provider and are
 * billed, in arrears, on its next renewal invoice.
 */
import "server-only";
import { and, eq, inArray, isNotNull, isNull, lt, sql } from "drizzle-orm";
import { db } from "@/db";
import { organizations, overageReports, usageEvents, type OverageMetric } from "@/db/schema";
import { recordAuditEvent } from "@/lib/orgs/mutations";
import { getOrganization } from "@/lib/orgs/queries";
import { getUsageTotals } from "@/lib/usage/queries";
import { currentPeriod } from "@/lib/usage/period";
import { METER_EVENT_NAMES, ensureCatalog } from "./catalog";
import { getPlan, isPaidPlan, type Plan } from "./plans";
import { getStripe } from "./stripe-client";

export type OverageQuantities = Record<OverageMetric, number>;

/** Whole units above the plan's included amounts (0 on free plans). */
export function overageQuantities(
  plan: Plan,
  used: { shots: number; simulationSeconds: number },
): OverageQuantities {
  if (!isPaidPlan(plan)) return { shots: 0, simulation_seconds: 0 };
  return {
    shots: Math.max(0, Math.ceil(used.shots - plan.limits.monthlyShots)),
    simulation_seconds: Math.max(
      0,
      Math.ceil(used.simulationSeconds - plan.limits.monthlySimulationSeconds),
    ),
  };
}

export const overageIdentifier = (orgId: string, period: string, metric: OverageMetric) =>
  `kw-ovg-${orgId}-${period}-${metric === "shots" ? "shots" : "secs"}`;

export type OverageOutcome = {
  orgId: string;
  period: string;
  skipped?: string;
  sent: { metric: OverageMetric; quantity: number }[];
};

export async function reportOverage(orgId: string, period: string): Promise<OverageOutcome> {
  const out: OverageOutcome = { orgId, period, sent: [] };
  if (period >= currentPeriod()) return { ...out, skipped: "the period is not over yet" };
  const org = await getOrganization(orgId);
  if (!org) return { ...out, skipped: "no such organisation" };
  const plan = getPlan(org.plan);
  const markReported = () =>
    db
      .update(usageEvents)
      .set({ reportedAt: new Date() })
      .where(
        and(
          eq(usageEvents.orgId, orgId),
          eq(usageEvents.period, period),
          isNull(usageEvents.reportedAt),
        ),
      );
  if (!isPaidPlan(plan) || !org.stripeCustomerId) {
    await markReported();
    return {
      ...out,
      skipped: "not on a paid plan: Sandbox quotas are hard caps, nothing is billed",
    };
  }
  const quantities = overageQuantities(plan, await getUsageTotals(orgId, period));
  const rows = (Object.keys(quantities) as OverageMetric[])
    .filter((m) => quantities[m] > 0)
    .map((metric) => ({
      orgId,
      period,
      metric,
      quantity: quantities[metric],
      identifier: overageIdentifier(orgId, period, metric),
    }));
  if (rows.length) await db.insert(overageReports).ignore().values(rows);
  const pending = await db
    .select()
    .from(overageReports)
    .where(
      and(
        eq(overageReports.orgId, orgId),
        eq(overageReports.period, period),
        eq(overageReports.status, "pending"),
      ),
    );
  let failure: unknown = null;
  if (pending.length) await ensureCatalog();
  for (const report of pending) {
    try {
      await getStripe().billing.meterEvents.create(
        {
          event_name: METER_EVENT_NAMES[report.metric],
          payload: { stripe_customer_id: org.stripeCustomerId, value: String(report.quantity) },
          identifier: report.identifier,
        },
        { idempotencyKey: report.identifier },
      );
      await db.transaction(async (tx) => {
        await tx
          .update(overageReports)
          .set({
            status: "sent",
            sentAt: new Date(),
            attempts: sql`${overageReports.attempts} + 1`,
            lastError: null,
          })
          .where(eq(overageReports.id, report.id));
        await recordAuditEvent(
          orgId,
          {
            action: "billing.overage_reported",
            targetType: "period",
            targetId: period,
            metadata: { metric: report.metric, quantity: report.quantity, plan: plan.id },
          },
          tx,
        );
      });
      out.sent.push({ metric: report.metric, quantity: report.quantity });
    } catch (error) {
      failure ??= error;
      const message =
        error instanceof Error ? error.message.slice(0, 250) : String(error).slice(0, 250);
      await db
        .update(overageReports)
        .set({ attempts: sql`${overageReports.attempts} + 1`, lastError: message })
        .where(eq(overageReports.id, report.id));
    }
  }
  if (failure) throw failure;
  await markReported();
  return out;
}

/** (organisation, period) pairs of finished periods whose usage is not settled yet. */
export async function findUnreportedPeriods(
  limit = 200,
): Promise<{ orgId: string; period: string }[]> {
  return db
    .selectDistinct({ orgId: usageEvents.orgId, period: usageEvents.period })
    .from(usageEvents)
    .innerJoin(organizations, eq(organizations.id, usageEvents.orgId))
    .where(
      and(
        isNull(usageEvents.reportedAt),
        lt(usageEvents.period, currentPeriod()),
        inArray(usageEvents.metric, ["shots", "simulation_seconds"]),
      ),
    )
    .limit(limit);
}

/** Reports of one organisation (the billing page lists them). */
export async function listOverageReports(orgId: string) {
  return db
    .select()
    .from(overageReports)
    .where(and(eq(overageReports.orgId, orgId), isNotNull(overageReports.id)))
    .orderBy(sql`${overageReports.period} DESC`);
}

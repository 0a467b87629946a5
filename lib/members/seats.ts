/**
 * Seats: every member and every pending invitation (not accepted, not
 * revoked, not expired) uses one. The limit is the paid seat count (the
 * subscription quantity, `organizations.seats`) on paid plans — never above
 * the plan's own maximum — and the plan's fixed limit on Sandbox.
 */
import "server-only";
import { and, eq, gt, isNull, sql } from "drizzle-orm";
import { db, type Executor, type Tx } from "@/db";
import { invitations, memberships, organizations, type Organization } from "@/db/schema";
import { getPlan, isPaidPlan } from "@/lib/billing/plans";

export type SeatUsage = {
  members: number;
  pending: number;
  used: number;
  limit: number;
  paid: boolean;
};

/** Seats the organisation may fill under its plan and paid quantity. */
export function seatLimit(org: Pick<Organization, "plan" | "seats">): number {
  const plan = getPlan(org.plan);
  return isPaidPlan(plan) ? Math.min(Math.max(1, org.seats), plan.limits.seats) : plan.limits.seats;
}

async function count(executor: Executor, orgId: string, now: Date) {
  const [m] = await executor
    .select({ n: sql<number>`COUNT(*)` })
    .from(memberships)
    .where(eq(memberships.orgId, orgId));
  const [p] = await executor
    .select({ n: sql<number>`COUNT(*)` })
    .from(invitations)
    .where(
      and(
        eq(invitations.orgId, orgId),
        isNull(invitations.acceptedAt),
        isNull(invitations.revokedAt),
        gt(invitations.expiresAt, now),
      ),
    );
  return { members: Number(m.n), pending: Number(p.n) };
}

export async function getSeatUsage(
  org: Pick<Organization, "id" | "plan" | "seats">,
  executor: Executor = db,
  now = new Date(),
): Promise<SeatUsage> {
  const { members, pending } = await count(executor, org.id, now);
  return {
    members,
    pending,
    used: members + pending,
    limit: seatLimit(org),
    paid: isPaidPlan(getPlan(org.plan)),
  };
}

/** Locks the organisation row for the rest of the transaction (serialises seat checks) and returns it. */
export async function lockOrganization(tx: Tx, orgId: string): Promise<Organization | null> {
  const rows = await tx
    .select()
    .from(organizations)
    .where(eq(organizations.id, orgId))
    .for("update");
  return rows[0] ?? null;
}

/**
 * Changes to a running subscription, each one SDK call followed by
 * `applySubscription` on the provider's answer (so Ketwise's tables change
 * only after the provider accepted, in one transaction):
 *
 * - seats: the seat item's quantity. More seats are invoiced and charged at
 *   once, prorated for the rest of the period (`always_invoice`); the change is
 *   refused as a whole if that charge fails (`error_if_incomplete`). Fewer
 *   seats leave a prorated credit for the next invoice (`create_prorations`).
 * - plan (Lab ⇄ Institute): every item moves to the other plan's price, seats
 *   kept; an upgrade is charged prorated at once, a downgrade credited.
 * - to Sandbox: cancel at the end of the period (nothing is refunded; the plan
 *   stays until then); can be withdrawn until the period ends.
 */
import "server-only";
import type Stripe from "stripe";
import { conflict } from "@/lib/api/problem";
import type { OrgAccess } from "@/lib/auth/guards";
import { getSeatUsage } from "@/lib/members/seats";
import { recordAuditEvent } from "@/lib/orgs/mutations";
import { getOrganization } from "@/lib/orgs/queries";
import { ensureCatalog, type PaidPlanId } from "./catalog";
import { assertSeatsFit, hasLiveSubscription } from "./checkout";
import { getPlan, type PlanId } from "./plans";
import { withProvider } from "./provider";
import { getStripe } from "./stripe-client";
import { applySubscription, readSubscription } from "./sync";
import { plural } from "@/lib/format";

async function liveOrg(access: OrgAccess) {
  const org = await getOrganization(access.org.id);
  if (!org || !hasLiveSubscription(org))
    throw conflict("This organisation has no paid subscription; choose a plan first.");
  return { ...org, stripeSubscriptionId: org.stripeSubscriptionId! };
}

async function currentSubscription(id: string) {
  const sub = await getStripe().subscriptions.retrieve(id);
  const read = readSubscription(sub, await ensureCatalog());
  if (!read) throw conflict("The subscription has no Ketwise seat item; contact support.");
  return { sub, read };
}

export async function changeSeats(access: OrgAccess, seats: number) {
  const org = await liveOrg(access);
  await assertSeatsFit(org, org.plan, seats);
  const updated = await withProvider(async () => {
    const { read } = await currentSubscription(org.stripeSubscriptionId);
    if (read.seats === seats) return null;
    const more = seats > read.seats;
    return getStripe().subscriptions.update(org.stripeSubscriptionId, {
      items: [{ id: read.seatItemId, quantity: seats }],
      proration_behavior: more ? "always_invoice" : "create_prorations",
      ...(more ? { payment_behavior: "error_if_incomplete" as const } : {}),
    });
  });
  if (updated) await applySubscription(org.id, updated, access.userId);
  return { from: org.seats, to: seats, changed: !!updated };
}

export async function changePlan(access: OrgAccess, planId: PaidPlanId) {
  const org = await liveOrg(access);
  if (org.plan === planId) return { changed: false as const };
  const target = getPlan(planId);
  if (org.seats > target.limits.seats) {
    throw conflict(
      `The ${target.name} plan has at most ${plural(target.limits.seats, "seat")} and you pay for ${org.seats}; reduce seats first.`,
    );
  }
  const upgrade = target.seatPriceCents > getPlan(org.plan).seatPriceCents;
  const updated = await withProvider(async () => {
    const catalog = await ensureCatalog();
    const { sub } = await currentSubscription(org.stripeSubscriptionId);
    const items: Stripe.SubscriptionUpdateParams.Item[] = sub.items.data.map((item) => {
      const part = catalog.byPrice.get(item.price.id)?.part;
      return part ? { id: item.id, price: catalog.prices[planId][part] } : { id: item.id };
    });
    return getStripe().subscriptions.update(org.stripeSubscriptionId, {
      items,
      proration_behavior: upgrade ? "always_invoice" : "create_prorations",
      ...(upgrade ? { payment_behavior: "error_if_incomplete" as const } : {}),
      metadata: { plan: planId },
    });
  });
  await applySubscription(org.id, updated, access.userId);
  return { changed: true as const, from: org.plan as PlanId, to: planId };
}

/** Schedules the move to Sandbox at the period's end (or withdraws it). */
export async function setCancelAtPeriodEnd(access: OrgAccess, cancel: boolean) {
  const org = await liveOrg(access);
  if (cancel) {
    const sandbox = getPlan("sandbox");
    const usage = await getSeatUsage({ ...org, plan: "sandbox" });
    if (usage.used > sandbox.limits.seats) {
      throw conflict(
        `Sandbox allows ${plural(sandbox.limits.seats, "person", "people")} and ${plural(usage.used, "seat is", "seats are")} in use (${plural(usage.members, "member")}, ${plural(usage.pending, "pending invitation")}). Remove people or revoke invitations first.`,
      );
    }
  }
  const updated = await withProvider(() =>
    getStripe().subscriptions.update(org.stripeSubscriptionId, { cancel_at_period_end: cancel }),
  );
  await applySubscription(org.id, updated, access.userId);
  const endsAt = updated.items.data[0]?.current_period_end ?? null;
  await recordAuditEvent(org.id, {
    action: cancel ? "billing.cancel_scheduled" : "billing.cancel_withdrawn",
    actorUserId: access.userId,
    targetType: "subscription",
    targetId: updated.id,
    metadata: { plan: org.plan, periodEnd: endsAt },
  });
  return { endsAt: endsAt ? new Date(endsAt * 1000) : null };
}

/**
 * Applies the provider's view of a subscription to the organisation — plan,
 * seats (the seat item's quantity), subscription id and status — in one
 * transaction with one audit event per field that changed. Applying the same
 * subscription twice changes nothing the second time, so webhooks, the
 * checkout return page and the actions that just called the provider may all
 * call it. A subscription that has ended puts the organisation back on
 * Sandbox. Events about a subscription that is not the organisation's current
 * one (an old, replaced one) are ignored.
 */
import "server-only";
import { eq } from "drizzle-orm";
import type Stripe from "stripe";
import { db, type Tx } from "@/db";
import { organizations } from "@/db/schema";
import { lockOrganization } from "@/lib/members/seats";
import { recordAuditEvent } from "@/lib/orgs/mutations";
import { ensureCatalog, type Catalog } from "./catalog";
import { getPlan } from "./plans";

const ENDED = new Set(["canceled", "incomplete_expired"]);

export type SyncResult =
  { orgId: string; changed: string[] } | { orgId: string | null; ignored: string };

/** Plan and seats a subscription stands for, from its seat item's price. */
export function readSubscription(sub: Stripe.Subscription, catalog: Catalog) {
  for (const item of sub.items.data) {
    const known = catalog.byPrice.get(item.price.id);
    if (known?.part === "seat")
      return { plan: known.plan, seats: item.quantity ?? 1, seatItemId: item.id };
  }
  return null;
}

export async function applySubscription(
  orgId: string,
  sub: Stripe.Subscription,
  actorUserId: string | null = null,
  executor?: Tx,
): Promise<SyncResult> {
  const catalog = await ensureCatalog();
  const read = readSubscription(sub, catalog);
  const run = async (tx: Tx): Promise<SyncResult> => {
    const org = await lockOrganization(tx, orgId);
    if (!org) return { orgId: null, ignored: "no such organisation" };
    if (org.stripeSubscriptionId && org.stripeSubscriptionId !== sub.id) {
      return { orgId, ignored: `subscription ${sub.id} is not the organisation's current one` };
    }
    const ended = ENDED.has(sub.status);
    if (ended && !org.stripeSubscriptionId)
      return { orgId, ignored: "ended subscription of an organisation without one" };
    if (!ended && !read)
      return { orgId, ignored: `subscription ${sub.id} has no Ketwise seat price` };
    const customer = typeof sub.customer === "string" ? sub.customer : sub.customer.id;
    const next = ended
      ? {
          plan: "sandbox",
          seats: getPlan("sandbox").limits.seats,
          stripeSubscriptionId: null,
          subscriptionStatus: sub.status,
        }
      : {
          plan: read!.plan,
          seats: read!.seats,
          stripeSubscriptionId: sub.id,
          subscriptionStatus: sub.status,
        };
    const changed: string[] = [];
    const audit = (action: string, metadata: Record<string, unknown>) =>
      recordAuditEvent(
        orgId,
        { action, actorUserId, targetType: "subscription", targetId: sub.id, metadata },
        tx,
      );
    if (org.plan !== next.plan) {
      changed.push("plan");
      await audit("billing.plan_changed", { from: org.plan, to: next.plan });
    }
    if (org.seats !== next.seats && !ended) {
      changed.push("seats");
      await audit("billing.seats_changed", { from: org.seats, to: next.seats });
    }
    if (org.subscriptionStatus !== next.subscriptionStatus) {
      changed.push("status");
      await audit("billing.status_changed", {
        from: org.subscriptionStatus,
        to: next.subscriptionStatus,
      });
    }
    if (
      changed.length ||
      org.stripeSubscriptionId !== next.stripeSubscriptionId ||
      org.stripeCustomerId !== customer
    ) {
      await tx
        .update(organizations)
        .set({ ...next, stripeCustomerId: org.stripeCustomerId ?? customer })
        .where(eq(organizations.id, orgId));
    }
    return { orgId, changed };
  };
  return executor ? run(executor) : db.transaction(run);
}

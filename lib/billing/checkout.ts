/**
 * Moving from Sandbox to a paid plan goes through the provider's hosted
 * checkout page; Ketwise never sees a card. Steps:
 *   1. the provider customer of the organisation (created once, idempotently,
 *      its id stored on the organisation — harmless if checkout is abandoned);
 *   2. a checkout session: seats as the licensed item's quantity, plus the
 *      plan's two metered overage prices; org id as client_reference_id and
 *      metadata; back to /app/billing on success or cancel;
 *   3. the plan changes only when the provider says the subscription exists:
 *      the `checkout.session.completed` webhook, or `confirmCheckout` when the
 *      browser comes back first (both apply the same subscription, once).
 */
import "server-only";
import { and, eq, isNull } from "drizzle-orm";
import type Stripe from "stripe";
import { db } from "@/db";
import { organizations, type Organization } from "@/db/schema";
import { conflict } from "@/lib/api/problem";
import type { OrgAccess } from "@/lib/auth/guards";
import { getUserById } from "@/lib/auth/queries";
import { env } from "@/lib/env";
import { getSeatUsage } from "@/lib/members/seats";
import { recordAuditEvent } from "@/lib/orgs/mutations";
import { getOrganization } from "@/lib/orgs/queries";
import { ensureCatalog } from "./catalog";
import { getPlan } from "./plans";
import { withProvider } from "./provider";
import type { CheckoutInput } from "./schemas";
import { getStripe } from "./stripe-client";
import { applySubscription } from "./sync";
import { plural } from "@/lib/format";

export const billingUrl = (query = "") => `${env.APP_URL.replace(/\/$/, "")}/app/billing${query}`;

export function hasLiveSubscription(
  org: Pick<Organization, "stripeSubscriptionId" | "subscriptionStatus">,
): boolean {
  return (
    !!org.stripeSubscriptionId &&
    org.subscriptionStatus !== "canceled" &&
    org.subscriptionStatus !== "incomplete_expired"
  );
}

/** Seats asked for must hold everyone already in (members + pending invitations) and fit the plan. */
export async function assertSeatsFit(org: Organization, planId: string, seats: number) {
  const plan = getPlan(planId);
  const usage = await getSeatUsage(org);
  if (seats < usage.used) {
    throw conflict(
      `${plural(usage.used, "seat is", "seats are")} in use (${plural(usage.members, "member")}, ${plural(usage.pending, "pending invitation")}); choose at least ${usage.used}, or remove people first.`,
      [{ path: "seats", message: `At least ${usage.used}.` }],
    );
  }
  if (seats > plan.limits.seats) {
    throw conflict(`The ${plan.name} plan has at most ${plural(plan.limits.seats, "seat")}.`, [
      { path: "seats", message: `At most ${plan.limits.seats}.` },
    ]);
  }
  return usage;
}

async function ensureCustomer(org: Organization, email: string | null): Promise<string> {
  if (org.stripeCustomerId) return org.stripeCustomerId;
  const customer = await getStripe().customers.create(
    { name: org.name, ...(email ? { email } : {}), metadata: { orgId: org.id } },
    { idempotencyKey: `ketwise-customer-${org.id}` },
  );
  await db
    .update(organizations)
    .set({ stripeCustomerId: customer.id })
    .where(and(eq(organizations.id, org.id), isNull(organizations.stripeCustomerId)));
  return customer.id;
}

/** Creates the hosted checkout session; returns its URL for a redirect. */
export async function startCheckout(
  access: OrgAccess,
  input: CheckoutInput,
): Promise<{ url: string; sessionId: string }> {
  const org = await getOrganization(access.org.id);
  if (!org) throw conflict("The organisation no longer exists.");
  if (hasLiveSubscription(org))
    throw conflict(
      "This organisation already has a subscription; change the plan or seats below instead.",
    );
  await assertSeatsFit(org, input.plan, input.seats);
  const admin = await getUserById(access.userId);
  const session = await withProvider(async () => {
    const catalog = await ensureCatalog();
    const prices = catalog.prices[input.plan];
    const customer = await ensureCustomer(org, admin?.email ?? null);
    return getStripe().checkout.sessions.create({
      mode: "subscription",
      customer,
      client_reference_id: org.id,
      metadata: { orgId: org.id, plan: input.plan },
      subscription_data: { metadata: { orgId: org.id, plan: input.plan } },
      line_items: [
        { price: prices.seat, quantity: input.seats },
        { price: prices.shots },
        { price: prices.seconds },
      ],
      success_url: billingUrl("?checkout=success&session_id={CHECKOUT_SESSION_ID}"),
      cancel_url: billingUrl("?checkout=canceled"),
    });
  });
  if (!session.url) throw conflict("The payment provider returned no checkout page; try again.");
  await recordAuditEvent(org.id, {
    action: "billing.checkout_started",
    actorUserId: access.userId,
    targetType: "checkout_session",
    targetId: session.id,
    metadata: { plan: input.plan, seats: input.seats },
  });
  return { url: session.url, sessionId: session.id };
}

/**
 * When the browser returns from checkout: if the session belongs to this
 * organisation and is complete, apply its subscription now (the webhook will
 * find nothing left to change). Returns what the page should say.
 */
export async function confirmCheckout(
  orgId: string,
  sessionId: string,
): Promise<"applied" | "pending" | "foreign"> {
  const stripe = getStripe();
  const session = await stripe.checkout.sessions.retrieve(sessionId, { expand: ["subscription"] });
  if (session.client_reference_id !== orgId) return "foreign";
  if (session.status !== "complete" || !session.subscription) return "pending";
  await applySubscription(orgId, session.subscription as Stripe.Subscription);
  return "applied";
}

/** A provider-hosted page for the card on file and past invoices. */
export async function createPortalSession(access: OrgAccess): Promise<string> {
  const org = await getOrganization(access.org.id);
  if (!org?.stripeCustomerId)
    throw conflict("There is no billing account yet: choose a paid plan first.");
  const session = await withProvider(() =>
    getStripe().billingPortal.sessions.create({
      customer: org.stripeCustomerId!,
      return_url: billingUrl(),
    }),
  );
  return session.url;
}

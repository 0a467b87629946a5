/**
 * The provider's webhook, verified and applied once:
 *
 * 1. `webhooks.constructEvent(raw body, Stripe-Signature, secret, 300 s)`:
 *    HMAC-SHA256 over "timestamp.body"; a forged body, a wrong secret or a
 *    timestamp more than five minutes off (a replayed old delivery) → 400.
 * 2. An event id already in `billing_events` → 200 "duplicate", nothing done.
 * 3. What the event needs from the provider is fetched first (the current
 *    subscription — so deliveries arriving out of order still converge on the
 *    provider's present state); then the event id is inserted and the effects
 *    written in ONE transaction. A failure rolls both back and answers 500,
 *    and the provider delivers again later.
 * 4. Mails (payment failed, invoice available) go out after the commit.
 *
 * Handled: checkout.session.completed, customer.subscription.created|updated|
 * deleted, invoice.payment_failed, invoice.paid. Others are recorded and ignored.
 */
import "server-only";
import Stripe from "stripe";
import { db } from "@/db";
import { billingEvents } from "@/db/schema";
import { env } from "@/lib/env";
import { recordAuditEvent } from "@/lib/orgs/mutations";
import { getOrganization } from "@/lib/orgs/queries";
import { mailInvoiceAvailable, mailPaymentFailed } from "./notify";
import { getOrgByCustomer } from "./queries";
import { getStripe } from "./stripe-client";
import { applySubscription } from "./sync";
import { eq } from "drizzle-orm";

export const SIGNATURE_TOLERANCE_SECONDS = 300;
/** Largest webhook body read (provider events are a few KiB; a large invoice stays far below this). */
export const WEBHOOK_MAX_BODY_BYTES = 256 * 1024;

export type WebhookOutcome =
  | { status: 400; reason: string }
  | {
      status: 200;
      result: "applied" | "duplicate" | "ignored";
      type: string;
      id: string;
      detail?: string;
    };

type Org = { id: string; name: string };
type Plan = {
  orgId: string | null;
  apply?: (tx: Parameters<Parameters<typeof db.transaction>[0]>[0]) => Promise<void>;
  after?: () => Promise<unknown>;
  ignored?: string;
};

const idOf = (v: string | { id: string } | null | undefined) =>
  typeof v === "string" ? v : (v?.id ?? null);

async function orgForCustomer(
  customer: string | null,
  metadataOrgId?: string | null,
): Promise<Org | null> {
  const byCustomer = customer ? await getOrgByCustomer(customer) : null;
  if (byCustomer) return byCustomer;
  return metadataOrgId ? await getOrganization(metadataOrgId) : null;
}

async function subscriptionPlan(subscriptionId: string, org: Org | null): Promise<Plan> {
  if (!org) return { orgId: null, ignored: "no organisation for this customer" };
  const sub = await getStripe().subscriptions.retrieve(subscriptionId);
  return {
    orgId: org.id,
    apply: async (tx) => void (await applySubscription(org.id, sub, null, tx)),
  };
}

async function planFor(event: Stripe.Event): Promise<Plan> {
  switch (event.type) {
    case "checkout.session.completed": {
      const session = event.data.object;
      const subscription = idOf(session.subscription);
      if (session.mode !== "subscription" || !subscription)
        return { orgId: null, ignored: "not a subscription checkout" };
      const org = await orgForCustomer(
        idOf(session.customer),
        session.client_reference_id ?? session.metadata?.orgId,
      );
      return subscriptionPlan(subscription, org);
    }
    case "customer.subscription.created":
    case "customer.subscription.updated":
    case "customer.subscription.deleted": {
      const sub = event.data.object;
      return subscriptionPlan(
        sub.id,
        await orgForCustomer(idOf(sub.customer), sub.metadata?.orgId),
      );
    }
    case "invoice.payment_failed": {
      const invoice = event.data.object;
      const org = await orgForCustomer(idOf(invoice.customer));
      if (!org) return { orgId: null, ignored: "no organisation for this customer" };
      const subscription = idOf(invoice.parent?.subscription_details?.subscription);
      const sync = subscription ? await subscriptionPlan(subscription, org) : null;
      return {
        orgId: org.id,
        apply: async (tx) => {
          await sync?.apply?.(tx);
          await recordAuditEvent(
            org.id,
            {
              action: "billing.payment_failed",
              targetType: "invoice",
              targetId: invoice.id,
              metadata: {
                amountDue: invoice.amount_due,
                currency: invoice.currency,
                attempt: invoice.attempt_count,
              },
            },
            tx,
          );
        },
        after: () => mailPaymentFailed(org, invoice),
      };
    }
    case "invoice.paid": {
      const invoice = event.data.object;
      const org = await orgForCustomer(idOf(invoice.customer));
      if (!org) return { orgId: null, ignored: "no organisation for this customer" };
      if (invoice.amount_paid <= 0) return { orgId: org.id, ignored: "nothing was charged" };
      return { orgId: org.id, after: () => mailInvoiceAvailable(org, invoice) };
    }
    default:
      return { orgId: null, ignored: `event type ${event.type} is not used` };
  }
}

function isDuplicateKey(error: unknown): boolean {
  for (let e: unknown = error; e; e = (e as { cause?: unknown }).cause) {
    if ((e as { code?: string }).code === "ER_DUP_ENTRY") return true;
  }
  return false;
}

/** Verifies and applies one delivery. Throws only for faults worth a retry (answered 500). */
export async function handleBillingWebhook(
  raw: string,
  signature: string | null,
): Promise<WebhookOutcome> {
  if (!signature) return { status: 400, reason: "Missing Stripe-Signature header." };
  let event: Stripe.Event;
  try {
    event = getStripe().webhooks.constructEvent(
      raw,
      signature,
      env.STRIPE_WEBHOOK_SECRET,
      SIGNATURE_TOLERANCE_SECONDS,
    );
  } catch (error) {
    const reason =
      error instanceof Stripe.errors.StripeSignatureVerificationError
        ? error.message
        : "The payload could not be read.";
    return { status: 400, reason: `Signature verification failed: ${reason}` };
  }
  const seen = await db
    .select({ id: billingEvents.id })
    .from(billingEvents)
    .where(eq(billingEvents.id, event.id))
    .limit(1);
  if (seen.length) return { status: 200, result: "duplicate", type: event.type, id: event.id };

  const plan = await planFor(event);
  try {
    await db.transaction(async (tx) => {
      await tx.insert(billingEvents).values({ id: event.id, type: event.type, orgId: plan.orgId });
      await plan.apply?.(tx);
    });
  } catch (error) {
    if (isDuplicateKey(error))
      return { status: 200, result: "duplicate", type: event.type, id: event.id };
    throw error;
  }
  await plan
    .after?.()
    .catch((error: unknown) =>
      console.error(`[ketwise] after-effects of ${event.id} failed`, error),
    );
  return plan.ignored
    ? { status: 200, result: "ignored", type: event.type, id: event.id, detail: plan.ignored }
    : { status: 200, result: "applied", type: event.type, id: event.id };
}

/**
 * Subscription life cycle: start (first invoice, billing reason
 * `subscription_create`), monthly renewal (`subscription_cycle`: metered usage
 * of the ended period + pending prorations + seats for the new period) and
 * cancellation (at once, or at the end of the period).
 *
 * Periods are calendar months from the billing-cycle anchor (the start
 * time): period k is [anchor + k months, anchor + (k+1) months).
 */
import { addMonths } from "../core/clock";
import type { Fake } from "../core/fake";
import { newId } from "../core/ids";
import type { Metadata, SubscriptionRec } from "../core/state";
import { renderSubscription } from "../resources/render-billing";
import {
  attemptPayment,
  createDraftInvoice,
  finalizeInvoice,
  invoiceNow,
  type LineInput,
} from "./invoicing";
import { claimItems, itemLines, licensedLines, meteredLines, pendingItems } from "./lines";

export interface NewItem {
  price: string;
  quantity: number | null;
}

export function startSubscription(
  fake: Fake,
  opts: {
    customer: string;
    items: NewItem[];
    currency: string;
    defaultPaymentMethod: string | null;
    metadata: Metadata;
    description: string | null;
    /** false: leave the first invoice open without charging it. */
    charge: boolean;
  },
): SubscriptionRec {
  const now = fake.now(opts.customer);
  const sub: SubscriptionRec = {
    id: newId("sub"),
    created: now,
    customer: opts.customer,
    status: "incomplete",
    currency: opts.currency,
    items: opts.items.map((i) => ({
      id: newId("si"),
      created: now,
      price: i.price,
      quantity: i.quantity,
      metadata: {},
    })),
    billing_cycle_anchor: now,
    _period_index: 0,
    current_period_start: now,
    current_period_end: addMonths(now, 1),
    cancel_at_period_end: false,
    cancel_at: null,
    canceled_at: null,
    ended_at: null,
    cancellation_reason: null,
    cancellation_comment: null,
    cancellation_feedback: null,
    default_payment_method: opts.defaultPaymentMethod,
    latest_invoice: null,
    metadata: { ...opts.metadata },
    description: opts.description,
    start_date: now,
  };
  fake.state.subscriptions[sub.id] = sub;
  fake.emit(
    "customer.subscription.created",
    renderSubscription(fake, sub),
    undefined,
    sub.customer,
  );
  const inv = createDraftInvoice(fake, {
    customer: sub.customer,
    subscription: sub.id,
    billing_reason: "subscription_create",
    lines: [
      ...licensedLines(fake, sub, sub.current_period_start, sub.current_period_end),
      ...meteredLines(fake, sub, now, now),
    ],
    period_start: now,
    period_end: now,
    currency: sub.currency,
  });
  finalizeInvoice(fake, inv);
  if (inv.status === "open" && opts.charge) attemptPayment(fake, inv, { automatic: false });
  return sub;
}

/** Ends the subscription at `at` (fake time), optionally billing usage and pending items first. */
export function endSubscription(
  fake: Fake,
  sub: SubscriptionRec,
  opts: { at: number; reason: string; finalInvoice: boolean; extraLines?: LineInput[] },
): void {
  if (opts.finalInvoice) {
    const pending = pendingItems(fake, sub.id);
    const lines = [
      ...meteredLines(fake, sub, sub.current_period_start, opts.at),
      ...itemLines(fake, pending),
      ...(opts.extraLines ?? []),
    ];
    if (lines.some((l) => l.amount !== 0)) {
      const inv = invoiceNow(fake, {
        customer: sub.customer,
        subscription: sub.id,
        billing_reason: "subscription_cycle",
        lines,
        period_start: sub.current_period_start,
        period_end: opts.at,
        currency: sub.currency,
      });
      claimItems(pending, inv.id);
    }
  }
  const before = renderSubscription(fake, sub);
  sub.status = "canceled";
  sub.ended_at = opts.at;
  sub.canceled_at ??= opts.at;
  sub.cancellation_reason ??= opts.reason;
  fake.emit("customer.subscription.deleted", renderSubscription(fake, sub), before, sub.customer);
}

/**
 * Runs the renewal due at the end of the current period: either the
 * scheduled cancellation, or the next period with its invoice.
 */
export function renewSubscription(fake: Fake, sub: SubscriptionRec): void {
  const oldStart = sub.current_period_start;
  const oldEnd = sub.current_period_end;
  if (sub.cancel_at_period_end || (sub.cancel_at !== null && sub.cancel_at <= oldEnd)) {
    endSubscription(fake, sub, {
      at: sub.cancel_at ?? oldEnd,
      reason: "cancellation_requested",
      finalInvoice: true,
    });
    return;
  }
  const before = renderSubscription(fake, sub);
  sub._period_index += 1;
  sub.current_period_start = oldEnd;
  sub.current_period_end = addMonths(sub.billing_cycle_anchor, sub._period_index + 1);
  fake.emit("customer.subscription.updated", renderSubscription(fake, sub), before, sub.customer);

  const pending = pendingItems(fake, sub.id);
  const inv = createDraftInvoice(fake, {
    customer: sub.customer,
    subscription: sub.id,
    billing_reason: "subscription_cycle",
    lines: [
      ...meteredLines(fake, sub, oldStart, oldEnd),
      ...itemLines(fake, pending),
      ...licensedLines(fake, sub, sub.current_period_start, sub.current_period_end),
    ],
    period_start: oldStart,
    period_end: oldEnd,
    currency: sub.currency,
  });
  claimItems(pending, inv.id);
  finalizeInvoice(fake, inv);
  if (inv.status === "open") attemptPayment(fake, inv, { automatic: true });
}

/**
 * Invoice life cycle: draft → finalized (numbered, balance applied, `open`)
 * → payment attempt → `paid`, or stays `open` with a retry scheduled.
 *
 * Totals: subtotal = total = Σ line amounts (no tax or discounts here).
 * The customer's balance (negative = credit) is applied at finalization:
 * amount_due = max(0, total + starting_balance), and what is left of a
 * credit stays on the customer as ending_balance.
 *
 * Failed automatic payments are retried 3, 5 and 7 days after the previous
 * attempt; after the fourth failure the subscription is canceled.
 */
import type { Fake } from "../core/fake";
import { newId, randomText } from "../core/ids";
import type { InvoiceLineRec, InvoiceRec } from "../core/state";
import { renderCustomer } from "../resources/render-catalog";
import { renderSubscription } from "../resources/render-billing";
import { renderInvoice } from "../resources/render-invoice";
import { chargeDecline, paymentMethodFor } from "./payments";

export const RETRY_DAYS = [3, 5, 7] as const;

export type LineInput = Omit<InvoiceLineRec, "id">;

export function createDraftInvoice(
  fake: Fake,
  opts: {
    customer: string;
    subscription: string | null;
    billing_reason: string;
    lines: LineInput[];
    period_start: number;
    period_end: number;
    currency: string;
  },
): InvoiceRec {
  const customer = fake.state.customers[opts.customer];
  const now = fake.now(opts.customer);
  const lines = opts.lines.map((l) => ({ ...l, id: newId("il") }));
  const subtotal = lines.reduce((s, l) => s + l.amount, 0);
  const inv: InvoiceRec = {
    id: newId("in"),
    created: now,
    customer: opts.customer,
    customer_email: customer.email,
    customer_name: customer.name,
    subscription: opts.subscription,
    status: "draft",
    number: null,
    billing_reason: opts.billing_reason,
    currency: opts.currency,
    lines,
    period_start: opts.period_start,
    period_end: opts.period_end,
    subtotal,
    total: subtotal,
    starting_balance: 0,
    ending_balance: null,
    amount_due: subtotal,
    amount_paid: 0,
    amount_remaining: subtotal,
    attempt_count: 0,
    attempted: false,
    next_payment_attempt: null,
    finalized_at: null,
    paid_at: null,
    marked_uncollectible_at: null,
    voided_at: null,
    default_payment_method: null,
    metadata: {},
    last_payment_error: null,
    _token: randomText(32),
    _failures: 0,
  };
  fake.state.invoices[inv.id] = inv;
  if (opts.subscription) {
    const sub = fake.state.subscriptions[opts.subscription];
    if (sub) sub.latest_invoice = inv.id;
  }
  fake.emit("invoice.created", renderInvoice(fake, inv), undefined, inv.customer);
  return inv;
}

/** Numbers the invoice, applies the customer balance and opens it (or marks it paid if nothing is due). */
export function finalizeInvoice(fake: Fake, inv: InvoiceRec): void {
  const customer = fake.state.customers[inv.customer];
  const now = fake.now(inv.customer);
  const customerBefore = renderCustomer(fake, customer);
  inv.number = `${customer.invoice_prefix}-${String(customer.next_invoice_sequence).padStart(4, "0")}`;
  customer.next_invoice_sequence += 1;
  inv.starting_balance = customer.balance;
  const applied = inv.total + inv.starting_balance;
  inv.amount_due = Math.max(0, applied);
  inv.amount_remaining = inv.amount_due;
  inv.ending_balance = Math.min(0, applied);
  customer.balance = inv.ending_balance;
  inv.status = "open";
  inv.finalized_at = now;
  fake.emit("invoice.finalized", renderInvoice(fake, inv), undefined, inv.customer);
  if (customer.balance !== customerBefore.balance) {
    fake.emit("customer.updated", renderCustomer(fake, customer), customerBefore, inv.customer);
  }
  if (inv.amount_due === 0) markPaid(fake, inv, null);
}

function markPaid(fake: Fake, inv: InvoiceRec, pmId: string | null): void {
  const now = fake.now(inv.customer);
  inv.status = "paid";
  inv.amount_paid = inv.amount_due;
  inv.amount_remaining = 0;
  inv.paid_at = now;
  inv.next_payment_attempt = null;
  inv.last_payment_error = null;
  if (pmId) inv.default_payment_method = pmId;
  const json = renderInvoice(fake, inv);
  fake.emit("invoice.paid", json, undefined, inv.customer);
  fake.emit("invoice.payment_succeeded", json, undefined, inv.customer);
  settleSubscriptionStatus(fake, inv);
}

/**
 * Charges an open invoice. `automatic` attempts follow the retry schedule;
 * a manual attempt (hosted page, `invoices.pay`) does not move it. Returns
 * whether the invoice is now paid.
 */
export function attemptPayment(
  fake: Fake,
  inv: InvoiceRec,
  opts: { automatic: boolean; paymentMethod?: string },
): boolean {
  if (inv.status !== "open") return inv.status === "paid";
  const sub = inv.subscription ? fake.state.subscriptions[inv.subscription] : null;
  const pmId =
    opts.paymentMethod ?? paymentMethodFor(fake, inv.customer, sub?.default_payment_method ?? null);
  const decline = chargeDecline(fake, inv.customer, pmId);
  inv.attempted = true;
  inv.attempt_count += 1;
  if (!decline) {
    markPaid(fake, inv, pmId);
    return true;
  }
  const now = fake.now(inv.customer);
  inv.last_payment_error = decline;
  if (opts.automatic) {
    inv._failures += 1;
    const wait = RETRY_DAYS[inv._failures - 1];
    inv.next_payment_attempt = wait === undefined ? null : now + wait * 86_400;
  }
  fake.emit("invoice.payment_failed", renderInvoice(fake, inv), undefined, inv.customer);
  if (sub && sub.status === "active") {
    const before = renderSubscription(fake, sub);
    sub.status = "past_due";
    fake.emit("customer.subscription.updated", renderSubscription(fake, sub), before, sub.customer);
  }
  return false;
}

/** After a payment: a subscription with no unpaid invoice left becomes active again. */
function settleSubscriptionStatus(fake: Fake, inv: InvoiceRec): void {
  if (!inv.subscription) return;
  const sub = fake.state.subscriptions[inv.subscription];
  if (!sub || (sub.status !== "past_due" && sub.status !== "incomplete")) return;
  const unpaid = Object.values(fake.state.invoices).some(
    (i) => i.subscription === sub.id && i.status === "open" && i.attempted,
  );
  if (unpaid) return;
  const before = renderSubscription(fake, sub);
  sub.status = "active";
  fake.emit("customer.subscription.updated", renderSubscription(fake, sub), before, sub.customer);
}

/** Creates, finalizes and (if anything is due) charges an invoice in one go. */
export function invoiceNow(fake: Fake, opts: Parameters<typeof createDraftInvoice>[1]): InvoiceRec {
  const inv = createDraftInvoice(fake, opts);
  finalizeInvoice(fake, inv);
  if (inv.status === "open") attemptPayment(fake, inv, { automatic: true });
  return inv;
}

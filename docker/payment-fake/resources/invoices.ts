/**
 * Invoices: list (by customer, subscription, status), retrieve, their lines,
 * `pay` (charge an open invoice now), `void`, and `create_preview` — the
 * invoice the next renewal would produce (usage so far this period, pending
 * prorations, seats for the coming period), computed without saving.
 */
import { z } from "zod";
import { invalidRequest, noSuch } from "../core/errors";
import type { Fake } from "../core/fake";
import type { InvoiceRec } from "../core/state";
import { newestFirst, paginate } from "../http/list";
import { expand, inRange, listShape, oneOf, parseParams, rangeFilter, str } from "../http/params";
import { attemptPayment, type LineInput } from "../billing/invoicing";
import { chargeError } from "../billing/payments";
import { itemLines, licensedLines, meteredLines, pendingItems } from "../billing/lines";
import { addMonths } from "../core/clock";
import { resolvePaymentMethodParam } from "./payment-methods";
import { renderInvoice, renderInvoiceLine } from "./render-invoice";
import type { ApiRouter } from "./types";

const listSchema = z.strictObject({
  ...listShape,
  customer: z.string().optional(),
  subscription: z.string().optional(),
  status: oneOf(["draft", "open", "paid", "uncollectible", "void"] as const).optional(),
  created: rangeFilter().optional(),
});

export function getInvoiceOrThrow(fake: Fake, id: string): InvoiceRec {
  const inv = fake.state.invoices[id];
  if (!inv) throw noSuch("invoice", id);
  return inv;
}

function preview(fake: Fake, customerId: string, subscriptionId: string): InvoiceRec {
  const sub = fake.state.subscriptions[subscriptionId];
  if (!sub || sub.customer !== customerId)
    throw noSuch("subscription", subscriptionId, "subscription");
  if (sub.status === "canceled" || sub.status === "incomplete_expired") {
    throw invalidRequest(
      "No upcoming invoice: the subscription has ended.",
      "subscription",
      "invoice_upcoming_none",
    );
  }
  const now = fake.now(customerId);
  const ending =
    sub.cancel_at_period_end || (sub.cancel_at !== null && sub.cancel_at <= sub.current_period_end);
  const nextEnd = addMonths(sub.billing_cycle_anchor, sub._period_index + 2);
  const lines: LineInput[] = [
    ...meteredLines(fake, sub, sub.current_period_start, Math.min(now + 1, sub.current_period_end)),
    ...itemLines(fake, pendingItems(fake, sub.id)),
    ...(ending ? [] : licensedLines(fake, sub, sub.current_period_end, nextEnd)),
  ];
  const customer = fake.state.customers[customerId];
  const subtotal = lines.reduce((s, l) => s + l.amount, 0);
  const applied = subtotal + customer.balance;
  return {
    id: `upcoming_${sub.id}`,
    created: now,
    customer: customerId,
    customer_email: customer.email,
    customer_name: customer.name,
    subscription: sub.id,
    status: "draft",
    number: null,
    billing_reason: ending ? "subscription_cycle" : "upcoming",
    currency: sub.currency,
    lines: lines.map((l, i) => ({ ...l, id: `il_preview_${i}` })),
    period_start: sub.current_period_start,
    period_end: sub.current_period_end,
    subtotal,
    total: subtotal,
    starting_balance: customer.balance,
    ending_balance: null,
    amount_due: Math.max(0, applied),
    amount_paid: 0,
    amount_remaining: Math.max(0, applied),
    attempt_count: 0,
    attempted: false,
    next_payment_attempt: sub.current_period_end,
    finalized_at: null,
    paid_at: null,
    marked_uncollectible_at: null,
    voided_at: null,
    default_payment_method: null,
    metadata: {},
    last_payment_error: null,
    _token: "",
    _failures: 0,
  };
}

export function registerInvoices(router: ApiRouter): void {
  router.add("GET", "/v1/invoices", ({ fake, body }) => {
    const p = parseParams(listSchema, body);
    const rows = newestFirst(fake.state.invoices).filter(
      (i) =>
        (p.customer === undefined || i.customer === p.customer) &&
        (p.subscription === undefined || i.subscription === p.subscription) &&
        (p.status === undefined || i.status === p.status) &&
        inRange(i.created, p.created),
    );
    return paginate(rows, p, "/v1/invoices", (i) => renderInvoice(fake, i));
  });

  router.add("GET", "/v1/invoices/:id", ({ fake, params, body }) => {
    parseParams(z.strictObject({ expand: expand() }), body);
    return renderInvoice(fake, getInvoiceOrThrow(fake, params.id));
  });

  router.add("GET", "/v1/invoices/:id/lines", ({ fake, params, body }) => {
    const p = parseParams(z.strictObject(listShape), body);
    const inv = getInvoiceOrThrow(fake, params.id);
    return paginate(inv.lines, p, `/v1/invoices/${inv.id}/lines`, (l) =>
      renderInvoiceLine(fake, inv.id, l),
    );
  });

  router.add("POST", "/v1/invoices/:id/pay", ({ fake, params, body }) => {
    const p = parseParams(
      z.strictObject({ payment_method: z.string().optional(), expand: expand() }),
      body,
    );
    const inv = getInvoiceOrThrow(fake, params.id);
    if (inv.status === "paid") throw invalidRequest("Invoice is already paid.");
    if (inv.status !== "open")
      throw invalidRequest(`Only open invoices can be paid; this one is ${inv.status}.`);
    const pm = p.payment_method
      ? resolvePaymentMethodParam(fake, p.payment_method, "payment_method", inv.customer)
      : null;
    if (pm && !pm.customer) pm.customer = inv.customer;
    const paid = attemptPayment(fake, inv, { automatic: false, paymentMethod: pm?.id });
    if (!paid && inv.last_payment_error) throw chargeError(inv.last_payment_error);
    return renderInvoice(fake, inv);
  });

  router.add("POST", "/v1/invoices/:id/void", ({ fake, params, body }) => {
    parseParams(z.strictObject({ expand: expand() }), body);
    const inv = getInvoiceOrThrow(fake, params.id);
    if (inv.status !== "open")
      throw invalidRequest(`Only open invoices can be voided; this one is ${inv.status}.`);
    inv.status = "void";
    inv.voided_at = fake.now(inv.customer);
    inv.next_payment_attempt = null;
    fake.emit("invoice.voided", renderInvoice(fake, inv), undefined, inv.customer);
    return renderInvoice(fake, inv);
  });

  router.add("POST", "/v1/invoices/create_preview", ({ fake, body }) => {
    const p = parseParams(
      z.strictObject({ customer: z.string().optional(), subscription: str(), expand: expand() }),
      body,
    );
    const sub = fake.state.subscriptions[p.subscription];
    if (!sub) throw noSuch("subscription", p.subscription, "subscription");
    const json = renderInvoice(fake, preview(fake, p.customer ?? sub.customer, sub.id));
    return { ...json, hosted_invoice_url: null, invoice_pdf: null };
  });
}

/**
 * JSON for invoices and their lines, in the current API shape: an invoice
 * names its subscription under `parent.subscription_details`, a line names
 * its price under `pricing.price_details` and its subscription item under
 * `parent.subscription_item_details`. Drafts have no hosted URL or PDF yet.
 */
import type { Fake } from "../core/fake";
import type { InvoiceLineRec, InvoiceRec } from "../core/state";
import { priceOf } from "./render-billing";
import type { Json } from "./render-catalog";

export function renderInvoiceLine(
  fake: Fake,
  invoiceId: string | null,
  line: InvoiceLineRec,
): Json {
  const price = priceOf(fake, line.price);
  return {
    id: line.id,
    object: "line_item",
    amount: line.amount,
    currency: line.currency,
    description: line.description,
    discount_amounts: [],
    discountable: !line.proration,
    discounts: [],
    invoice: invoiceId,
    livemode: false,
    metadata: {},
    parent: line.subscription_item
      ? {
          invoice_item_details: null,
          subscription_item_details: {
            invoice_item: line.invoice_item,
            proration: line.proration,
            proration_details: { credited_items: null },
            subscription: line.subscription,
            subscription_item: line.subscription_item,
          },
          type: "subscription_item_details",
        }
      : null,
    period: { end: line.period_end, start: line.period_start },
    pretax_credit_amounts: [],
    pricing: {
      price_details: { price: price.id, product: price.product },
      type: "price_details",
      unit_amount_decimal: line.unit_amount_decimal,
    },
    quantity: line.quantity,
    subtotal: line.amount,
    taxes: [],
  };
}

export function invoiceUrls(
  fake: Fake,
  inv: InvoiceRec,
): { hosted: string | null; pdf: string | null } {
  if (inv.status === "draft") return { hosted: null, pdf: null };
  const base = `${fake.config.publicUrl}/invoice/${inv.id}/${inv._token}`;
  return { hosted: base, pdf: `${base}/pdf` };
}

export function renderInvoice(fake: Fake, inv: InvoiceRec): Json {
  const sub = inv.subscription ? fake.state.subscriptions[inv.subscription] : null;
  const urls = invoiceUrls(fake, inv);
  return {
    id: inv.id,
    object: "invoice",
    account_country: "US",
    account_name: "Ketwise (local test provider)",
    account_tax_ids: null,
    amount_due: inv.amount_due,
    amount_overpaid: 0,
    amount_paid: inv.amount_paid,
    amount_remaining: inv.amount_remaining,
    amount_shipping: 0,
    application: null,
    attempt_count: inv.attempt_count,
    attempted: inv.attempted,
    auto_advance: inv.status === "draft" || inv.status === "open",
    automatic_tax: {
      disabled_reason: null,
      enabled: false,
      liability: null,
      provider: null,
      status: null,
    },
    automatically_finalizes_at: null,
    billing_reason: inv.billing_reason,
    collection_method: "charge_automatically",
    created: inv.created,
    currency: inv.currency,
    custom_fields: null,
    customer: inv.customer,
    customer_account: null,
    customer_address: null,
    customer_email: inv.customer_email,
    customer_name: inv.customer_name,
    customer_phone: null,
    customer_shipping: null,
    customer_tax_exempt: "none",
    customer_tax_ids: [],
    default_payment_method: inv.default_payment_method,
    default_source: null,
    default_tax_rates: [],
    description: null,
    discounts: [],
    due_date: null,
    effective_at: inv.finalized_at,
    ending_balance: inv.ending_balance,
    footer: null,
    from_invoice: null,
    hosted_invoice_url: urls.hosted,
    invoice_pdf: urls.pdf,
    issuer: { type: "self" },
    last_finalization_error: null,
    latest_revision: null,
    lines: {
      object: "list",
      data: inv.lines.slice(0, 10).map((l) => renderInvoiceLine(fake, inv.id, l)),
      has_more: inv.lines.length > 10,
      total_count: inv.lines.length,
      url: `/v1/invoices/${inv.id}/lines`,
    },
    livemode: false,
    metadata: { ...inv.metadata },
    next_payment_attempt: inv.next_payment_attempt,
    number: inv.number,
    on_behalf_of: null,
    parent: inv.subscription
      ? {
          quote_details: null,
          subscription_details: {
            metadata: sub ? { ...sub.metadata } : {},
            subscription: inv.subscription,
          },
          type: "subscription_details",
        }
      : null,
    payment_settings: {
      default_mandate: null,
      payment_method_options: null,
      payment_method_types: null,
    },
    period_end: inv.period_end,
    period_start: inv.period_start,
    post_payment_credit_notes_amount: 0,
    pre_payment_credit_notes_amount: 0,
    receipt_number: null,
    rendering: null,
    shipping_cost: null,
    shipping_details: null,
    starting_balance: inv.starting_balance,
    statement_descriptor: null,
    status: inv.status,
    status_transitions: {
      finalized_at: inv.finalized_at,
      marked_uncollectible_at: inv.marked_uncollectible_at,
      paid_at: inv.paid_at,
      voided_at: inv.voided_at,
    },
    subtotal: inv.subtotal,
    subtotal_excluding_tax: inv.subtotal,
    test_clock: null,
    total: inv.total,
    total_discount_amounts: [],
    total_excluding_tax: inv.total,
    total_pretax_credit_amounts: [],
    total_taxes: [],
    webhooks_delivered_at: inv.created,
  };
}

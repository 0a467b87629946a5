/**
 * JSON for checkout sessions, subscriptions (with items) and billing-portal
 * sessions, following the current API shape the SDK v23 types describe:
 * billing periods live on subscription items. Invoices: render-invoice.ts.
 */
import type { Fake } from "../core/fake";
import type {
  CheckoutSessionRec,
  PortalSessionRec,
  PriceRec,
  SubItemRec,
  SubscriptionRec,
} from "../core/state";
import { renderPlan, renderPrice, type Json } from "./render-catalog";

export function priceOf(fake: Fake, id: string): PriceRec {
  const price = fake.state.prices[id];
  if (!price) throw new Error(`internal: price ${id} missing`);
  return price;
}

export function renderCheckoutSession(fake: Fake, s: CheckoutSessionRec): Json {
  const customer = s.customer ? fake.state.customers[s.customer] : null;
  return {
    id: s.id,
    object: "checkout.session",
    adaptive_pricing: null,
    after_expiration: null,
    allow_promotion_codes: null,
    amount_subtotal: s.amount_subtotal,
    amount_total: s.amount_total,
    automatic_tax: { enabled: false, liability: null, provider: null, status: null },
    billing_address_collection: null,
    cancel_url: s.cancel_url,
    client_reference_id: s.client_reference_id,
    client_secret: null,
    collected_information: null,
    consent: null,
    consent_collection: null,
    created: s.created,
    currency: s.currency,
    currency_conversion: null,
    custom_fields: [],
    custom_text: {
      after_submit: null,
      shipping_address: null,
      submit: null,
      terms_of_service_acceptance: null,
    },
    customer: s.customer,
    customer_account: null,
    customer_creation: s.customer ? null : "always",
    customer_details:
      s.status === "complete" && customer
        ? {
            address: null,
            email: customer.email,
            name: customer.name,
            phone: null,
            tax_exempt: "none",
            tax_ids: [],
          }
        : null,
    customer_email: s.customer_email,
    discounts: [],
    expires_at: s.expires_at,
    invoice: s.invoice,
    invoice_creation: null,
    livemode: false,
    locale: null,
    metadata: { ...s.metadata },
    mode: s.mode,
    origin_context: null,
    payment_intent: null,
    payment_link: null,
    payment_method_collection: "always",
    payment_method_configuration_details: null,
    payment_method_options: {},
    payment_method_types: ["card"],
    payment_status: s.payment_status,
    permissions: null,
    recovered_from: null,
    saved_payment_method_options: null,
    setup_intent: null,
    shipping_address_collection: null,
    shipping_cost: null,
    shipping_options: [],
    status: s.status,
    submit_type: null,
    subscription: s.subscription,
    success_url: s.success_url,
    total_details: { amount_discount: 0, amount_shipping: 0, amount_tax: 0 },
    ui_mode: "hosted",
    url: s.status === "open" ? `${fake.config.publicUrl}/pay/${s.id}` : null,
    wallet_options: null,
  };
}

/** One checkout line item (`item` objects), as in `line_items` expansions. */
export function renderCheckoutLine(
  fake: Fake,
  s: CheckoutSessionRec,
  line: CheckoutSessionRec["line_items"][number],
): Json {
  const price = priceOf(fake, line.price);
  const product = fake.state.products[price.product];
  const amount =
    price.recurring?.usage_type === "metered" ? 0 : (price.unit_amount ?? 0) * (line.quantity ?? 0);
  return {
    id: line.id,
    object: "item",
    amount_discount: 0,
    amount_subtotal: amount,
    amount_tax: 0,
    amount_total: amount,
    currency: s.currency,
    description: product?.name ?? null,
    price: renderPrice(price),
    quantity: line.quantity,
  };
}

export function renderSubscriptionItem(fake: Fake, sub: SubscriptionRec, item: SubItemRec): Json {
  const price = priceOf(fake, item.price);
  const out: Json = {
    id: item.id,
    object: "subscription_item",
    billing_thresholds: null,
    created: item.created,
    current_period_end: sub.current_period_end,
    current_period_start: sub.current_period_start,
    discounts: [],
    metadata: { ...item.metadata },
    plan: renderPlan(price),
    price: renderPrice(price),
    subscription: sub.id,
    tax_rates: [],
  };
  if (item.quantity !== null) out.quantity = item.quantity;
  return out;
}

export function renderSubscription(fake: Fake, s: SubscriptionRec): Json {
  return {
    id: s.id,
    object: "subscription",
    application: null,
    application_fee_percent: null,
    automatic_tax: { disabled_reason: null, enabled: false, liability: null },
    billing_cycle_anchor: s.billing_cycle_anchor,
    billing_cycle_anchor_config: null,
    billing_mode: { flexible: null, type: "classic" },
    billing_thresholds: null,
    cancel_at: s.cancel_at,
    cancel_at_period_end: s.cancel_at_period_end,
    canceled_at: s.canceled_at,
    cancellation_details: {
      comment: s.cancellation_comment,
      feedback: s.cancellation_feedback,
      reason: s.cancellation_reason,
    },
    collection_method: "charge_automatically",
    created: s.created,
    currency: s.currency,
    customer: s.customer,
    customer_account: null,
    days_until_due: null,
    default_payment_method: s.default_payment_method,
    default_source: null,
    default_tax_rates: [],
    description: s.description,
    discounts: [],
    ended_at: s.ended_at,
    invoice_settings: { account_tax_ids: null, issuer: { type: "self" } },
    items: {
      object: "list",
      data: s.items.map((item) => renderSubscriptionItem(fake, s, item)),
      has_more: false,
      total_count: s.items.length,
      url: `/v1/subscription_items?subscription=${s.id}`,
    },
    latest_invoice: s.latest_invoice,
    livemode: false,
    metadata: { ...s.metadata },
    next_pending_invoice_item_invoice: null,
    on_behalf_of: null,
    pause_collection: null,
    payment_settings: {
      payment_method_options: null,
      payment_method_types: null,
      save_default_payment_method: "off",
    },
    pending_invoice_item_interval: null,
    pending_setup_intent: null,
    pending_update: null,
    schedule: null,
    start_date: s.start_date,
    status: s.status,
    test_clock: null,
    transfer_data: null,
    trial_end: null,
    trial_settings: { end_behavior: { missing_payment_method: "create_invoice" } },
    trial_start: null,
  };
}

export function renderPortalSession(p: PortalSessionRec): Json {
  return {
    id: p.id,
    object: "billing_portal.session",
    configuration: "bpc_local_default",
    created: p.created,
    customer: p.customer,
    customer_account: null,
    flow: null,
    livemode: false,
    locale: null,
    on_behalf_of: null,
    return_url: p.return_url,
    url: p.url,
  };
}

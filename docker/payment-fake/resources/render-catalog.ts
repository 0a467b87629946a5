/**
 * JSON for customers, products, prices, meters and payment methods, with the
 * provider's field names and `object` tags. Fields the fake does not model are
 * present with the provider's "empty" value (null, [], false) so typed
 * clients see the shape they expect.
 */
import type { Fake } from "../core/fake";
import type { CustomerRec, MeterRec, PaymentMethodRec, PriceRec, ProductRec } from "../core/state";

export type Json = Record<string, unknown>;

export function renderCustomer(fake: Fake, c: CustomerRec): Json {
  if (c.deleted) return { id: c.id, object: "customer", deleted: true };
  const delinquent = Object.values(fake.state.invoices).some(
    (i) => i.customer === c.id && i.status === "open" && i.attempt_count > 0,
  );
  return {
    id: c.id,
    object: "customer",
    address: null,
    balance: c.balance,
    created: c.created,
    currency:
      Object.values(fake.state.subscriptions).find((s) => s.customer === c.id)?.currency ?? null,
    default_source: null,
    delinquent,
    description: c.description,
    discount: null,
    email: c.email,
    invoice_prefix: c.invoice_prefix,
    invoice_settings: {
      custom_fields: null,
      default_payment_method: c.default_payment_method,
      footer: null,
      rendering_options: null,
    },
    livemode: false,
    metadata: { ...c.metadata },
    name: c.name,
    next_invoice_sequence: c.next_invoice_sequence,
    phone: c.phone,
    preferred_locales: [],
    shipping: null,
    tax_exempt: "none",
    test_clock: null,
  };
}

export function renderProduct(p: ProductRec): Json {
  return {
    id: p.id,
    object: "product",
    active: p.active,
    created: p.created,
    default_price: p.default_price,
    description: p.description,
    images: [],
    livemode: false,
    marketing_features: [],
    metadata: { ...p.metadata },
    name: p.name,
    package_dimensions: null,
    shippable: null,
    statement_descriptor: null,
    tax_code: null,
    type: "service",
    unit_label: p.unit_label,
    updated: p.updated,
    url: null,
  };
}

export function renderPrice(p: PriceRec): Json {
  return {
    id: p.id,
    object: "price",
    active: p.active,
    billing_scheme: "per_unit",
    created: p.created,
    currency: p.currency,
    custom_unit_amount: null,
    livemode: false,
    lookup_key: p.lookup_key,
    metadata: { ...p.metadata },
    nickname: p.nickname,
    product: p.product,
    recurring: p.recurring ? { ...p.recurring, trial_period_days: null } : null,
    tax_behavior: "unspecified",
    tiers_mode: null,
    transform_quantity: p.transform_quantity ? { ...p.transform_quantity } : null,
    type: p.recurring ? "recurring" : "one_time",
    unit_amount: p.unit_amount,
    unit_amount_decimal: p.unit_amount_decimal,
  };
}

/** The legacy `plan` view of a recurring price, still part of subscription items. */
export function renderPlan(p: PriceRec): Json {
  return {
    id: p.id,
    object: "plan",
    active: p.active,
    amount: p.unit_amount,
    amount_decimal: p.unit_amount_decimal,
    billing_scheme: "per_unit",
    created: p.created,
    currency: p.currency,
    interval: p.recurring?.interval ?? "month",
    interval_count: p.recurring?.interval_count ?? 1,
    livemode: false,
    metadata: { ...p.metadata },
    meter: p.recurring?.meter ?? null,
    nickname: p.nickname,
    product: p.product,
    tiers_mode: null,
    transform_usage: p.transform_quantity ? { ...p.transform_quantity } : null,
    trial_period_days: null,
    usage_type: p.recurring?.usage_type ?? "licensed",
  };
}

export function renderMeter(m: MeterRec): Json {
  return {
    id: m.id,
    object: "billing.meter",
    created: m.created,
    customer_mapping: { event_payload_key: m.customer_key, type: "by_id" },
    default_aggregation: { formula: m.formula },
    display_name: m.display_name,
    event_name: m.event_name,
    event_time_window: null,
    livemode: false,
    status: m.status,
    status_transitions: { deactivated_at: m.deactivated_at },
    updated: m.updated,
    value_settings: { event_payload_key: m.value_key },
  };
}

export function renderPaymentMethod(pm: PaymentMethodRec): Json {
  return {
    id: pm.id,
    object: "payment_method",
    allow_redisplay: "unspecified",
    billing_details: { address: null, email: pm.email, name: pm.name, phone: null, tax_id: null },
    card: {
      brand: pm.brand,
      checks: { address_line1_check: null, address_postal_code_check: null, cvc_check: "pass" },
      country: "US",
      display_brand: pm.brand,
      exp_month: pm.exp_month,
      exp_year: pm.exp_year,
      fingerprint: pm._number.slice(-8).split("").reverse().join("") + pm.brand.slice(0, 4),
      funding: pm.funding,
      generated_from: null,
      last4: pm.last4,
      networks: { available: [pm.brand], preferred: null },
      regulated_status: "unregulated",
      three_d_secure_usage: { supported: true },
      wallet: null,
    },
    created: pm.created,
    customer: pm.customer,
    livemode: false,
    metadata: {},
    type: "card",
  };
}

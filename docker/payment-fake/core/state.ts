/**
 * The fake's whole state: plain JSON, so it can be dumped (`GET /_fake/state`)
 * and persisted to `PAYMENT_FAKE_DATA` between restarts. Records hold the
 * provider's field names; fields starting with `_` are private to the fake
 * and never rendered. Collections are id-keyed objects in insertion order, so
 * "newest first" listing is simply reverse order.
 */
import type { ClockState } from "./clock";

export type Metadata = Record<string, string>;

export interface CustomerRec {
  id: string;
  created: number;
  email: string | null;
  name: string | null;
  description: string | null;
  phone: string | null;
  metadata: Metadata;
  balance: number;
  invoice_prefix: string;
  next_invoice_sequence: number;
  default_payment_method: string | null;
  deleted?: boolean;
}

export interface ProductRec {
  id: string;
  created: number;
  updated: number;
  name: string;
  description: string | null;
  active: boolean;
  metadata: Metadata;
  default_price: string | null;
  unit_label: string | null;
}

export interface PriceRec {
  id: string;
  created: number;
  product: string;
  active: boolean;
  currency: string;
  /** Integer cents, or null when only a fractional decimal amount was given. */
  unit_amount: number | null;
  /** Cents as a decimal string (up to 12 places). */
  unit_amount_decimal: string;
  recurring: {
    interval: "month";
    interval_count: 1;
    usage_type: "licensed" | "metered";
    meter: string | null;
  } | null;
  lookup_key: string | null;
  nickname: string | null;
  metadata: Metadata;
  transform_quantity: { divide_by: number; round: "up" | "down" } | null;
}

export interface MeterRec {
  id: string;
  created: number;
  updated: number;
  display_name: string;
  event_name: string;
  status: "active" | "inactive";
  deactivated_at: number | null;
  formula: "sum" | "count" | "last";
  customer_key: string;
  value_key: string;
}

export interface MeterEventRec {
  identifier: string;
  event_name: string;
  meter: string;
  customer: string;
  value: number;
  timestamp: number;
  created: number;
  payload: Record<string, string>;
}

export interface PaymentMethodRec {
  id: string;
  created: number;
  customer: string | null;
  brand: string;
  funding: string;
  last4: string;
  exp_month: number;
  exp_year: number;
  name: string | null;
  email: string | null;
  /** The full test number, kept to decide charge outcomes. */
  _number: string;
}

export interface CheckoutLineRec {
  id: string;
  price: string;
  quantity: number | null;
}

export interface CheckoutSessionRec {
  id: string;
  created: number;
  expires_at: number;
  mode: "subscription";
  status: "open" | "complete" | "expired";
  payment_status: "unpaid" | "paid" | "no_payment_required";
  customer: string | null;
  customer_email: string | null;
  client_reference_id: string | null;
  success_url: string;
  cancel_url: string | null;
  metadata: Metadata;
  currency: string;
  line_items: CheckoutLineRec[];
  subscription_metadata: Metadata;
  subscription_description: string | null;
  subscription: string | null;
  invoice: string | null;
  amount_subtotal: number;
  amount_total: number;
}

export interface SubItemRec {
  id: string;
  created: number;
  price: string;
  /** Null for metered items (usage decides what is billed). */
  quantity: number | null;
  metadata: Metadata;
}

export type SubscriptionStatus =
  "incomplete" | "active" | "past_due" | "canceled" | "incomplete_expired";

export interface SubscriptionRec {
  id: string;
  created: number;
  customer: string;
  status: SubscriptionStatus;
  currency: string;
  items: SubItemRec[];
  billing_cycle_anchor: number;
  /** Index of the current period counted from the anchor (0 = first month). */
  _period_index: number;
  current_period_start: number;
  current_period_end: number;
  cancel_at_period_end: boolean;
  cancel_at: number | null;
  canceled_at: number | null;
  ended_at: number | null;
  cancellation_reason: string | null;
  cancellation_comment: string | null;
  cancellation_feedback: string | null;
  default_payment_method: string | null;
  latest_invoice: string | null;
  metadata: Metadata;
  description: string | null;
  start_date: number;
}

export interface InvoiceLineRec {
  id: string;
  amount: number;
  currency: string;
  description: string;
  price: string;
  quantity: number;
  unit_amount_decimal: string;
  period_start: number;
  period_end: number;
  proration: boolean;
  subscription: string | null;
  subscription_item: string | null;
  invoice_item: string | null;
}

export type InvoiceStatus = "draft" | "open" | "paid" | "uncollectible" | "void";

export interface InvoiceRec {
  id: string;
  created: number;
  customer: string;
  customer_email: string | null;
  customer_name: string | null;
  subscription: string | null;
  status: InvoiceStatus;
  number: string | null;
  billing_reason: string;
  currency: string;
  lines: InvoiceLineRec[];
  period_start: number;
  period_end: number;
  subtotal: number;
  total: number;
  starting_balance: number;
  ending_balance: number | null;
  amount_due: number;
  amount_paid: number;
  amount_remaining: number;
  attempt_count: number;
  attempted: boolean;
  next_payment_attempt: number | null;
  finalized_at: number | null;
  paid_at: number | null;
  marked_uncollectible_at: number | null;
  voided_at: number | null;
  default_payment_method: string | null;
  metadata: Metadata;
  last_payment_error: { code: string; decline_code?: string; message: string } | null;
  /** Unguessable part of the hosted invoice and PDF URLs. */
  _token: string;
  /** Failed automatic attempts so far, for the retry schedule. */
  _failures: number;
}

/** A pending proration (an invoice item not yet on an invoice). */
export interface InvoiceItemRec {
  id: string;
  created: number;
  customer: string;
  subscription: string;
  subscription_item: string;
  price: string;
  quantity: number;
  amount: number;
  currency: string;
  description: string;
  period_start: number;
  period_end: number;
  proration: true;
  invoice: string | null;
}

export interface PortalSessionRec {
  id: string;
  created: number;
  customer: string;
  return_url: string | null;
  url: string;
  expires_at: number;
}

export interface EventRec {
  id: string;
  object: "event";
  api_version: string;
  created: number;
  data: { object: Record<string, unknown>; previous_attributes?: Record<string, unknown> };
  livemode: false;
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
  type: string;
}

export interface DeliveryAttempt {
  at: number;
  status: number | null;
  error: string | null;
}

export interface DeliveryRec {
  event: string;
  url: string;
  status: "pending" | "succeeded" | "failed";
  attempts: DeliveryAttempt[];
  /** Real time (ms) of the next try while pending. */
  next_attempt_ms: number;
}

export interface IdempotencyRec {
  method: string;
  path: string;
  fingerprint: string;
  status: number;
  body: string;
  /** Real time (ms) the result was saved; pruned after 24 h. */
  saved_ms: number;
}

export interface FakeState {
  version: 1;
  clock: ClockState;
  customers: Record<string, CustomerRec>;
  products: Record<string, ProductRec>;
  prices: Record<string, PriceRec>;
  meters: Record<string, MeterRec>;
  meterEvents: MeterEventRec[];
  paymentMethods: Record<string, PaymentMethodRec>;
  checkoutSessions: Record<string, CheckoutSessionRec>;
  subscriptions: Record<string, SubscriptionRec>;
  invoices: Record<string, InvoiceRec>;
  invoiceItems: Record<string, InvoiceItemRec>;
  portalSessions: Record<string, PortalSessionRec>;
  events: Record<string, EventRec>;
  deliveries: DeliveryRec[];
  idempotency: Record<string, IdempotencyRec>;
  /** Payments to fail on purpose: customer id (or "*" for anyone) → count. */
  failNext: Record<string, number>;
}

export function emptyState(): FakeState {
  return {
    version: 1,
    clock: { offset: 0, customerOffsets: {} },
    customers: {},
    products: {},
    prices: {},
    meters: {},
    meterEvents: [],
    paymentMethods: {},
    checkoutSessions: {},
    subscriptions: {},
    invoices: {},
    invoiceItems: {},
    portalSessions: {},
    events: {},
    deliveries: [],
    idempotency: {},
    failNext: {},
  };
}

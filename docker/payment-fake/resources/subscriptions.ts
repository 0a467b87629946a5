/**
 * Subscriptions and their items: create (charging the customer's saved
 * card), retrieve, list, update (items/quantity with prorations,
 * `cancel_at_period_end`, `cancel_at`, metadata, default card), cancel at
 * once (`DELETE`, optional `invoice_now` / `prorate`), and the item-level
 * endpoints (`/v1/subscription_items`).
 */
import { z } from "zod";
import { invalidRequest, noSuch } from "../core/errors";
import type { Fake } from "../core/fake";
import type { SubscriptionRec } from "../core/state";
import { newestFirst, paginate } from "../http/list";
import {
  bool,
  emptyable,
  expand,
  int,
  listShape,
  mergeMetadata,
  metadata,
  oneOf,
  parseParams,
  str,
} from "../http/params";
import { isMetered } from "../billing/lines";
import { chargeDecline, chargeError, paymentMethodFor } from "../billing/payments";
import { endSubscription, startSubscription } from "../billing/subscriptions";
import { changeItems, prorationLines, type ItemChange } from "../billing/update";
import { priceOf, renderSubscription, renderSubscriptionItem } from "./render-billing";
import { getCustomerOrThrow } from "./customers";
import type { ApiRouter } from "./types";

const prorationBehavior = oneOf(["create_prorations", "always_invoice", "none"] as const);
const paymentBehavior = oneOf(["allow_incomplete", "error_if_incomplete"] as const);

const itemParams = z.strictObject({
  id: z.string().optional(),
  price: z.string().optional(),
  quantity: int(0, 999_999).optional(),
  deleted: bool().optional(),
  metadata: z.record(z.string(), z.string()).optional(),
});

const updateSchema = z.strictObject({
  items: z.array(itemParams).max(20).optional(),
  proration_behavior: prorationBehavior.optional(),
  proration_date: int(0).optional(),
  payment_behavior: paymentBehavior.optional(),
  cancel_at_period_end: bool().optional(),
  cancel_at: z.union([z.literal(""), int(0)]).optional(),
  cancellation_details: z
    .strictObject({ comment: emptyable().optional(), feedback: emptyable().optional() })
    .optional(),
  default_payment_method: emptyable().optional(),
  description: emptyable().optional(),
  metadata: metadata().optional(),
  expand: expand(),
});

const createSchema = z.strictObject({
  customer: str(),
  items: z
    .array(
      z.strictObject({
        price: str(),
        quantity: int(1, 999_999).optional(),
        metadata: z.record(z.string(), z.string()).optional(),
      }),
    )
    .min(1)
    .max(20),
  default_payment_method: z.string().optional(),
  payment_behavior: paymentBehavior.optional(),
  description: z.string().optional(),
  metadata: metadata().optional(),
  expand: expand(),
});

const listSchema = z.strictObject({
  ...listShape,
  customer: z.string().optional(),
  price: z.string().optional(),
  status: oneOf([
    "active",
    "past_due",
    "canceled",
    "incomplete",
    "incomplete_expired",
    "all",
    "ended",
  ] as const).optional(),
});

export function getSubscriptionOrThrow(fake: Fake, id: string, param = "id"): SubscriptionRec {
  const s = fake.state.subscriptions[id];
  if (!s) throw noSuch("subscription", id, param);
  return s;
}

function assertLive(sub: SubscriptionRec): void {
  if (sub.status === "canceled" || sub.status === "incomplete_expired") {
    throw invalidRequest(
      `A ${sub.status} subscription cannot be updated.`,
      undefined,
      "resource_missing",
    );
  }
}

function update(
  fake: Fake,
  sub: SubscriptionRec,
  p: z.output<typeof updateSchema>,
  changes: ItemChange[] | undefined,
) {
  assertLive(sub);
  if (p.default_payment_method) {
    const pm = fake.state.paymentMethods[p.default_payment_method];
    if (!pm || pm.customer !== sub.customer)
      throw noSuch("PaymentMethod", p.default_payment_method, "default_payment_method");
  }
  changeItems(fake, sub, {
    changes,
    proration: p.proration_behavior ?? "create_prorations",
    prorationDate: p.proration_date,
    errorIfIncomplete: p.payment_behavior === "error_if_incomplete",
    applyOther: () => {
      if (p.cancel_at_period_end !== undefined) {
        sub.cancel_at_period_end = p.cancel_at_period_end;
        sub.cancel_at = p.cancel_at_period_end ? sub.current_period_end : null;
        sub.canceled_at = p.cancel_at_period_end ? fake.now(sub.customer) : null;
      }
      if (p.cancel_at !== undefined) {
        sub.cancel_at = p.cancel_at === "" ? null : p.cancel_at;
        sub.cancel_at_period_end = sub.cancel_at === sub.current_period_end;
        sub.canceled_at = sub.cancel_at === null ? null : fake.now(sub.customer);
      }
      if (p.cancellation_details?.comment !== undefined)
        sub.cancellation_comment = p.cancellation_details.comment;
      if (p.cancellation_details?.feedback !== undefined)
        sub.cancellation_feedback = p.cancellation_details.feedback;
      if (p.default_payment_method !== undefined)
        sub.default_payment_method = p.default_payment_method;
      if (p.description !== undefined) sub.description = p.description;
      sub.metadata = mergeMetadata(sub.metadata, p.metadata);
    },
  });
  return renderSubscription(fake, sub);
}

export function registerSubscriptions(router: ApiRouter): void {
  router.add("POST", "/v1/subscriptions", ({ fake, body }) => {
    const p = parseParams(createSchema, body);
    const customer = getCustomerOrThrow(fake, p.customer);
    let currency: string | null = null;
    const items = p.items.map((it, i) => {
      const price = fake.state.prices[it.price];
      if (!price) throw noSuch("price", it.price, `items[${i}][price]`);
      if (!price.recurring || !price.active)
        throw invalidRequest(
          `The price ${price.id} must be active and recurring.`,
          `items[${i}][price]`,
        );
      if (currency && currency !== price.currency)
        throw invalidRequest("All items must use the same currency.", `items[${i}][price]`);
      currency = price.currency;
      if (isMetered(price) && it.quantity !== undefined) {
        throw invalidRequest(
          "Quantity should not be specified where usage_type is `metered`.",
          `items[${i}][quantity]`,
        );
      }
      return { price: price.id, quantity: isMetered(price) ? null : (it.quantity ?? 1) };
    });
    const pmId = p.default_payment_method ?? null;
    if (pmId && fake.state.paymentMethods[pmId]?.customer !== customer.id)
      throw noSuch("PaymentMethod", pmId, "default_payment_method");
    const amount = items.reduce(
      (s, it) => s + (it.quantity ?? 0) * (priceOf(fake, it.price).unit_amount ?? 0),
      0,
    );
    if (p.payment_behavior === "error_if_incomplete" && amount > 0) {
      const decline = chargeDecline(fake, customer.id, paymentMethodFor(fake, customer.id, pmId), {
        peek: true,
      });
      if (decline) throw chargeError(decline);
    }
    const sub = startSubscription(fake, {
      customer: customer.id,
      items,
      currency: currency!,
      defaultPaymentMethod: pmId,
      metadata: mergeMetadata({}, p.metadata),
      description: p.description ?? null,
      charge: true,
    });
    return renderSubscription(fake, sub);
  });

  router.add("GET", "/v1/subscriptions/:id", ({ fake, params, body }) => {
    parseParams(z.strictObject({ expand: expand() }), body);
    return renderSubscription(fake, getSubscriptionOrThrow(fake, params.id));
  });

  router.add("POST", "/v1/subscriptions/:id", ({ fake, params, body }) => {
    const p = parseParams(updateSchema, body);
    return update(fake, getSubscriptionOrThrow(fake, params.id), p, p.items);
  });

  router.add("DELETE", "/v1/subscriptions/:id", ({ fake, params, body }) => {
    const p = parseParams(
      z.strictObject({
        invoice_now: bool().optional(),
        prorate: bool().optional(),
        cancellation_details: z
          .strictObject({ comment: z.string().optional(), feedback: z.string().optional() })
          .optional(),
        expand: expand(),
      }),
      body,
    );
    const sub = getSubscriptionOrThrow(fake, params.id);
    assertLive(sub);
    const now = fake.now(sub.customer);
    // Prorating credits the unused part of every licensed item (all of them end now).
    const credit = p.prorate ? prorationLines(fake, sub, [], now) : [];
    if (credit.length && !p.invoice_now) {
      const customer = fake.state.customers[sub.customer];
      customer.balance += credit.reduce((s, l) => s + l.amount, 0);
    }
    if (p.cancellation_details?.comment !== undefined)
      sub.cancellation_comment = p.cancellation_details.comment;
    if (p.cancellation_details?.feedback !== undefined)
      sub.cancellation_feedback = p.cancellation_details.feedback;
    sub.canceled_at = now;
    sub.cancellation_reason = "cancellation_requested";
    endSubscription(fake, sub, {
      at: now,
      reason: "cancellation_requested",
      finalInvoice: p.invoice_now ?? false,
      extraLines: p.invoice_now ? credit : [],
    });
    return renderSubscription(fake, sub);
  });

  router.add("GET", "/v1/subscriptions", ({ fake, body }) => {
    const p = parseParams(listSchema, body);
    const status = p.status;
    const rows = newestFirst(fake.state.subscriptions).filter(
      (s) =>
        (p.customer === undefined || s.customer === p.customer) &&
        (p.price === undefined || s.items.some((i) => i.price === p.price)) &&
        (status === "all" ||
          (status === "ended"
            ? s.status === "canceled" || s.status === "incomplete_expired"
            : status === undefined
              ? s.status !== "canceled"
              : s.status === status)),
    );
    return paginate(rows, p, "/v1/subscriptions", (s) => renderSubscription(fake, s));
  });

  router.add("GET", "/v1/subscription_items", ({ fake, body }) => {
    const p = parseParams(z.strictObject({ ...listShape, subscription: str() }), body);
    const sub = getSubscriptionOrThrow(fake, p.subscription, "subscription");
    return paginate(
      [...sub.items].reverse(),
      p,
      `/v1/subscription_items?subscription=${sub.id}`,
      (i) => renderSubscriptionItem(fake, sub, i),
    );
  });

  router.add("GET", "/v1/subscription_items/:id", ({ fake, params, body }) => {
    parseParams(z.strictObject({ expand: expand() }), body);
    const sub = Object.values(fake.state.subscriptions).find((s) =>
      s.items.some((i) => i.id === params.id),
    );
    if (!sub) throw noSuch("subscription item", params.id);
    return renderSubscriptionItem(
      fake,
      sub,
      sub.items.find((i) => i.id === params.id)!,
    );
  });

  router.add("POST", "/v1/subscription_items/:id", ({ fake, params, body }) => {
    const p = parseParams(
      z.strictObject({
        quantity: int(0, 999_999).optional(),
        price: z.string().optional(),
        metadata: z.record(z.string(), z.string()).optional(),
        proration_behavior: prorationBehavior.optional(),
        proration_date: int(0).optional(),
        payment_behavior: paymentBehavior.optional(),
        expand: expand(),
      }),
      body,
    );
    const sub = Object.values(fake.state.subscriptions).find((s) =>
      s.items.some((i) => i.id === params.id),
    );
    if (!sub) throw noSuch("subscription item", params.id);
    const change: ItemChange = {
      id: params.id,
      quantity: p.quantity,
      price: p.price,
      metadata: p.metadata,
    };
    update(
      fake,
      sub,
      {
        proration_behavior: p.proration_behavior,
        proration_date: p.proration_date,
        payment_behavior: p.payment_behavior,
      },
      [change],
    );
    return renderSubscriptionItem(
      fake,
      sub,
      sub.items.find((i) => i.id === params.id)!,
    );
  });
}

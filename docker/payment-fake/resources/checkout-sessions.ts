/**
 * Checkout sessions in `subscription` mode. Creating one returns a `url` to
 * the hosted test payment page (`/pay/cs_…`); paying there completes the
 * session. Line items are monthly recurring prices in one currency:
 * licensed ones need a `quantity` (seats), metered ones must not have one.
 */
import { z } from "zod";
import { invalidRequest, noSuch } from "../core/errors";
import type { Fake } from "../core/fake";
import { newId } from "../core/ids";
import type { CheckoutSessionRec } from "../core/state";
import { newestFirst, paginate } from "../http/list";
import {
  emptyable,
  expand,
  int,
  listShape,
  mergeMetadata,
  metadata,
  oneOf,
  parseParams,
  str,
  url,
} from "../http/params";
import { isMetered } from "../billing/lines";
import { lineAmount } from "../billing/money";
import { refreshSessionStatus } from "../billing/checkout";
import { renderCheckoutLine, renderCheckoutSession } from "./render-billing";
import type { ApiRouter } from "./types";

const createSchema = z.strictObject({
  mode: oneOf(["payment", "setup", "subscription"] as const),
  line_items: z
    .array(z.strictObject({ price: str(), quantity: int(0, 999_999).optional() }))
    .min(1)
    .max(20),
  success_url: url(),
  cancel_url: url().optional(),
  customer: z.string().optional(),
  customer_email: z.string().optional(),
  client_reference_id: z.string().max(200).optional(),
  metadata: metadata().optional(),
  subscription_data: z
    .strictObject({ metadata: metadata().optional(), description: emptyable().optional() })
    .optional(),
  expires_at: int(0).optional(),
  payment_method_types: z.array(z.literal("card")).optional(),
  expand: expand(),
});

const listSchema = z.strictObject({
  ...listShape,
  customer: z.string().optional(),
  subscription: z.string().optional(),
  status: oneOf(["open", "complete", "expired"] as const).optional(),
});

export function getSessionOrThrow(fake: Fake, id: string): CheckoutSessionRec {
  const s = fake.state.checkoutSessions[id];
  if (!s) throw noSuch("checkout.session", id);
  refreshSessionStatus(fake, s);
  return s;
}

function lineItemsList(fake: Fake, s: CheckoutSessionRec) {
  return {
    object: "list" as const,
    data: s.line_items.map((l) => renderCheckoutLine(fake, s, l)),
    has_more: false,
    url: `/v1/checkout/sessions/${s.id}/line_items`,
  };
}

/** `line_items` is only present when expanded; the expander asks here. */
export function includeCheckoutField(
  fake: Fake,
  owner: Record<string, unknown>,
  field: string,
): unknown {
  if (owner.object !== "checkout.session" || field !== "line_items") return undefined;
  const s = fake.state.checkoutSessions[owner.id as string];
  return s ? lineItemsList(fake, s) : undefined;
}

export function registerCheckoutSessions(router: ApiRouter): void {
  router.add("POST", "/v1/checkout/sessions", ({ fake, body }) => {
    const p = parseParams(createSchema, body);
    if (p.mode !== "subscription") {
      throw invalidRequest(
        `This local fake supports mode=subscription only (got ${p.mode}).`,
        "mode",
      );
    }
    if (p.customer && p.customer_email) {
      throw invalidRequest(
        "You may only specify one of these parameters: customer, customer_email.",
        "customer_email",
      );
    }
    if (p.customer) {
      const c = fake.state.customers[p.customer];
      if (!c || c.deleted) throw noSuch("customer", p.customer, "customer");
    }
    let currency: string | null = null;
    let total = 0;
    const lines = p.line_items.map((li, i) => {
      const param = (f: string) => `line_items[${i}][${f}]`;
      const price = fake.state.prices[li.price];
      if (!price) throw noSuch("price", li.price, param("price"));
      if (!price.active)
        throw invalidRequest(`The price ${price.id} is not active.`, param("price"));
      if (!price.recurring)
        throw invalidRequest(
          "In subscription mode every line item needs a recurring price.",
          param("price"),
        );
      if (currency && price.currency !== currency)
        throw invalidRequest("All line items must use the same currency.", param("price"));
      currency = price.currency;
      if (isMetered(price)) {
        if (li.quantity !== undefined)
          throw invalidRequest(
            "Quantity should not be specified where usage_type is `metered`.",
            param("quantity"),
          );
        return { id: newId("li"), price: price.id, quantity: null };
      }
      if (li.quantity === undefined)
        throw invalidRequest("Quantity is required for a licensed price.", param("quantity"));
      if (li.quantity < 1) throw invalidRequest("Quantity must be at least 1.", param("quantity"));
      total += lineAmount(li.quantity, price.unit_amount_decimal);
      return { id: newId("li"), price: price.id, quantity: li.quantity };
    });
    const prices = lines.map((l) => l.price);
    if (new Set(prices).size !== prices.length)
      throw invalidRequest("Each price may appear only once.", "line_items");
    const now = fake.now(p.customer);
    if (p.expires_at !== undefined && (p.expires_at < now + 1800 || p.expires_at > now + 86_400)) {
      throw invalidRequest(
        "expires_at must be between 30 minutes and 24 hours from now.",
        "expires_at",
      );
    }
    const s: CheckoutSessionRec = {
      id: newId("cs_test"),
      created: now,
      expires_at: p.expires_at ?? now + 86_400,
      mode: "subscription",
      status: "open",
      payment_status: "unpaid",
      customer: p.customer ?? null,
      customer_email: p.customer_email ?? null,
      client_reference_id: p.client_reference_id ?? null,
      success_url: p.success_url,
      cancel_url: p.cancel_url ?? null,
      metadata: mergeMetadata({}, p.metadata),
      currency: currency!,
      line_items: lines,
      subscription_metadata: mergeMetadata({}, p.subscription_data?.metadata),
      subscription_description: p.subscription_data?.description ?? null,
      subscription: null,
      invoice: null,
      amount_subtotal: total,
      amount_total: total,
    };
    fake.state.checkoutSessions[s.id] = s;
    return renderCheckoutSession(fake, s);
  });

  router.add("GET", "/v1/checkout/sessions/:id", ({ fake, params, body }) => {
    parseParams(z.strictObject({ expand: expand() }), body);
    return renderCheckoutSession(fake, getSessionOrThrow(fake, params.id));
  });

  router.add("GET", "/v1/checkout/sessions/:id/line_items", ({ fake, params, body }) => {
    const p = parseParams(z.strictObject(listShape), body);
    const s = getSessionOrThrow(fake, params.id);
    return paginate(s.line_items, p, `/v1/checkout/sessions/${s.id}/line_items`, (l) =>
      renderCheckoutLine(fake, s, l),
    );
  });

  router.add("POST", "/v1/checkout/sessions/:id/expire", ({ fake, params, body }) => {
    parseParams(z.strictObject({ expand: expand() }), body);
    const s = getSessionOrThrow(fake, params.id);
    if (s.status !== "open")
      throw invalidRequest(`Only open sessions can be expired; this one is ${s.status}.`);
    s.status = "expired";
    fake.emit("checkout.session.expired", renderCheckoutSession(fake, s), undefined, s.customer);
    return renderCheckoutSession(fake, s);
  });

  router.add("GET", "/v1/checkout/sessions", ({ fake, body }) => {
    const p = parseParams(listSchema, body);
    const rows = newestFirst(fake.state.checkoutSessions).filter(
      (s) =>
        (p.customer === undefined || s.customer === p.customer) &&
        (p.subscription === undefined || s.subscription === p.subscription) &&
        (p.status === undefined || s.status === p.status),
    );
    return paginate(rows, p, "/v1/checkout/sessions", (s) => {
      refreshSessionStatus(fake, s);
      return renderCheckoutSession(fake, s);
    });
  });
}

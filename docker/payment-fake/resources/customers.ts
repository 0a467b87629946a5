/**
 * Customers: create, retrieve, update, delete, list (filter by `email`), and
 * their saved cards (`GET /v1/customers/:id/payment_methods`).
 */
import { z } from "zod";
import { invalidRequest, noSuch } from "../core/errors";
import type { Fake } from "../core/fake";
import { newId, randomText } from "../core/ids";
import type { CustomerRec } from "../core/state";
import {
  emptyable,
  expand,
  inRange,
  listShape,
  mergeMetadata,
  metadata,
  parseParams,
  rangeFilter,
} from "../http/params";
import { newestFirst, paginate } from "../http/list";
import { endSubscription } from "../billing/subscriptions";
import { renderCustomer, renderPaymentMethod } from "./render-catalog";
import { resolvePaymentMethodParam } from "./payment-methods";
import type { ApiRouter } from "./types";

export function getCustomerOrThrow(fake: Fake, id: string, param = "customer"): CustomerRec {
  const c = fake.state.customers[id];
  if (!c || c.deleted) throw noSuch("customer", id, param);
  return c;
}

const createSchema = z.strictObject({
  email: emptyable().optional(),
  name: emptyable().optional(),
  description: emptyable().optional(),
  phone: emptyable().optional(),
  metadata: metadata().optional(),
  payment_method: z.string().optional(),
  invoice_settings: z.strictObject({ default_payment_method: z.string().optional() }).optional(),
  expand: expand(),
});

const updateSchema = createSchema.omit({ payment_method: true });

const listSchema = z.strictObject({
  ...listShape,
  email: z.string().optional(),
  created: rangeFilter().optional(),
});

export function registerCustomers(router: ApiRouter): void {
  router.add("POST", "/v1/customers", ({ fake, body }) => {
    const p = parseParams(createSchema, body);
    const id = newId("cus");
    const c: CustomerRec = {
      id,
      created: fake.now(),
      email: p.email ?? null,
      name: p.name ?? null,
      description: p.description ?? null,
      phone: p.phone ?? null,
      metadata: mergeMetadata({}, p.metadata),
      balance: 0,
      invoice_prefix: randomText(8).toUpperCase(),
      next_invoice_sequence: 1,
      default_payment_method: null,
    };
    // Resolve the card before storing anything, so a bad card leaves no half-made customer.
    const pm = p.payment_method
      ? resolvePaymentMethodParam(fake, p.payment_method, "payment_method", id)
      : null;
    const defaultPm = p.invoice_settings?.default_payment_method;
    if (defaultPm && defaultPm !== pm?.id) {
      throw invalidRequest(
        "invoice_settings[default_payment_method] must be the payment_method given with it.",
        "invoice_settings[default_payment_method]",
      );
    }
    fake.state.customers[id] = c;
    fake.emit("customer.created", renderCustomer(fake, c), undefined, id);
    if (pm) {
      pm.customer = id;
      fake.emit("payment_method.attached", renderPaymentMethod(pm), undefined, id);
      if (defaultPm) c.default_payment_method = pm.id;
    }
    return renderCustomer(fake, c);
  });

  router.add("GET", "/v1/customers/:id", ({ fake, params, body }) => {
    parseParams(z.strictObject({ expand: expand() }), body);
    const c = fake.state.customers[params.id];
    if (!c) throw noSuch("customer", params.id);
    return renderCustomer(fake, c);
  });

  router.add("POST", "/v1/customers/:id", ({ fake, params, body }) => {
    const p = parseParams(updateSchema, body);
    const c = getCustomerOrThrow(fake, params.id, "id");
    const pmId = p.invoice_settings?.default_payment_method;
    if (pmId !== undefined && pmId !== "") {
      const pm = fake.state.paymentMethods[pmId];
      if (!pm) throw noSuch("PaymentMethod", pmId, "invoice_settings[default_payment_method]");
      if (pm.customer !== c.id) {
        throw invalidRequest(
          `The payment method ${pmId} is not attached to this customer.`,
          "invoice_settings[default_payment_method]",
        );
      }
    }
    const before = renderCustomer(fake, c);
    if (p.email !== undefined) c.email = p.email;
    if (p.name !== undefined) c.name = p.name;
    if (p.description !== undefined) c.description = p.description;
    if (p.phone !== undefined) c.phone = p.phone;
    c.metadata = mergeMetadata(c.metadata, p.metadata);
    if (pmId !== undefined) c.default_payment_method = pmId === "" ? null : pmId;
    const after = renderCustomer(fake, c);
    fake.emit("customer.updated", after, before, c.id);
    return after;
  });

  router.add("DELETE", "/v1/customers/:id", ({ fake, params }) => {
    const c = getCustomerOrThrow(fake, params.id, "id");
    const json = renderCustomer(fake, c);
    for (const sub of Object.values(fake.state.subscriptions)) {
      if (
        sub.customer === c.id &&
        sub.status !== "canceled" &&
        sub.status !== "incomplete_expired"
      ) {
        endSubscription(fake, sub, {
          at: fake.now(c.id),
          reason: "cancellation_requested",
          finalInvoice: false,
        });
      }
    }
    c.deleted = true;
    fake.emit("customer.deleted", json, undefined, c.id);
    return { id: c.id, object: "customer", deleted: true };
  });

  router.add("GET", "/v1/customers", ({ fake, body }) => {
    const p = parseParams(listSchema, body);
    const rows = newestFirst(fake.state.customers).filter(
      (c) =>
        !c.deleted &&
        (p.email === undefined || c.email === p.email) &&
        inRange(c.created, p.created),
    );
    return paginate(rows, p, "/v1/customers", (c) => renderCustomer(fake, c));
  });

  router.add("GET", "/v1/customers/:id/payment_methods", ({ fake, params, body }) => {
    const p = parseParams(
      z.strictObject({ ...listShape, type: z.literal("card").optional() }),
      body,
    );
    const c = getCustomerOrThrow(fake, params.id, "customer");
    const rows = newestFirst(fake.state.paymentMethods).filter((pm) => pm.customer === c.id);
    return paginate(rows, p, `/v1/customers/${c.id}/payment_methods`, renderPaymentMethod);
  });
}

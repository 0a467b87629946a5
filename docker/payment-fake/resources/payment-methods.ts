/**
 * Saved cards (payment methods). Cards are entered on the hosted pages; on
 * the API side the provider's test tokens (`pm_card_visa`,
 * `pm_card_chargeDeclined`, `pm_card_chargeCustomerFail`, …) stand for the
 * matching test numbers and create a fresh payment method when used.
 */
import { z } from "zod";
import { TEST_CARDS, TEST_PAYMENT_METHOD_TOKENS } from "../billing/cards";
import { attachPaymentMethod, createPaymentMethod } from "../billing/payments";
import { cardError, invalidRequest, noSuch } from "../core/errors";
import type { Fake } from "../core/fake";
import type { PaymentMethodRec } from "../core/state";
import { newestFirst, paginate } from "../http/list";
import { expand, listShape, parseParams } from "../http/params";
import { renderCustomer, renderPaymentMethod } from "./render-catalog";
import type { ApiRouter } from "./types";

/**
 * Turns a `payment_method` parameter (a test token or a `pm_…` id) into a
 * saved card that `customerId` may use. Declining test cards fail here
 * with a 402, exactly when saving them would fail.
 */
export function resolvePaymentMethodParam(
  fake: Fake,
  value: string,
  param: string,
  customerId: string,
): PaymentMethodRec {
  const tokenNumber = TEST_PAYMENT_METHOD_TOKENS[value];
  if (tokenNumber) {
    const card = TEST_CARDS[tokenNumber];
    if (card.attach) throw cardError(card.attach, param);
    const year = new Date(fake.now(customerId) * 1000).getUTCFullYear() + 3;
    return createPaymentMethod(
      fake,
      { number: tokenNumber, card, exp_month: 12, exp_year: year },
      { name: null, email: null },
    );
  }
  const pm = fake.state.paymentMethods[value];
  if (!pm) throw noSuch("PaymentMethod", value, param);
  if (pm.customer && pm.customer !== customerId) {
    throw invalidRequest(
      `The payment method ${value} is already attached to another customer.`,
      param,
    );
  }
  return pm;
}

export function registerPaymentMethods(router: ApiRouter): void {
  router.add("GET", "/v1/payment_methods/:id", ({ fake, params, body }) => {
    parseParams(z.strictObject({ expand: expand() }), body);
    const pm = fake.state.paymentMethods[params.id];
    if (!pm) throw noSuch("PaymentMethod", params.id);
    return renderPaymentMethod(pm);
  });

  router.add("GET", "/v1/payment_methods", ({ fake, body }) => {
    const p = parseParams(
      z.strictObject({
        ...listShape,
        customer: z.string().optional(),
        type: z.literal("card").optional(),
      }),
      body,
    );
    const rows = newestFirst(fake.state.paymentMethods).filter(
      (pm) => p.customer === undefined || pm.customer === p.customer,
    );
    return paginate(rows, p, "/v1/payment_methods", renderPaymentMethod);
  });

  router.add("POST", "/v1/payment_methods/:id/attach", ({ fake, params, body }) => {
    const p = parseParams(z.strictObject({ customer: z.string(), expand: expand() }), body);
    const customer = fake.state.customers[p.customer];
    if (!customer || customer.deleted) throw noSuch("customer", p.customer, "customer");
    const pm = resolvePaymentMethodParam(fake, params.id, "payment_method", customer.id);
    if (pm.customer !== customer.id) attachPaymentMethod(fake, pm, customer.id, false);
    return renderPaymentMethod(pm);
  });

  router.add("POST", "/v1/payment_methods/:id/detach", ({ fake, params, body }) => {
    parseParams(z.strictObject({ expand: expand() }), body);
    const pm = fake.state.paymentMethods[params.id];
    if (!pm) throw noSuch("PaymentMethod", params.id);
    if (!pm.customer)
      throw invalidRequest(`The payment method ${pm.id} is not attached to a customer.`);
    const customer = fake.state.customers[pm.customer];
    if (customer && customer.default_payment_method === pm.id) {
      const before = renderCustomer(fake, customer);
      customer.default_payment_method = null;
      fake.emit("customer.updated", renderCustomer(fake, customer), before, customer.id);
    }
    for (const sub of Object.values(fake.state.subscriptions)) {
      if (sub.default_payment_method === pm.id) sub.default_payment_method = null;
    }
    const json = renderPaymentMethod(pm);
    pm.customer = null;
    fake.emit("payment_method.detached", renderPaymentMethod(pm), json, json.customer as string);
    return renderPaymentMethod(pm);
  });
}

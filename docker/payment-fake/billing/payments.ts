/**
 * Saving cards and deciding whether a charge succeeds. A charge fails when
 * the customer has no card, when the card is one of the declining test
 * numbers, or when a failure was queued with `POST /_fake/fail-next-payment`
 * (for one customer or for anyone). `peek` asks without using up a queued
 * failure, so callers can check before changing anything.
 */
import { cardError, invalidRequest, type ApiError, type Decline } from "../core/errors";
import type { Fake } from "../core/fake";
import { newId } from "../core/ids";
import type { PaymentMethodRec } from "../core/state";
import { renderCustomer, renderPaymentMethod } from "../resources/render-catalog";
import type { ValidCard } from "./cards";
import { TEST_CARDS } from "./cards";

export const NO_PAYMENT_METHOD: Decline = {
  code: "payment_method_missing",
  message: "The customer has no saved card to charge.",
};

export const QUEUED_FAILURE: Decline = {
  code: "card_declined",
  decline_code: "generic_decline",
  message: "Your card was declined.",
};

export function createPaymentMethod(
  fake: Fake,
  card: ValidCard,
  billing: { name: string | null; email: string | null },
): PaymentMethodRec {
  const pm: PaymentMethodRec = {
    id: newId("pm"),
    created: fake.now(),
    customer: null,
    brand: card.card.brand,
    funding: card.card.funding,
    last4: card.number.slice(-4),
    exp_month: card.exp_month,
    exp_year: card.exp_year,
    name: billing.name,
    email: billing.email,
    _number: card.number,
  };
  fake.state.paymentMethods[pm.id] = pm;
  return pm;
}

/** Attaches a saved card to a customer and, optionally, makes it the default. */
export function attachPaymentMethod(
  fake: Fake,
  pm: PaymentMethodRec,
  customerId: string,
  makeDefault: boolean,
): void {
  const customer = fake.state.customers[customerId];
  pm.customer = customerId;
  fake.emit("payment_method.attached", renderPaymentMethod(pm), undefined, customerId);
  if (makeDefault && customer.default_payment_method !== pm.id) {
    const before = renderCustomer(fake, customer);
    customer.default_payment_method = pm.id;
    fake.emit("customer.updated", renderCustomer(fake, customer), before, customerId);
  }
}

/**
 * The API error for a failed charge: a card problem is a 402 card_error; no
 * saved card at all is a 400 invalid request, as with the provider.
 */
export function chargeError(decline: Decline): ApiError {
  if (decline.code === NO_PAYMENT_METHOD.code) {
    return invalidRequest(
      "This customer has no attached payment source or default payment method.",
      undefined,
      "resource_missing",
    );
  }
  return cardError(decline);
}

/** A failure queued for this customer (or anyone), used up unless `peek`. */
export function queuedFailure(fake: Fake, customerId: string | null, peek = false): Decline | null {
  const key =
    customerId && (fake.state.failNext[customerId] ?? 0) > 0
      ? customerId
      : (fake.state.failNext["*"] ?? 0) > 0
        ? "*"
        : null;
  if (!key) return null;
  if (!peek) {
    fake.state.failNext[key] -= 1;
    if (fake.state.failNext[key] <= 0) delete fake.state.failNext[key];
  }
  return QUEUED_FAILURE;
}

/** Why a charge on this card for this customer would fail, or null if it succeeds. */
export function chargeDecline(
  fake: Fake,
  customerId: string,
  pmId: string | null,
  opts: { peek?: boolean } = {},
): Decline | null {
  const queued = queuedFailure(fake, customerId, opts.peek);
  if (queued) return queued;
  const pm = pmId ? fake.state.paymentMethods[pmId] : undefined;
  if (!pm) return NO_PAYMENT_METHOD;
  return TEST_CARDS[pm._number]?.charge ?? null;
}

/** The card a charge for this customer (and subscription) would use. */
export function paymentMethodFor(
  fake: Fake,
  customerId: string,
  subscriptionPm: string | null,
): string | null {
  return subscriptionPm ?? fake.state.customers[customerId]?.default_payment_method ?? null;
}

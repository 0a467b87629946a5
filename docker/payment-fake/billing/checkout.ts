/**
 * Completing a checkout session from the hosted payment page. Everything is
 * checked first — the session is open, the card is a valid test card that
 * can be saved, and the first charge would go through — and only then are
 * the customer, card, subscription and paid first invoice created. A
 * declined attempt therefore changes nothing (except using up a failure
 * queued with `/_fake/fail-next-payment`).
 */
import type { Decline } from "../core/errors";
import type { Fake } from "../core/fake";
import { newId, randomText } from "../core/ids";
import type { CheckoutSessionRec, CustomerRec } from "../core/state";
import { renderCheckoutSession } from "../resources/render-billing";
import { renderCustomer } from "../resources/render-catalog";
import { checkCardInput, type CardInput } from "./cards";
import { attachPaymentMethod, createPaymentMethod, queuedFailure } from "./payments";
import { startSubscription } from "./subscriptions";

export type CheckoutResult =
  | { ok: true; redirect: string }
  | { ok: false; message: string; field: "email" | "number" | "expiry" | "cvc" | "session" };

/** Marks an open session expired when its time is up; returns whether it is still open. */
export function refreshSessionStatus(fake: Fake, s: CheckoutSessionRec): boolean {
  if (s.status === "open" && fake.now(s.customer) >= s.expires_at) {
    s.status = "expired";
    fake.emit("checkout.session.expired", renderCheckoutSession(fake, s), undefined, s.customer);
  }
  return s.status === "open";
}

export function completeCheckout(
  fake: Fake,
  s: CheckoutSessionRec,
  form: CardInput & { email: string; name: string },
): CheckoutResult {
  if (!refreshSessionStatus(fake, s)) {
    return {
      ok: false,
      field: "session",
      message:
        s.status === "complete"
          ? "This checkout is already complete."
          : "This checkout session has expired.",
    };
  }
  const email = s.customer ? null : (s.customer_email ?? form.email.trim());
  if (email !== null && !/^[^\s@]+@[^\s@]+\.[^\s@]+$/.test(email)) {
    return { ok: false, field: "email", message: "Enter a valid e-mail address." };
  }
  const check = checkCardInput(form, fake.now(s.customer));
  if (!check.ok) return { ok: false, field: check.field, message: check.decline.message };
  if (check.value.card.attach) return declined(check.value.card.attach);
  if (s.amount_total > 0) {
    const failure = queuedFailure(fake, s.customer) ?? check.value.card.charge;
    if (failure) return declined(failure);
  }

  const customer = s.customer
    ? fake.state.customers[s.customer]
    : createCustomer(fake, email!, form.name.trim() || null);
  const pm = createPaymentMethod(fake, check.value, {
    name: form.name.trim() || null,
    email: customer.email,
  });
  attachPaymentMethod(fake, pm, customer.id, false);
  const sub = startSubscription(fake, {
    customer: customer.id,
    items: s.line_items.map((l) => ({ price: l.price, quantity: l.quantity })),
    currency: s.currency,
    defaultPaymentMethod: pm.id,
    metadata: s.subscription_metadata,
    description: s.subscription_description,
    charge: true,
  });
  s.status = "complete";
  s.payment_status = s.amount_total > 0 ? "paid" : "no_payment_required";
  s.customer = customer.id;
  s.subscription = sub.id;
  s.invoice = sub.latest_invoice;
  fake.emit("checkout.session.completed", renderCheckoutSession(fake, s), undefined, customer.id);
  return { ok: true, redirect: s.success_url.replaceAll("{CHECKOUT_SESSION_ID}", s.id) };
}

function declined(d: Decline): CheckoutResult {
  return { ok: false, field: "number", message: d.message };
}

function createCustomer(fake: Fake, email: string, name: string | null): CustomerRec {
  const c: CustomerRec = {
    id: newId("cus"),
    created: fake.now(),
    email,
    name,
    description: null,
    phone: null,
    metadata: {},
    balance: 0,
    invoice_prefix: randomText(8).toUpperCase(),
    next_invoice_sequence: 1,
    default_payment_method: null,
  };
  fake.state.customers[c.id] = c;
  fake.emit("customer.created", renderCustomer(fake, c), undefined, c.id);
  return c;
}

/**
 * Checkout through the payment fake, driven by the real SDK and the hosted
 * page: a good test card subscribes and pays; the documented decline number
 * changes nothing. Expected behaviour follows the provider's public API
 * reference (object shapes, event names) and its testing page (test cards).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type Stripe from "stripe";
import { getPlan } from "@/lib/billing/plans";
import {
  DECLINED_CARD,
  GOOD_CARD,
  createLabCatalog,
  startHarness,
  submitCard,
  type Catalog,
  type Harness,
} from "./fake-support";

let h: Harness;
let catalog: Catalog;

beforeAll(async () => {
  h = await startHarness();
  catalog = await createLabCatalog(h.stripe, "checkout");
});
afterAll(async () => h?.close());

async function newSession(customer: Stripe.Customer, seats: number) {
  return h.stripe.checkout.sessions.create({
    mode: "subscription",
    customer: customer.id,
    client_reference_id: "org_42",
    metadata: { org: "42" },
    subscription_data: { metadata: { org: "42", plan: "lab" } },
    line_items: [
      { price: catalog.seat.id, quantity: seats },
      { price: catalog.shots.id },
      { price: catalog.seconds.id },
    ],
    success_url: "http://localhost:3000/billing/done?session={CHECKOUT_SESSION_ID}",
    cancel_url: "http://localhost:3000/billing",
  });
}

describe("checkout with the hosted test payment page", () => {
  it("pays with 4242…, creates an active subscription, a paid first invoice and signed webhooks", async () => {
    const customer = await h.stripe.customers.create({
      email: "pi@lab.example",
      name: "PI",
      metadata: { org: "42" },
    });
    const session = await newSession(customer, 3);
    const seatCents = getPlan("lab").seatPriceCents;
    expect(session.object).toBe("checkout.session");
    expect(session.status).toBe("open");
    expect(session.amount_total).toBe(3 * seatCents);
    expect(session.url).toMatch(new RegExp(`/pay/${session.id}$`));

    const page = await fetch(session.url!);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain("4242 4242 4242 4242");

    const result = await submitCard(session.url!, GOOD_CARD);
    expect(result.status).toBe(303);
    expect(result.location).toBe(`http://localhost:3000/billing/done?session=${session.id}`);

    const done = await h.stripe.checkout.sessions.retrieve(session.id, {
      expand: ["subscription", "line_items"],
    });
    expect(done.status).toBe("complete");
    expect(done.payment_status).toBe("paid");
    expect(done.line_items!.data.map((l) => l.quantity)).toEqual([3, null, null]);
    const sub = done.subscription as Stripe.Subscription;
    expect(sub.status).toBe("active");
    expect(sub.customer).toBe(customer.id);
    expect(sub.metadata).toEqual({ org: "42", plan: "lab" });
    const seatItem = sub.items.data.find((i) => i.price.id === catalog.seat.id)!;
    expect(seatItem.quantity).toBe(3);
    // One calendar month (28–31 days) from the start.
    const days = (seatItem.current_period_end - seatItem.current_period_start) / 86_400;
    expect(days).toBeGreaterThanOrEqual(28);
    expect(days).toBeLessThanOrEqual(31);

    const invoice = await h.stripe.invoices.retrieve(sub.latest_invoice as string);
    expect(invoice.status).toBe("paid");
    expect(invoice.billing_reason).toBe("subscription_create");
    expect(invoice.amount_paid).toBe(3 * seatCents);
    expect(invoice.parent?.subscription_details?.subscription).toBe(sub.id);
    const seatLine = invoice.lines.data.find(
      (l) => l.pricing?.price_details?.price === catalog.seat.id,
    )!;
    expect(seatLine.quantity).toBe(3);
    expect(seatLine.amount).toBe(3 * seatCents);
    expect(invoice.hosted_invoice_url).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/invoice\//);

    const list = await h.stripe.invoices.list({ customer: customer.id });
    expect(list.data.map((i) => i.id)).toEqual([invoice.id]);

    await h.flush();
    const mine = (e: Stripe.Event) =>
      (e.data.object as { customer?: string }).customer === customer.id;
    const types = h.receiver.types(mine);
    for (const t of [
      "customer.subscription.created",
      "invoice.created",
      "invoice.finalized",
      "invoice.paid",
      "customer.subscription.updated",
      "checkout.session.completed",
    ]) {
      expect(types).toContain(t);
    }
    expect(types.indexOf("invoice.created")).toBeLessThan(types.indexOf("invoice.paid"));
    const completed = h.receiver
      .accepted()
      .find((e) => e.type === "checkout.session.completed" && mine(e))!;
    const cs = completed.data.object as Stripe.Checkout.Session;
    expect(cs.id).toBe(session.id);
    expect(cs.subscription).toBe(sub.id);
    expect(cs.client_reference_id).toBe("org_42");
    // Every delivered event is also in the event log, under the same id.
    const logged = await h.stripe.events.retrieve(completed.id);
    expect(logged.type).toBe("checkout.session.completed");
  });

  it("declines 4000 0000 0000 0002 with a clear message and changes nothing", async () => {
    const customer = await h.stripe.customers.create({ email: "declined@lab.example" });
    const session = await newSession(customer, 2);
    await h.flush();
    const eventsBefore = (await h.stripe.events.list({ limit: 100 })).data.length;

    const result = await submitCard(session.url!, DECLINED_CARD);
    expect(result.status).toBe(402);
    expect(result.html).toContain("Your card was declined.");

    const after = await h.stripe.checkout.sessions.retrieve(session.id);
    expect(after.status).toBe("open");
    expect(after.subscription).toBeNull();
    expect(
      (await h.stripe.subscriptions.list({ customer: customer.id, status: "all" })).data,
    ).toHaveLength(0);
    expect((await h.stripe.invoices.list({ customer: customer.id })).data).toHaveLength(0);
    expect((await h.stripe.customers.listPaymentMethods(customer.id)).data).toHaveLength(0);
    expect((await h.stripe.events.list({ limit: 100 })).data.length).toBe(eventsBefore);

    // The same session can still be paid with a good card afterwards.
    const retry = await submitCard(session.url!, GOOD_CARD);
    expect(retry.status).toBe(303);
    // …and not a second time.
    const again = await submitCard(session.url!, GOOD_CARD);
    expect(again.status).toBe(409);
    expect((await h.stripe.subscriptions.list({ customer: customer.id })).data).toHaveLength(1);
  });

  it("rejects a wrong card number, an expired card and a bad CVC on the page", async () => {
    const customer = await h.stripe.customers.create({ email: "typo@lab.example" });
    const session = await newSession(customer, 1);
    const typo = await submitCard(session.url!, { ...GOOD_CARD, number: "4242 4242 4242 4241" });
    expect(typo.status).toBe(402);
    expect(typo.html).toContain("Your card number is incorrect.");
    const expired = await submitCard(session.url!, { ...GOOD_CARD, expiry: "01 / 20" });
    expect(expired.html).toContain("expiration date is in the past");
    const cvc = await submitCard(session.url!, { ...GOOD_CARD, cvc: "12" });
    expect(cvc.html).toContain("security code is invalid");
    expect((await h.stripe.checkout.sessions.retrieve(session.id)).status).toBe("open");
  });

  it("creates the customer from the page when the session has only an e-mail", async () => {
    const session = await h.stripe.checkout.sessions.create({
      mode: "subscription",
      customer_email: "new@lab.example",
      line_items: [{ price: catalog.seat.id, quantity: 1 }],
      success_url: "http://localhost:3000/ok",
    });
    expect(session.customer).toBeNull();
    expect((await submitCard(session.url!, GOOD_CARD)).status).toBe(303);
    const done = await h.stripe.checkout.sessions.retrieve(session.id, { expand: ["customer"] });
    expect((done.customer as Stripe.Customer).email).toBe("new@lab.example");
    const found = await h.stripe.customers.list({ email: "new@lab.example" });
    expect(found.data).toHaveLength(1);
  });

  it("validates session parameters like the provider", async () => {
    const customer = await h.stripe.customers.create({ email: "bad@lab.example" });
    await expect(
      h.stripe.checkout.sessions.create({
        mode: "subscription",
        customer: customer.id,
        line_items: [{ price: catalog.shots.id, quantity: 5 }],
        success_url: "http://localhost:3000/ok",
      }),
    ).rejects.toMatchObject({
      type: "StripeInvalidRequestError",
      param: "line_items[0][quantity]",
    });
    await expect(
      h.stripe.checkout.sessions.create({
        mode: "subscription",
        customer: customer.id,
        success_url: "http://x.test",
      } as Stripe.Checkout.SessionCreateParams),
    ).rejects.toMatchObject({ statusCode: 400, code: "parameter_missing", param: "line_items" });
    await expect(
      h.stripe.checkout.sessions.create({
        mode: "subscription",
        customer: "cus_missing",
        line_items: [{ price: catalog.seat.id, quantity: 1 }],
        success_url: "http://x.test",
      }),
    ).rejects.toMatchObject({
      statusCode: 404,
      code: "resource_missing",
      message: "No such customer: 'cus_missing'",
    });
  });
});

/**
 * Seat changes, prorations, cancellation and the billing portal on the
 * payment fake, through the SDK. Proration amounts follow the provider's
 * documented rule: a change at time t in period [s, e) credits the unused
 * part of the old quantity and charges the remaining part of the new one,
 * each proportional to (e − t) / (e − s) and rounded to whole cents.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type Stripe from "stripe";
import { getPlan } from "@/lib/billing/plans";
import {
  CHARGE_FAILS_CARD,
  GOOD_CARD,
  createLabCatalog,
  startHarness,
  submitCard,
  subscribeThroughCheckout,
  type Catalog,
  type Harness,
} from "./fake-support";

let h: Harness;
let catalog: Catalog;
const seatCents = getPlan("lab").seatPriceCents;

beforeAll(async () => {
  h = await startHarness();
  catalog = await createLabCatalog(h.stripe, "subs");
});
afterAll(async () => h?.close());

function seatItem(sub: Stripe.Subscription) {
  return sub.items.data.find((i) => i.price.id === catalog.seat.id)!;
}

describe("changing seats", () => {
  it("always_invoice: bills the prorated difference at once on a subscription_update invoice", async () => {
    const { subscription } = await subscribeThroughCheckout(h, catalog, 3);
    const item = seatItem(subscription);
    const s = item.current_period_start;
    const e = item.current_period_end;
    const t = s + Math.floor((e - s) / 3); // a third of the way into the period
    const updated = await h.stripe.subscriptions.update(subscription.id, {
      items: [{ id: item.id, quantity: 5 }],
      proration_behavior: "always_invoice",
      proration_date: t,
    });
    expect(seatItem(updated).quantity).toBe(5);

    const invoice = await h.stripe.invoices.retrieve(updated.latest_invoice as string);
    expect(invoice.billing_reason).toBe("subscription_update");
    expect(invoice.status).toBe("paid");
    const f = (e - t) / (e - s);
    const credit = -Math.round(3 * seatCents * f);
    const charge = Math.round(5 * seatCents * f);
    const amounts = invoice.lines.data.map((l) => l.amount).sort((a, b) => a - b);
    expect(amounts).toEqual([credit, charge]);
    expect(invoice.total).toBe(credit + charge);
    expect(invoice.amount_paid).toBe(credit + charge);
    for (const line of invoice.lines.data) {
      expect(line.parent?.subscription_item_details?.proration).toBe(true);
      expect(line.period).toEqual({ start: t, end: e });
    }
    expect(invoice.lines.data.find((l) => l.amount < 0)!.description).toMatch(
      /^Unused time on 3 × /,
    );
    expect(invoice.lines.data.find((l) => l.amount > 0)!.description).toMatch(
      /^Remaining time on 5 × /,
    );
  });

  it("downgrades credit the customer's balance, used by the next invoice", async () => {
    const { subscription, customer } = await subscribeThroughCheckout(h, catalog, 4);
    const item = seatItem(subscription);
    const updated = await h.stripe.subscriptions.update(subscription.id, {
      items: [{ id: item.id, quantity: 2 }],
      proration_behavior: "always_invoice",
    });
    const invoice = await h.stripe.invoices.retrieve(updated.latest_invoice as string);
    expect(invoice.total).toBeLessThan(0);
    expect(invoice.amount_due).toBe(0);
    expect(invoice.status).toBe("paid");
    const c = (await h.stripe.customers.retrieve(customer.id)) as Stripe.Customer;
    expect(c.balance).toBe(invoice.total); // negative = credit

    const preview = await h.stripe.invoices.createPreview({
      customer: customer.id,
      subscription: subscription.id,
    });
    expect(preview.starting_balance).toBe(invoice.total);
    expect(preview.amount_due).toBe(Math.max(0, 2 * seatCents + invoice.total));
  });

  it("create_prorations: keeps the lines pending for the next renewal invoice", async () => {
    const { subscription, customer } = await subscribeThroughCheckout(h, catalog, 2);
    const item = seatItem(subscription);
    const updated = await h.stripe.subscriptions.update(subscription.id, {
      items: [{ id: item.id, quantity: 3 }],
    });
    expect(updated.latest_invoice).toBe(subscription.latest_invoice); // no new invoice yet
    const preview = await h.stripe.invoices.createPreview({
      customer: customer.id,
      subscription: subscription.id,
    });
    expect(
      preview.lines.data.filter((l) => l.parent?.subscription_item_details?.proration),
    ).toHaveLength(2);

    await h.admin("/_fake/advance", { customer: customer.id, to: item.current_period_end });
    const renewal = (await h.stripe.invoices.list({ subscription: subscription.id, limit: 1 }))
      .data[0];
    expect(renewal.billing_reason).toBe("subscription_cycle");
    const prorations = renewal.lines.data.filter(
      (l) => l.parent?.subscription_item_details?.proration,
    );
    expect(prorations).toHaveLength(2);
    const seatLine = renewal.lines.data.find(
      (l) =>
        !l.parent?.subscription_item_details?.proration &&
        l.pricing?.price_details?.price === catalog.seat.id,
    )!;
    expect(seatLine.quantity).toBe(3);
    expect(seatLine.amount).toBe(3 * seatCents);
  });

  it("error_if_incomplete refuses the change with a card error when the charge would fail, changing nothing", async () => {
    const { subscription, customer } = await subscribeThroughCheckout(h, catalog, 2);
    await h.admin("/_fake/fail-next-payment", { customer: customer.id });
    const item = seatItem(subscription);
    await expect(
      h.stripe.subscriptions.update(subscription.id, {
        items: [{ id: item.id, quantity: 9 }],
        proration_behavior: "always_invoice",
        payment_behavior: "error_if_incomplete",
      }),
    ).rejects.toMatchObject({ type: "StripeCardError", statusCode: 402, code: "card_declined" });
    const after = await h.stripe.subscriptions.retrieve(subscription.id);
    expect(seatItem(after).quantity).toBe(2);
    expect((await h.stripe.invoices.list({ subscription: subscription.id })).data).toHaveLength(1);
    await h.admin("/_fake/fail-next-payment", { customer: customer.id, count: 0 });
  });

  it("refuses a quantity on a metered item and unknown items", async () => {
    const { subscription } = await subscribeThroughCheckout(h, catalog, 1);
    const metered = subscription.items.data.find((i) => i.price.id === catalog.shots.id)!;
    expect(metered.quantity).toBeUndefined();
    await expect(
      h.stripe.subscriptions.update(subscription.id, { items: [{ id: metered.id, quantity: 3 }] }),
    ).rejects.toMatchObject({ statusCode: 400, param: "items[0][quantity]" });
    await expect(
      h.stripe.subscriptions.update(subscription.id, { items: [{ id: "si_nope", quantity: 3 }] }),
    ).rejects.toMatchObject({ statusCode: 404, param: "items[0][id]" });
  });
});

describe("cancelling", () => {
  it("cancel_at_period_end keeps the subscription until the period ends, then deletes it", async () => {
    const { subscription, customer } = await subscribeThroughCheckout(h, catalog, 1);
    const end = seatItem(subscription).current_period_end;
    const updated = await h.stripe.subscriptions.update(subscription.id, {
      cancel_at_period_end: true,
    });
    expect(updated.cancel_at_period_end).toBe(true);
    expect(updated.cancel_at).toBe(end);
    expect(updated.status).toBe("active");
    await h.admin("/_fake/advance", { customer: customer.id, to: end });
    const after = await h.stripe.subscriptions.retrieve(subscription.id);
    expect(after.status).toBe("canceled");
    expect(after.ended_at).toBe(end);
    await h.flush();
    const deleted = h.receiver
      .accepted()
      .find(
        (e) =>
          e.type === "customer.subscription.deleted" &&
          (e.data.object as Stripe.Subscription).id === subscription.id,
      );
    expect(deleted).toBeDefined();
    // No seat invoice for a period that will not happen.
    const invoices = await h.stripe.invoices.list({ subscription: subscription.id });
    expect(
      invoices.data.every((i) =>
        i.lines.data.every(
          (l) => l.pricing?.price_details?.price !== catalog.seat.id || l.period.end <= end,
        ),
      ),
    ).toBe(true);
  });

  it("cancel now ends the subscription at once", async () => {
    const { subscription } = await subscribeThroughCheckout(h, catalog, 1);
    const canceled = await h.stripe.subscriptions.cancel(subscription.id);
    expect(canceled.status).toBe("canceled");
    expect(canceled.cancellation_details?.reason).toBe("cancellation_requested");
    await expect(
      h.stripe.subscriptions.update(subscription.id, { metadata: { a: "b" } }),
    ).rejects.toMatchObject({ statusCode: 400 });
  });
});

describe("billing portal", () => {
  it("lists invoices and the card, replaces the card and schedules cancellation", async () => {
    const { customer, subscription } = await subscribeThroughCheckout(h, catalog, 2);
    const session = await h.stripe.billingPortal.sessions.create({
      customer: customer.id,
      return_url: "http://localhost:3000/billing",
    });
    expect(session.object).toBe("billing_portal.session");
    const home = await (await fetch(session.url)).text();
    const invoice = await h.stripe.invoices.retrieve(subscription.latest_invoice as string);
    expect(home).toContain(invoice.number!);
    expect(home).toContain("visa ending in 4242");

    const replaced = await submitCard(`${session.url}/card`, {
      ...GOOD_CARD,
      number: "5555 5555 5555 4444",
    });
    expect(replaced.status).toBe(200);
    expect(replaced.html).toContain("Card saved.");
    const sub = await h.stripe.subscriptions.retrieve(subscription.id, {
      expand: ["default_payment_method"],
    });
    expect((sub.default_payment_method as Stripe.PaymentMethod).card?.last4).toBe("4444");

    const declined = await submitCard(`${session.url}/card`, {
      ...GOOD_CARD,
      number: "4000 0000 0000 0002",
    });
    expect(declined.status).toBe(402);
    expect(declined.html).toContain("Your card was declined.");

    const cancel = await submitCard(`${session.url}/cancel`, { subscription: subscription.id });
    expect(cancel.status).toBe(200);
    expect((await h.stripe.subscriptions.retrieve(subscription.id)).cancel_at_period_end).toBe(
      true,
    );
  });

  it("serves the hosted invoice page and a well-formed PDF", async () => {
    const { subscription } = await subscribeThroughCheckout(h, catalog, 2);
    const invoice = await h.stripe.invoices.retrieve(subscription.latest_invoice as string);
    const html = await (await fetch(invoice.hosted_invoice_url!)).text();
    expect(html).toContain(invoice.number!);
    const res = await fetch(invoice.invoice_pdf!);
    expect(res.headers.get("content-type")).toBe("application/pdf");
    const pdf = Buffer.from(await res.arrayBuffer()).toString("latin1");
    // PDF 1.4 structure (ISO 32000-1 §7.5): header, objects at the offsets the xref table gives, trailer.
    expect(pdf.startsWith("%PDF-1.4")).toBe(true);
    expect(pdf.trimEnd().endsWith("%%EOF")).toBe(true);
    const startxref = Number(/startxref\n(\d+)\n/.exec(pdf)![1]);
    expect(pdf.slice(startxref, startxref + 4)).toBe("xref");
    const entries = [...pdf.slice(startxref).matchAll(/^(\d{10}) 00000 n $/gm)].map((m) =>
      Number(m[1]),
    );
    expect(entries.length).toBeGreaterThan(5);
    entries.forEach((offset, i) =>
      expect(pdf.slice(offset, offset + `${i + 1} 0 obj`.length)).toBe(`${i + 1} 0 obj`),
    );
    expect(pdf).toContain(`(Number ${invoice.number})`);
    const bad = await fetch(
      invoice.invoice_pdf!.replace(/\/[A-Za-z0-9]+\/pdf$/, "/wrongtoken/pdf"),
    );
    expect(bad.status).toBe(404);
  });

  it("a card that saves but cannot be charged (…0341) makes the next renewal fail", async () => {
    const { customer, subscription } = await subscribeThroughCheckout(h, catalog, 1);
    const session = await h.stripe.billingPortal.sessions.create({ customer: customer.id });
    expect((await submitCard(`${session.url}/card`, CHARGE_FAILS_CARD)).status).toBe(200);
    await h.admin("/_fake/advance", {
      customer: customer.id,
      to: seatItem(subscription).current_period_end,
    });
    const sub = await h.stripe.subscriptions.retrieve(subscription.id);
    expect(sub.status).toBe("past_due");
  });
});

describe("creating subscriptions through the API", () => {
  it("charges the saved card, or stays incomplete without one, or refuses with error_if_incomplete", async () => {
    const withCard = await h.stripe.customers.create({ email: "api-card@lab.example" });
    const pm = await h.stripe.paymentMethods.attach("pm_card_visa", { customer: withCard.id });
    const active = await h.stripe.subscriptions.create({
      customer: withCard.id,
      items: [{ price: catalog.seat.id, quantity: 2 }],
      default_payment_method: pm.id,
    });
    expect(active.status).toBe("active");
    expect((await h.stripe.invoices.retrieve(active.latest_invoice as string)).amount_paid).toBe(
      2 * seatCents,
    );

    const noCard = await h.stripe.customers.create({ email: "api-nocard@lab.example" });
    await expect(
      h.stripe.subscriptions.create({
        customer: noCard.id,
        items: [{ price: catalog.seat.id }],
        payment_behavior: "error_if_incomplete",
      }),
    ).rejects.toMatchObject({ statusCode: 400, type: "StripeInvalidRequestError" });
    expect(
      (await h.stripe.subscriptions.list({ customer: noCard.id, status: "all" })).data,
    ).toHaveLength(0);
    const incomplete = await h.stripe.subscriptions.create({
      customer: noCard.id,
      items: [{ price: catalog.seat.id }],
    });
    expect(incomplete.status).toBe("incomplete");
    expect((await h.stripe.invoices.retrieve(incomplete.latest_invoice as string)).status).toBe(
      "open",
    );

    await expect(
      h.stripe.paymentMethods.attach("pm_card_chargeDeclined", { customer: noCard.id }),
    ).rejects.toMatchObject({
      statusCode: 402,
      code: "card_declined",
      decline_code: "generic_decline",
    });
  });
});

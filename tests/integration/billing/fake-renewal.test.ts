/**
 * Renewals on the payment fake's clock: metered overage reported through the
 * meter-events API ends up on the renewal invoice; failed renewal payments
 * give `invoice.payment_failed` and a `past_due` subscription, retried later.
 * Overage prices come from the plan table; the expected line amounts are
 * worked out here from the provider's documented pricing rules (package
 * pricing rounds the quantity up to whole packages; amounts round to cents).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type Stripe from "stripe";
import { getPlan } from "@/lib/billing/plans";
import {
  createLabCatalog,
  startHarness,
  subscribeThroughCheckout,
  type Catalog,
  type Harness,
} from "./fake-support";

let h: Harness;
let catalog: Catalog;
const lab = getPlan("lab");

beforeAll(async () => {
  h = await startHarness();
  catalog = await createLabCatalog(h.stripe, "renewal");
});
afterAll(async () => h?.close());

function periodOf(sub: Stripe.Subscription) {
  const item = sub.items.data[0];
  return { start: item.current_period_start, end: item.current_period_end };
}

function lineFor(invoice: Stripe.Invoice, price: Stripe.Price) {
  return invoice.lines.data.find((l) => l.pricing?.price_details?.price === price.id)!;
}

describe("renewal with metered overage", () => {
  it("bills the period's meter events on the renewal invoice, with next month's seats", async () => {
    const { customer, subscription } = await subscribeThroughCheckout(h, catalog, 3);
    const period = periodOf(subscription);
    const report = (event: string, value: number, identifier: string) =>
      h.stripe.billing.meterEvents.create({
        event_name: event,
        payload: { stripe_customer_id: customer.id, value: String(value) },
        identifier,
      });
    await report(catalog.shotsMeter.event_name, 12_345, "org42-shots-a");
    await report(catalog.shotsMeter.event_name, 40_000, "org42-shots-b");
    await report(catalog.shotsMeter.event_name, 40_000, "org42-shots-b"); // a retry: counted once
    await report(catalog.secondsMeter.event_name, 100, "org42-sec-a");
    const last = await report(catalog.secondsMeter.event_name, 23, "org42-sec-b");
    expect(last.object).toBe("billing.meter_event");

    const summary = await h.stripe.billing.meters.listEventSummaries(catalog.shotsMeter.id, {
      customer: customer.id,
      start_time: period.start,
      end_time: period.end,
    });
    expect(summary.data[0].aggregated_value).toBe(52_345);

    const advanced = await h.admin("/_fake/advance", { customer: customer.id, to: period.end });
    expect(advanced.due_items_run).toBe(1);
    const renewed = await h.stripe.subscriptions.retrieve(subscription.id);
    expect(periodOf(renewed).start).toBe(period.end);
    expect(renewed.status).toBe("active");

    const invoice = await h.stripe.invoices.retrieve(renewed.latest_invoice as string);
    expect(invoice.billing_reason).toBe("subscription_cycle");
    expect(invoice.status).toBe("paid");
    expect([invoice.period_start, invoice.period_end]).toEqual([period.start, period.end]);

    const shotBlocks = Math.ceil(52_345 / 1000); // 53 started blocks of 1,000
    const shots = lineFor(invoice, catalog.shots);
    expect(shots.quantity).toBe(shotBlocks);
    expect(shots.amount).toBe(shotBlocks * lab.overage!.shotsPer1000Cents);
    expect(shots.period).toEqual({ start: period.start, end: period.end });

    const seconds = lineFor(invoice, catalog.seconds);
    expect(seconds.quantity).toBe(123);
    // 123 s × 0.2 ¢ = 24.6 ¢ → 25 ¢ (round half up to whole cents).
    expect(seconds.amount).toBe(
      Math.round(123 * Number(lab.overage!.simulationSecondCentsDecimal)),
    );
    expect(seconds.amount).toBe(25);

    const seats = lineFor(invoice, catalog.seat);
    expect(seats.quantity).toBe(3);
    expect(seats.period.start).toBe(period.end);
    expect(invoice.total).toBe(3 * lab.seatPriceCents + shots.amount + seconds.amount);

    await h.flush();
    const created = h.receiver
      .accepted()
      .find(
        (e) => e.type === "invoice.created" && (e.data.object as Stripe.Invoice).id === invoice.id,
      );
    expect((created!.data.object as Stripe.Invoice).status).toBe("draft");
    expect(
      h.receiver
        .accepted()
        .some(
          (e) => e.type === "invoice.paid" && (e.data.object as Stripe.Invoice).id === invoice.id,
        ),
    ).toBe(true);
  });

  it("usage reported in the new period waits for the following renewal", async () => {
    const { customer, subscription } = await subscribeThroughCheckout(h, catalog, 1);
    const first = periodOf(subscription);
    await h.admin("/_fake/advance", { customer: customer.id, to: first.end });
    await h.stripe.billing.meterEvents.create({
      event_name: catalog.secondsMeter.event_name,
      payload: { stripe_customer_id: customer.id, value: "50" },
    });
    const sub = await h.stripe.subscriptions.retrieve(subscription.id);
    const firstRenewal = await h.stripe.invoices.retrieve(sub.latest_invoice as string);
    expect(lineFor(firstRenewal, catalog.seconds).quantity).toBe(0);
    const preview = await h.stripe.invoices.createPreview({
      customer: customer.id,
      subscription: subscription.id,
    });
    expect(lineFor(preview, catalog.seconds).quantity).toBe(50);
    await h.admin("/_fake/advance", { customer: customer.id, to: periodOf(sub).end });
    const second = (await h.stripe.invoices.list({ subscription: subscription.id, limit: 1 }))
      .data[0];
    expect(lineFor(second, catalog.seconds).quantity).toBe(50);
  });

  it("advancing several months renews once per month, periods back to back", async () => {
    const { customer, subscription } = await subscribeThroughCheckout(h, catalog, 2);
    await h.admin("/_fake/advance", { customer: customer.id, seconds: 95 * 86_400 });
    const invoices = (
      await h.stripe.invoices.list({ subscription: subscription.id })
    ).data.reverse();
    expect(invoices.map((i) => i.billing_reason)).toEqual([
      "subscription_create",
      "subscription_cycle",
      "subscription_cycle",
      "subscription_cycle",
    ]);
    const seatPeriods = invoices.map((i) => lineFor(i, catalog.seat).period);
    for (let k = 1; k < seatPeriods.length; k++)
      expect(seatPeriods[k].start).toBe(seatPeriods[k - 1].end);
    // Invoices are stamped with the time they fell due, not the moment of the advance.
    expect(invoices[1].created).toBe(seatPeriods[0].end);
  });

  it("rejects bad meter events with the provider's error shape", async () => {
    const { customer } = await subscribeThroughCheckout(h, catalog, 1);
    await expect(
      h.stripe.billing.meterEvents.create({
        event_name: "no_such_meter",
        payload: { stripe_customer_id: customer.id, value: "1" },
      }),
    ).rejects.toMatchObject({ statusCode: 400, param: "event_name" });
    await expect(
      h.stripe.billing.meterEvents.create({
        event_name: catalog.shotsMeter.event_name,
        payload: { stripe_customer_id: customer.id, value: "1.5" },
      }),
    ).rejects.toMatchObject({ statusCode: 400, param: "payload[value]" });
    await expect(
      h.stripe.billing.meterEvents.create({
        event_name: catalog.shotsMeter.event_name,
        payload: { stripe_customer_id: "cus_nobody", value: "1" },
      }),
    ).rejects.toMatchObject({ statusCode: 404 });
  });
});

describe("failed renewal payments", () => {
  it("gives invoice.payment_failed and past_due, then recovers on the retry three days later", async () => {
    const { customer, subscription } = await subscribeThroughCheckout(h, catalog, 2);
    const period = periodOf(subscription);
    await h.admin("/_fake/fail-next-payment", { customer: customer.id });
    await h.admin("/_fake/advance", { customer: customer.id, to: period.end });

    const pastDue = await h.stripe.subscriptions.retrieve(subscription.id);
    expect(pastDue.status).toBe("past_due");
    const invoice = await h.stripe.invoices.retrieve(pastDue.latest_invoice as string);
    expect(invoice.status).toBe("open");
    expect(invoice.attempt_count).toBe(1);
    expect(invoice.next_payment_attempt).toBe(period.end + 3 * 86_400);
    expect(((await h.stripe.customers.retrieve(customer.id)) as Stripe.Customer).delinquent).toBe(
      true,
    );

    await h.flush();
    const mine = (e: Stripe.Event) =>
      (e.data.object as { customer?: string }).customer === customer.id;
    const failed = h.receiver
      .accepted()
      .find((e) => e.type === "invoice.payment_failed" && mine(e));
    expect((failed!.data.object as Stripe.Invoice).id).toBe(invoice.id);
    const toPastDue = h.receiver
      .accepted()
      .find(
        (e) =>
          e.type === "customer.subscription.updated" &&
          mine(e) &&
          (e.data.object as Stripe.Subscription).status === "past_due",
      );
    expect(toPastDue!.data.previous_attributes).toMatchObject({ status: "active" });

    await h.admin("/_fake/advance", { customer: customer.id, seconds: 3 * 86_400 });
    const recovered = await h.stripe.invoices.retrieve(invoice.id);
    expect(recovered.status).toBe("paid");
    expect(recovered.attempt_count).toBe(2);
    expect((await h.stripe.subscriptions.retrieve(subscription.id)).status).toBe("active");
  });

  it("cancels the subscription after the last retry fails", async () => {
    const { customer, subscription } = await subscribeThroughCheckout(h, catalog, 1);
    await h.admin("/_fake/fail-next-payment", { customer: customer.id, count: 4 });
    await h.admin("/_fake/advance", {
      customer: customer.id,
      to: periodOf(subscription).end + 16 * 86_400,
    });
    const sub = await h.stripe.subscriptions.retrieve(subscription.id);
    expect(sub.status).toBe("canceled");
    expect(sub.cancellation_details?.reason).toBe("payment_failed");
    const invoice = await h.stripe.invoices.retrieve(sub.latest_invoice as string);
    expect(invoice.attempt_count).toBe(4);
    expect(invoice.next_payment_attempt).toBeNull();
  });

  it("an open invoice can be paid from the API with a new card", async () => {
    const { customer, subscription } = await subscribeThroughCheckout(h, catalog, 1);
    await h.admin("/_fake/fail-next-payment", { customer: customer.id });
    await h.admin("/_fake/advance", { customer: customer.id, to: periodOf(subscription).end });
    const open = (await h.stripe.invoices.list({ customer: customer.id, status: "open" })).data[0];
    await expect(
      h.stripe.invoices.pay(open.id, { payment_method: "pm_card_chargeDeclined" }),
    ).rejects.toMatchObject({
      type: "StripeCardError",
      code: "card_declined",
    });
    const paid = await h.stripe.invoices.pay(open.id, { payment_method: "pm_card_visa" });
    expect(paid.status).toBe("paid");
    expect((await h.stripe.subscriptions.retrieve(subscription.id)).status).toBe("active");
  });
});

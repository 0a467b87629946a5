/**
 * The payment fake's protocol, as the SDK sees it: webhook signatures that
 * `webhooks.constructEvent` accepts (and forgeries it rejects), delivery
 * retries, `Idempotency-Key`, authentication errors, list pagination,
 * `expand`, and state kept across a restart. Behaviour checked against the
 * provider's public API reference (errors, idempotent requests, pagination,
 * webhook signatures).
 */
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import Stripe from "stripe";
import { createStripe } from "@/lib/billing/stripe-client";
import {
  API_KEY,
  WEBHOOK_SECRET,
  createLabCatalog,
  startHarness,
  subscribeThroughCheckout,
  type Harness,
} from "./fake-support";

let h: Harness;

beforeAll(async () => {
  h = await startHarness();
});
afterAll(async () => h?.close());

describe("webhook deliveries", () => {
  it("are signed so that constructEvent accepts them, and forgeries fail", async () => {
    await h.stripe.customers.create({ email: "sig@lab.example" });
    await h.flush();
    const delivery = h.receiver.deliveries.find((d) => d.event?.type === "customer.created")!;
    expect(delivery.signature).toMatch(/^t=\d+,v1=[0-9a-f]{64}$/);
    const event = h.stripe.webhooks.constructEvent(
      delivery.raw,
      delivery.signature,
      WEBHOOK_SECRET,
    );
    expect(event.object).toBe("event");
    expect(event.id).toMatch(/^evt_/);

    const tampered = delivery.raw.replace("sig@lab.example", "evil@lab.example");
    expect(() =>
      h.stripe.webhooks.constructEvent(tampered, delivery.signature, WEBHOOK_SECRET),
    ).toThrow(Stripe.errors.StripeSignatureVerificationError);
    expect(() =>
      h.stripe.webhooks.constructEvent(delivery.raw, delivery.signature, "whsec_some_other_secret"),
    ).toThrow(Stripe.errors.StripeSignatureVerificationError);
    // A replay long after signing falls outside the default 300 s tolerance.
    const t = Number(/t=(\d+)/.exec(delivery.signature)![1]);
    expect(() =>
      h.stripe.webhooks.constructEvent(
        delivery.raw,
        delivery.signature,
        WEBHOOK_SECRET,
        undefined,
        undefined,
        (t + 301) * 1000,
      ),
    ).toThrow(/tolerance/);
  });

  it("are retried with the same event id after the receiver answers 500", async () => {
    h.receiver.failNext = 1;
    const customer = await h.stripe.customers.create({ email: "retry@lab.example" });
    await h.flush();
    const forCustomer = h.receiver.deliveries.filter(
      (d) =>
        d.event?.type === "customer.created" &&
        (d.event.data.object as Stripe.Customer).id === customer.id,
    );
    expect(forCustomer.map((d) => d.answered)).toEqual([500, 200]);
    expect(forCustomer[0].event!.id).toBe(forCustomer[1].event!.id);
    expect(forCustomer[0].raw).toBe(forCustomer[1].raw);
    const log = (await h.admin(`/_fake/deliveries?event=${forCustomer[0].event!.id}`)) as {
      data: { status: string; attempts: { status: number }[] }[];
    };
    expect(log.data[0].status).toBe("succeeded");
    expect(log.data[0].attempts.map((a) => a.status)).toEqual([500, 200]);
    const event = await h.stripe.events.retrieve(forCustomer[0].event!.id);
    expect(event.pending_webhooks).toBe(0);
  });

  it("give up after the bounded number of attempts", async () => {
    h.receiver.failNext = 10;
    const customer = await h.stripe.customers.create({ email: "down@lab.example" });
    await h.flush();
    h.receiver.failNext = 0;
    const tries = h.receiver.deliveries.filter(
      (d) =>
        d.event?.type === "customer.created" &&
        (d.event.data.object as Stripe.Customer).id === customer.id,
    );
    expect(tries).toHaveLength(4); // the harness allows 4 attempts
    const failed = await h.stripe.events.list({
      type: "customer.created",
      delivery_success: false,
    });
    expect(failed.data.some((e) => (e.data.object as Stripe.Customer).id === customer.id)).toBe(
      true,
    );
  });
});

describe("API conventions", () => {
  it("replays an Idempotency-Key with the same parameters and refuses it with different ones", async () => {
    const a = await h.stripe.customers.create(
      { email: "idem@lab.example" },
      { idempotencyKey: "create-idem-1" },
    );
    const b = await h.stripe.customers.create(
      { email: "idem@lab.example" },
      { idempotencyKey: "create-idem-1" },
    );
    expect(b.id).toBe(a.id);
    expect(b.lastResponse.headers["idempotent-replayed"]).toBe("true");
    expect((await h.stripe.customers.list({ email: "idem@lab.example" })).data).toHaveLength(1);
    await expect(
      h.stripe.customers.create(
        { email: "other@lab.example" },
        { idempotencyKey: "create-idem-1" },
      ),
    ).rejects.toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
  });

  it("answers missing, malformed and wrong keys with 401 in the provider's error shape", async () => {
    const none = await fetch(`${h.fake.url}/v1/customers`);
    expect(none.status).toBe(401);
    const body = (await none.json()) as { error: { type: string; message: string } };
    expect(body.error.type).toBe("invalid_request_error");
    expect(body.error.message).toMatch(/did not provide an API key/);

    const malformed = await fetch(`${h.fake.url}/v1/customers`, {
      headers: { Authorization: "Bearer not-a-key" },
    });
    expect(malformed.status).toBe(401);

    const wrong = createStripe({
      STRIPE_SECRET_KEY: "sk_test_wrong_key_1234",
      STRIPE_API_HOST: "127.0.0.1",
      STRIPE_API_PORT: h.fake.port,
      STRIPE_API_PROTOCOL: "http",
    });
    const err = await wrong.customers.list().catch((e: unknown) => e);
    expect(err).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
    expect((err as Stripe.errors.StripeError).message).toBe(
      "Invalid API Key provided: sk_test_**********1234",
    );
  });

  it("reports unknown URLs and unknown parameters as invalid requests", async () => {
    const res = await fetch(`${h.fake.url}/v1/charges`, {
      headers: { Authorization: `Bearer ${API_KEY}` },
    });
    expect(res.status).toBe(404);
    expect(((await res.json()) as { error: { message: string } }).error.message).toMatch(
      /Unrecognized request URL \(GET: \/v1\/charges\)/,
    );
    await expect(
      h.stripe.customers.create({ email: "x@y.z", shoe_size: 42 } as Stripe.CustomerCreateParams),
    ).rejects.toMatchObject({
      statusCode: 400,
      code: "parameter_unknown",
      param: "shoe_size",
    });
    await expect(h.stripe.customers.list({ limit: 500 })).rejects.toMatchObject({
      statusCode: 400,
      param: "limit",
    });
  });

  it("paginates lists newest first with has_more and starting_after (SDK auto-pagination)", async () => {
    const email = "page@lab.example";
    const ids: string[] = [];
    for (let i = 0; i < 7; i++)
      ids.push((await h.stripe.customers.create({ email, metadata: { i: String(i) } })).id);
    const first = await h.stripe.customers.list({ email, limit: 3 });
    expect(first.object).toBe("list");
    expect(first.url).toBe("/v1/customers");
    expect(first.has_more).toBe(true);
    expect(first.data.map((c) => c.id)).toEqual(ids.slice(-3).reverse());
    const all: string[] = [];
    for await (const c of h.stripe.customers.list({ email, limit: 2 })) all.push(c.id);
    expect(all).toEqual([...ids].reverse());
  });

  it("expands ids into objects along dotted paths", async () => {
    const catalog = await createLabCatalog(h.stripe, "protocol");
    const { subscription } = await subscribeThroughCheckout(h, catalog, 1);
    const invoices = await h.stripe.invoices.list({
      subscription: subscription.id,
      expand: ["data.customer"],
    });
    expect((invoices.data[0].customer as Stripe.Customer).object).toBe("customer");
    const sub = await h.stripe.subscriptions.retrieve(subscription.id, {
      expand: ["latest_invoice", "items.data.price.product"],
    });
    expect((sub.latest_invoice as Stripe.Invoice).object).toBe("invoice");
    expect((sub.items.data[0].price.product as Stripe.Product).object).toBe("product");
    await expect(
      h.stripe.subscriptions.retrieve(subscription.id, { expand: ["status"] }),
    ).rejects.toMatchObject({ statusCode: 400, param: "expand" });
  });

  it("parses decimal amounts into the SDK's Decimal type", async () => {
    const price = await h.stripe.prices.create({
      product_data: { name: "Tiny" },
      currency: "usd",
      unit_amount_decimal: Stripe.Decimal.from("0.0125"),
    });
    expect(price.unit_amount).toBeNull();
    expect(String(price.unit_amount_decimal)).toBe("0.0125");
  });
});

describe("persistence", () => {
  it("keeps customers, subscriptions and fake time across a restart when PAYMENT_FAKE_DATA is set", async () => {
    const dir = mkdtempSync(join(tmpdir(), "payment-fake-"));
    const file = join(dir, "state.json");
    try {
      const first = await startHarness({ dataFile: file });
      const catalog = await createLabCatalog(first.stripe, "persist");
      const { customer, subscription } = await subscribeThroughCheckout(first, catalog, 2);
      await first.admin("/_fake/advance", { customer: customer.id, seconds: 86_400 });
      const before = (await first.admin(`/_fake/now?customer=${customer.id}`)).now as number;
      await first.close();

      const second = await startHarness({ dataFile: file });
      try {
        const sub = await second.stripe.subscriptions.retrieve(subscription.id);
        expect(sub.status).toBe("active");
        expect(sub.items.data.find((i) => i.price.id === catalog.seat.id)!.quantity).toBe(2);
        const after = (await second.admin(`/_fake/now?customer=${customer.id}`)).now as number;
        expect(after - before).toBeGreaterThanOrEqual(0);
        expect(after - before).toBeLessThan(30);
      } finally {
        await second.close();
      }
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

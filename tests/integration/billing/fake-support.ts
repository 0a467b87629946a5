/**
 * Test harness for the payment fake: starts it in-process on a free port, a
 * local webhook receiver that verifies every delivery with the SDK's own
 * `webhooks.constructEvent`, and an SDK client from `lib/billing/stripe-client`.
 * Tests talk to the fake only through the SDK, plus plain HTTP for the
 * hosted pages and the `/_fake` controls — as the app and a browser would.
 */
import { createServer, type IncomingMessage, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import Stripe from "stripe";
import { startPaymentFake, type RunningPaymentFake } from "@/docker/payment-fake/app";
import { getPlan } from "@/lib/billing/plans";
import { createStripe } from "@/lib/billing/stripe-client";
import { fakeAdminClient, flushWebhooks } from "./fake-admin";

export const API_KEY = "sk_test_ketwise_fake_tests";
export const WEBHOOK_SECRET = "whsec_ketwise_fake_tests_secret";

export interface Delivery {
  raw: string;
  signature: string;
  /** The verified event, or null when constructEvent rejected the delivery. */
  event: Stripe.Event | null;
  answered: number;
}

export class WebhookReceiver {
  readonly deliveries: Delivery[] = [];
  /** Number of upcoming deliveries to answer with HTTP 500. */
  failNext = 0;
  private server!: Server;
  url = "";

  constructor(private readonly stripe: () => Stripe) {}

  async start(): Promise<void> {
    this.server = createServer(async (req, res) => {
      const raw = await readAll(req);
      const signature = String(req.headers["stripe-signature"] ?? "");
      let event: Stripe.Event | null = null;
      try {
        event = this.stripe().webhooks.constructEvent(raw, signature, WEBHOOK_SECRET);
      } catch {
        event = null;
      }
      const answered = event === null ? 400 : this.failNext > 0 ? 500 : 200;
      if (answered === 500) this.failNext -= 1;
      this.deliveries.push({ raw, signature, event, answered });
      res.writeHead(answered, { "Content-Type": "application/json" });
      res.end(JSON.stringify({ received: answered === 200 }));
    });
    await new Promise<void>((r) => this.server.listen(0, "127.0.0.1", r));
    this.url = `http://127.0.0.1:${(this.server.address() as AddressInfo).port}/api/webhooks/billing`;
  }

  /** Verified events that were accepted (2xx), in arrival order. */
  accepted(): Stripe.Event[] {
    return this.deliveries.filter((d) => d.answered === 200 && d.event).map((d) => d.event!);
  }

  types(filter?: (e: Stripe.Event) => boolean): string[] {
    return this.accepted()
      .filter((e) => !filter || filter(e))
      .map((e) => e.type);
  }

  async stop(): Promise<void> {
    this.server.closeAllConnections();
    await new Promise<void>((r) => this.server.close(() => r()));
  }
}

async function readAll(req: IncomingMessage): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const c of req) chunks.push(c as Buffer);
  return Buffer.concat(chunks).toString("utf8");
}

export interface Harness {
  fake: RunningPaymentFake;
  stripe: Stripe;
  receiver: WebhookReceiver;
  /** POST (or GET when body is undefined) to a `/_fake/...` control. */
  admin(path: string, body?: Record<string, unknown>): Promise<Record<string, unknown>>;
  /** Waits until every webhook has been delivered (or given up). */
  flush(): Promise<void>;
  close(): Promise<void>;
}

export async function startHarness(opts: { dataFile?: string } = {}): Promise<Harness> {
  // The receiver verifies with the SDK client, which needs the fake's port first.
  const ref: { stripe?: Stripe } = {};
  const receiver = new WebhookReceiver(() => ref.stripe!);
  await receiver.start();
  const fake = await startPaymentFake({
    port: 0,
    apiKey: API_KEY,
    webhookSecret: WEBHOOK_SECRET,
    webhookUrl: receiver.url,
    webhook: { baseDelayMs: 40, maxDelayMs: 200, maxAttempts: 4, timeoutMs: 2000 },
    dataFile: opts.dataFile ?? null,
    tickMs: 200,
  });
  const stripe = createStripe({
    STRIPE_SECRET_KEY: API_KEY,
    STRIPE_API_HOST: "127.0.0.1",
    STRIPE_API_PORT: fake.port,
    STRIPE_API_PROTOCOL: "http",
  });
  ref.stripe = stripe;
  const admin = fakeAdminClient(fake.url, API_KEY);
  return {
    fake,
    stripe,
    receiver,
    admin,
    flush: () => flushWebhooks(admin, 10_000),
    async close() {
      await fake.close();
      await receiver.stop();
    },
  };
}

export interface Catalog {
  seat: Stripe.Price;
  shots: Stripe.Price;
  seconds: Stripe.Price;
  shotsMeter: Stripe.Billing.Meter;
  secondsMeter: Stripe.Billing.Meter;
}

/**
 * The Lab plan's prices, built from the plan table: a per-seat licensed
 * price, and metered overage prices for shots (per started 1,000) and
 * simulation-seconds.
 */
export async function createLabCatalog(stripe: Stripe, suffix: string): Promise<Catalog> {
  const lab = getPlan("lab");
  const shotsMeter = await stripe.billing.meters.create({
    display_name: "Shots",
    event_name: `ketwise_shots_${suffix}`,
    default_aggregation: { formula: "sum" },
  });
  const secondsMeter = await stripe.billing.meters.create({
    display_name: "Simulation seconds",
    event_name: `ketwise_sim_seconds_${suffix}`,
    default_aggregation: { formula: "sum" },
  });
  const product = await stripe.products.create({
    name: `${lab.name} seat`,
    metadata: { plan: lab.id },
  });
  const seat = await stripe.prices.create({
    product: product.id,
    currency: lab.currency,
    unit_amount: lab.seatPriceCents,
    recurring: { interval: "month", usage_type: "licensed" },
  });
  const shots = await stripe.prices.create({
    product_data: { name: `${lab.name} shots overage` },
    currency: lab.currency,
    unit_amount_decimal: Stripe.Decimal.from(lab.overage!.shotsPer1000Cents),
    recurring: { interval: "month", usage_type: "metered", meter: shotsMeter.id },
    transform_quantity: { divide_by: 1000, round: "up" },
  });
  const seconds = await stripe.prices.create({
    product_data: { name: `${lab.name} simulation-seconds overage` },
    currency: lab.currency,
    unit_amount_decimal: Stripe.Decimal.from(lab.overage!.simulationSecondCentsDecimal),
    recurring: { interval: "month", usage_type: "metered", meter: secondsMeter.id },
  });
  return { seat, shots, seconds, shotsMeter, secondsMeter };
}

export const GOOD_CARD = {
  number: "4242 4242 4242 4242",
  expiry: "12 / 34",
  cvc: "123",
  name: "Ada Lovelace",
};
export const DECLINED_CARD = { ...GOOD_CARD, number: "4000 0000 0000 0002" };
/** Saves fine, but every later charge fails (the provider's documented test number). */
export const CHARGE_FAILS_CARD = { ...GOOD_CARD, number: "4000 0000 0000 0341" };

/** Submits the hosted payment form like a browser; returns status, redirect and page text. */
export async function submitCard(
  pageUrl: string,
  card: Record<string, string>,
): Promise<{ status: number; location: string | null; html: string }> {
  const res = await fetch(pageUrl, {
    method: "POST",
    headers: { "Content-Type": "application/x-www-form-urlencoded" },
    body: new URLSearchParams(card).toString(),
    redirect: "manual",
  });
  return { status: res.status, location: res.headers.get("location"), html: await res.text() };
}

/** Creates a customer and a paid Lab subscription (3 seats + both overage prices) through checkout. */
export async function subscribeThroughCheckout(
  h: Harness,
  catalog: Catalog,
  seats = 3,
): Promise<{
  customer: Stripe.Customer;
  subscription: Stripe.Subscription;
  session: Stripe.Checkout.Session;
}> {
  const customer = await h.stripe.customers.create({
    email: `admin+${Date.now()}@lab.example`,
    name: "Lab Admin",
  });
  const session = await h.stripe.checkout.sessions.create({
    mode: "subscription",
    customer: customer.id,
    line_items: [
      { price: catalog.seat.id, quantity: seats },
      { price: catalog.shots.id },
      { price: catalog.seconds.id },
    ],
    success_url: "http://localhost:3000/billing?session={CHECKOUT_SESSION_ID}",
    cancel_url: "http://localhost:3000/billing",
  });
  const paid = await submitCard(session.url!, GOOD_CARD);
  if (paid.status !== 303)
    throw new Error(`checkout failed: ${paid.status} ${paid.html.slice(0, 300)}`);
  const done = await h.stripe.checkout.sessions.retrieve(session.id, { expand: ["subscription"] });
  return { customer, subscription: done.subscription as Stripe.Subscription, session: done };
}

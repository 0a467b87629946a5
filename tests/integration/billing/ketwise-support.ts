/**
 * Harness for Ketwise's billing against the payment fake: the fake runs
 * in-process on a free port and delivers its signed webhooks to a small HTTP
 * server that hands each delivery, unchanged, to the app's real route handler
 * (app/api/webhooks/billing/route.ts). The app's own SDK client points at the
 * fake through the same environment variables a deployment would set, written
 * before anything reads the environment.
 */
import { createServer, type IncomingMessage, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { startPaymentFake, type RunningPaymentFake } from "@/docker/payment-fake/app";
import { fakeAdminClient, flushWebhooks } from "./fake-admin";

export const TEST_API_KEY = "sk_test_ketwise_admin_billing";
export const TEST_WEBHOOK_SECRET = "whsec_ketwise_admin_billing_secret";

export type Delivered = {
  status: number;
  body: Record<string, unknown>;
  raw: string;
  signature: string;
};

async function readAll(req: IncomingMessage): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const c of req) chunks.push(c as Buffer);
  return Buffer.concat(chunks).toString("utf8");
}

export type BillingHarness = {
  fake: RunningPaymentFake;
  deliveries: Delivered[];
  admin(path: string, body?: Record<string, unknown>): Promise<Record<string, unknown>>;
  flush(): Promise<void>;
  /** Posts a body + signature straight to the route handler. */
  post(
    raw: string,
    signature: string | null,
  ): Promise<{ status: number; body: Record<string, unknown> }>;
  close(): Promise<void>;
};

export async function startBillingHarness(): Promise<BillingHarness> {
  const { POST } = await import("@/app/api/webhooks/billing/route");
  const deliveries: Delivered[] = [];
  const post = async (raw: string, signature: string | null) => {
    const headers: Record<string, string> = { "content-type": "application/json" };
    if (signature) headers["stripe-signature"] = signature;
    const res = await POST(
      new Request("http://localhost/api/webhooks/billing", { method: "POST", headers, body: raw }),
    );
    return { status: res.status, body: (await res.json()) as Record<string, unknown> };
  };
  const server: Server = createServer(async (req, res) => {
    const raw = await readAll(req);
    const signature = String(req.headers["stripe-signature"] ?? "");
    const answer = await post(raw, signature);
    deliveries.push({ ...answer, raw, signature });
    res.writeHead(answer.status, { "content-type": "application/json" });
    res.end(JSON.stringify(answer.body));
  });
  await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
  const hookUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}/api/webhooks/billing`;
  const fake = await startPaymentFake({
    port: 0,
    apiKey: TEST_API_KEY,
    webhookSecret: TEST_WEBHOOK_SECRET,
    webhookUrl: hookUrl,
    webhook: { baseDelayMs: 50, maxDelayMs: 300, maxAttempts: 4, timeoutMs: 10_000 },
    tickMs: 200,
  });
  Object.assign(process.env, {
    STRIPE_SECRET_KEY: TEST_API_KEY,
    STRIPE_WEBHOOK_SECRET: TEST_WEBHOOK_SECRET,
    STRIPE_API_HOST: "127.0.0.1",
    STRIPE_API_PORT: String(fake.port),
    STRIPE_API_PROTOCOL: "http",
  });
  const admin = fakeAdminClient(fake.url, TEST_API_KEY);
  return {
    fake,
    deliveries,
    admin,
    post,
    flush: () => flushWebhooks(admin, 20_000),
    async close() {
      await fake.close();
      server.closeAllConnections();
      await new Promise<void>((r) => server.close(() => r()));
    },
  };
}

/** Pays a hosted checkout page like a browser would; returns the redirect. */
export async function payOnHostedPage(url: string, number = "4242 4242 4242 4242") {
  const res = await fetch(url, {
    method: "POST",
    headers: { "Content-Type": "application/x-www-form-urlencoded" },
    body: new URLSearchParams({
      number,
      expiry: "12 / 34",
      cvc: "123",
      name: "Ada Admin",
    }).toString(),
    redirect: "manual",
  });
  return { status: res.status, location: res.headers.get("location"), html: await res.text() };
}

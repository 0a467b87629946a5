import { createServer } from "node:http";
import type { AddressInfo } from "node:net";
import { describe, expect, it } from "vitest";
import { StripeConfigError, createStripe, parseStripeEnv } from "@/lib/billing/stripe-client";

describe("payment provider configuration", () => {
  it("defaults to the local fake on 127.0.0.1:12111 over http", () => {
    const env = parseStripeEnv({ STRIPE_SECRET_KEY: "sk_test_abcdefgh" });
    expect(env).toEqual({
      STRIPE_SECRET_KEY: "sk_test_abcdefgh",
      STRIPE_API_HOST: "127.0.0.1",
      STRIPE_API_PORT: 12111,
      STRIPE_API_PROTOCOL: "http",
    });
  });

  it("names each bad variable", () => {
    let error: unknown;
    try {
      parseStripeEnv({ STRIPE_API_PROTOCOL: "ftp", STRIPE_API_PORT: "99999" });
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(StripeConfigError);
    const text = (error as StripeConfigError).issues.join("\n");
    expect(text).toMatch(/STRIPE_API_PROTOCOL/);
    expect(text).toMatch(/STRIPE_API_PORT/);
  });

  it("sends SDK requests to the configured host and port with the secret key as Bearer auth", async () => {
    const seen: { url?: string; auth?: string; version?: string } = {};
    const server = createServer((req, res) => {
      seen.url = req.url;
      seen.auth = req.headers.authorization;
      seen.version = String(req.headers["stripe-version"]);
      res.writeHead(200, { "Content-Type": "application/json" });
      res.end(JSON.stringify({ id: "cus_1", object: "customer" }));
    });
    await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
    try {
      const port = (server.address() as AddressInfo).port;
      const stripe = createStripe({
        STRIPE_SECRET_KEY: "sk_test_client_check",
        STRIPE_API_HOST: "127.0.0.1",
        STRIPE_API_PORT: port,
        STRIPE_API_PROTOCOL: "http",
      });
      const customer = await stripe.customers.retrieve("cus_1");
      expect(customer.id).toBe("cus_1");
      expect(seen.url).toBe("/v1/customers/cus_1");
      expect(seen.auth).toBe("Bearer sk_test_client_check");
      expect(seen.version).toMatch(/^\d{4}-\d{2}-\d{2}\./);
    } finally {
      server.close();
    }
  });
});

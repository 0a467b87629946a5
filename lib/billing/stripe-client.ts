/**
 * The payment provider's official SDK, configured from the environment.
 * Locally (and in tests) it points at the fake in `docker/payment-fake/`;
 * in a real deployment at the provider, by changing only the variables:
 *   STRIPE_SECRET_KEY    secret key (test-mode `sk_test_…` for the fake)
 *   STRIPE_API_HOST      default 127.0.0.1
 *   STRIPE_API_PORT      default 12111 (the fake's port)
 *   STRIPE_API_PROTOCOL  http | https, default http
 * `getStripe()` reads them through `lib/env.ts` (the one validated
 * environment); `parseStripeEnv` validates just these four, for scripts and
 * tests that have no database or auth settings.
 */
import Stripe from "stripe";
import { envSchema, getEnv } from "@/lib/env";

export const stripeEnvSchema = envSchema.pick({
  STRIPE_SECRET_KEY: true,
  STRIPE_API_HOST: true,
  STRIPE_API_PORT: true,
  STRIPE_API_PROTOCOL: true,
});

export type StripeEnv = ReturnType<typeof stripeEnvSchema.parse>;

/** Thrown when the payment variables are missing or malformed. */
export class StripeConfigError extends Error {
  constructor(readonly issues: string[]) {
    super(`Invalid payment provider configuration:\n  ${issues.join("\n  ")}`);
    this.name = "StripeConfigError";
  }
}

export function parseStripeEnv(source: Record<string, string | undefined>): StripeEnv {
  const result = stripeEnvSchema.safeParse(source);
  if (!result.success) {
    throw new StripeConfigError(
      result.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`),
    );
  }
  return result.data;
}

/** A new SDK client for the given settings (used directly by tests). */
export function createStripe(config: StripeEnv): Stripe {
  return new Stripe(config.STRIPE_SECRET_KEY, {
    host: config.STRIPE_API_HOST,
    port: config.STRIPE_API_PORT,
    protocol: config.STRIPE_API_PROTOCOL,
    // POSTs carry an idempotency key, so network retries never double-charge.
    maxNetworkRetries: 2,
    timeout: 15_000,
    telemetry: false,
    appInfo: { name: "Ketwise" },
  });
}

let cached: Stripe | undefined;

/** The process-wide SDK client, built from the validated environment on first use. */
export function getStripe(): Stripe {
  cached ??= createStripe(getEnv());
  return cached;
}

/**
 * The fake's environment, validated once at start:
 *   PAYMENT_FAKE_PORT         listen port (default 12111)
 *   PAYMENT_FAKE_HOST         listen address (default 127.0.0.1; 0.0.0.0 in a container)
 *   PAYMENT_FAKE_PUBLIC_URL   base of hosted pages as browsers reach it (default http://localhost:<port>)
 *   PAYMENT_FAKE_WEBHOOK_URL  where events are POSTed (default http://127.0.0.1:3000/api/webhooks/billing; empty = off)
 *   STRIPE_WEBHOOK_SECRET     signing secret shared with the app (required)
 *   STRIPE_SECRET_KEY         if set, the only API key accepted (else any sk_test_… key)
 *   PAYMENT_FAKE_DATA         optional JSON file to keep state across restarts
 *   PAYMENT_FAKE_WEBHOOK_MAX_ATTEMPTS / _RETRY_BASE_MS / _RETRY_MAX_MS   delivery retry policy
 */
import { z } from "zod";
import type { PaymentFakeOptions } from "./app";

const port = z.coerce.number().int().min(0).max(65_535);

const schema = z.object({
  PAYMENT_FAKE_PORT: port.default(12111),
  PAYMENT_FAKE_HOST: z.string().default("127.0.0.1"),
  PAYMENT_FAKE_PUBLIC_URL: z.url().optional(),
  PAYMENT_FAKE_WEBHOOK_URL: z
    .union([z.literal(""), z.url()])
    .default("http://127.0.0.1:3000/api/webhooks/billing"),
  STRIPE_WEBHOOK_SECRET: z
    .string()
    .min(8, "must be set (at least 8 characters) and shared with the app"),
  STRIPE_SECRET_KEY: z
    .string()
    .regex(/^(sk|rk)_test_\w{4,}$/, "must be a test-mode key like sk_test_…")
    .optional(),
  PAYMENT_FAKE_DATA: z.string().optional(),
  PAYMENT_FAKE_WEBHOOK_MAX_ATTEMPTS: z.coerce.number().int().min(1).max(50).default(8),
  PAYMENT_FAKE_WEBHOOK_RETRY_BASE_MS: z.coerce.number().int().min(10).default(1000),
  PAYMENT_FAKE_WEBHOOK_RETRY_MAX_MS: z.coerce.number().int().min(10).default(60_000),
});

export function optionsFromEnv(env: Record<string, string | undefined>): PaymentFakeOptions {
  const parsed = schema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Invalid payment-fake environment:\n${lines.join("\n")}`);
  }
  const e = parsed.data;
  return {
    port: e.PAYMENT_FAKE_PORT,
    host: e.PAYMENT_FAKE_HOST,
    publicUrl: (e.PAYMENT_FAKE_PUBLIC_URL ?? `http://localhost:${e.PAYMENT_FAKE_PORT}`).replace(
      /\/$/,
      "",
    ),
    apiKey: e.STRIPE_SECRET_KEY ?? null,
    webhookSecret: e.STRIPE_WEBHOOK_SECRET,
    webhookUrl: e.PAYMENT_FAKE_WEBHOOK_URL,
    dataFile: e.PAYMENT_FAKE_DATA || null,
    webhook: {
      maxAttempts: e.PAYMENT_FAKE_WEBHOOK_MAX_ATTEMPTS,
      baseDelayMs: e.PAYMENT_FAKE_WEBHOOK_RETRY_BASE_MS,
      maxDelayMs: e.PAYMENT_FAKE_WEBHOOK_RETRY_MAX_MS,
    },
  };
}

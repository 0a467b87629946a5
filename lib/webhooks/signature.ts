/**
 * Webhook signatures. Every delivery attempt carries
 *
 *   Ketwise-Webhook-Id:        the delivery id (the same on every retry: deduplicate by it)
 *   Ketwise-Webhook-Timestamp: Unix time of the attempt, in seconds
 *   Ketwise-Webhook-Signature: v1=<hex HMAC-SHA256(secret, "<timestamp>.<raw body>")>
 *
 * HMAC per RFC 2104 with SHA-256 (FIPS 180-4). A receiver recomputes the HMAC over
 * the timestamp, a dot and the raw request body exactly as received, compares it in
 * constant time, and rejects timestamps older than a few minutes (replays).
 */
import { createHmac, timingSafeEqual } from "node:crypto";

export const SIGNATURE_VERSION = "v1";

export function signWebhook(secret: string, timestamp: number, body: string): string {
  return createHmac("sha256", secret).update(`${timestamp}.${body}`).digest("hex");
}

export function webhookHeaders(
  secret: string,
  deliveryId: string,
  body: string,
  now = Date.now(),
): Record<string, string> {
  const timestamp = Math.floor(now / 1000);
  return {
    "content-type": "application/json",
    "user-agent": "Ketwise-Webhooks/1",
    "ketwise-webhook-id": deliveryId,
    "ketwise-webhook-timestamp": String(timestamp),
    "ketwise-webhook-signature": `${SIGNATURE_VERSION}=${signWebhook(secret, timestamp, body)}`,
  };
}

/** Receiver-side check (the reference the docs describe): signature valid and timestamp within `toleranceSeconds`. */
export function verifyWebhook(
  secret: string,
  headers: { timestamp: string | null; signature: string | null },
  body: string,
  options: { toleranceSeconds?: number; now?: number } = {},
): boolean {
  const timestamp = Number(headers.timestamp);
  if (!Number.isInteger(timestamp)) return false;
  const age = Math.abs((options.now ?? Date.now()) / 1000 - timestamp);
  if (age > (options.toleranceSeconds ?? 300)) return false;
  const expected = Buffer.from(`${SIGNATURE_VERSION}=${signWebhook(secret, timestamp, body)}`);
  const given = Buffer.from(headers.signature ?? "");
  return given.length === expected.length && timingSafeEqual(given, expected);
}

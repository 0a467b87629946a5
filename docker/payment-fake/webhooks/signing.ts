/**
 * Webhook signatures as the SDK's `webhooks.constructEvent` checks them:
 *   Stripe-Signature: t=<unix seconds>,v1=<hex HMAC-SHA256(secret, "<t>.<payload>")>
 * The timestamp is real time (the receiver compares it with its own clock,
 * 300 s tolerance by default), even when fake time has been advanced.
 */
import { createHmac } from "node:crypto";

export function signPayload(payload: string, secret: string, timestamp: number): string {
  const v1 = createHmac("sha256", secret).update(`${timestamp}.${payload}`, "utf8").digest("hex");
  return `t=${timestamp},v1=${v1}`;
}

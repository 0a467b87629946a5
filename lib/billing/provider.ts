/**
 * Calls to the payment provider, and what their failures mean to a user.
 * Every SDK call that changes something runs before Ketwise's own writes, so a
 * failure leaves Ketwise's tables untouched; this module turns the SDK's typed
 * errors into ProblemErrors with plain messages:
 *   card declined → 402 with the provider's reason;
 *   provider unreachable or failing (connection, 5xx, rate limit) → 503;
 *   anything else (a request the provider refused) → 502, logged with an id.
 */
import "server-only";
import Stripe from "stripe";
import { newErrorId, ProblemError } from "@/lib/api/problem";

export const PROVIDER_DOWN_MESSAGE =
  "The payment provider can't be reached right now. Nothing was changed; try again in a minute.";

/** Short timeouts for page loads: a page should say "unavailable" quickly rather than hang. */
export const PAGE_REQUEST = { maxNetworkRetries: 0, timeout: 5_000 } as const;

export function isProviderUnavailable(error: unknown): boolean {
  if (error instanceof Stripe.errors.StripeConnectionError) return true;
  if (error instanceof Stripe.errors.StripeRateLimitError) return true;
  if (error instanceof Stripe.errors.StripeAPIError) return true;
  if (error instanceof Stripe.errors.StripeError) return (error.statusCode ?? 0) >= 500;
  return false;
}

export function providerProblem(error: unknown): ProblemError {
  if (error instanceof ProblemError) return error;
  if (error instanceof Stripe.errors.StripeCardError) {
    return new ProblemError({
      type: "/problems/card-declined",
      title: "Card declined",
      status: 402,
      detail: `${error.message} Your plan and seats are unchanged; update the card under "Card and invoices" and try again.`,
    });
  }
  if (isProviderUnavailable(error)) {
    return new ProblemError({
      type: "/problems/payment-provider-unavailable",
      title: "Payment provider unavailable",
      status: 503,
      detail: PROVIDER_DOWN_MESSAGE,
    });
  }
  const id = newErrorId();
  console.error(`[ketwise] payment provider refused a request (error id ${id})`, error);
  return new ProblemError({
    type: "/problems/payment-provider-error",
    title: "Payment provider error",
    status: 502,
    detail: `The payment provider refused the request (error id ${id}). Nothing was changed.`,
  });
}

/** Runs provider calls, mapping their failures to ProblemErrors. */
export async function withProvider<T>(fn: () => Promise<T>): Promise<T> {
  try {
    return await fn();
  } catch (error) {
    throw providerProblem(error);
  }
}

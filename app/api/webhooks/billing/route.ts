/**
 * POST /api/webhooks/billing — events from the payment provider. The raw body
 * is read as text (signature verification needs the exact bytes); see
 * lib/billing/webhook.ts for verification, idempotency and effects.
 * 400 problem+json: bad signature; 200 JSON: applied / duplicate / ignored;
 * 500 problem+json: a fault on our side (the provider retries).
 */
import { badRequest, problemResponse, toProblem } from "@/lib/api/problem";
import { handleBillingWebhook } from "@/lib/billing/webhook";

export const dynamic = "force-dynamic";

export async function POST(req: Request): Promise<Response> {
  try {
    const raw = await req.text();
    const outcome = await handleBillingWebhook(raw, req.headers.get("stripe-signature"));
    if (outcome.status === 400) return problemResponse(badRequest(outcome.reason).problem);
    return Response.json({ received: true, ...outcome });
  } catch (error) {
    return problemResponse(toProblem(error, "POST /api/webhooks/billing"));
  }
}

/**
 * POST /api/webhooks/billing — events from the payment provider. The raw body
 * is read as text (signature verification needs the exact bytes); see
 * lib/billing/webhook.ts for verification, idempotency and effects.
 * Bodies over WEBHOOK_MAX_BODY_BYTES answer 413 before they are read (provider
 * events are a few KiB; the cap stops a forged megabyte body costing memory).
 * 400 problem+json: bad signature; 200 JSON: applied / duplicate / ignored;
 * 500 problem+json: a fault on our side (the provider retries).
 */
import { badRequest, problemResponse, toProblem } from "@/lib/api/problem";
import { handleBillingWebhook, WEBHOOK_MAX_BODY_BYTES } from "@/lib/billing/webhook";
import { readText } from "@/lib/openapi/request";

export const dynamic = "force-dynamic";

export async function POST(req: Request): Promise<Response> {
  try {
    const raw = await readText(req, WEBHOOK_MAX_BODY_BYTES);
    const outcome = await handleBillingWebhook(raw, req.headers.get("stripe-signature"));
    if (outcome.status === 400) return problemResponse(badRequest(outcome.reason).problem);
    return Response.json({ received: true, ...outcome });
  } catch (error) {
    return problemResponse(toProblem(error, "POST /api/webhooks/billing"));
  }
}

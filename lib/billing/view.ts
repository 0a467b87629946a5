/**
 * What the billing page shows from the payment provider: the subscription's
 * period and scheduled cancellation, the upcoming invoice (a preview of the
 * next renewal) and recent invoices with their hosted page and PDF. Read with
 * short timeouts and no retries; when the provider cannot be reached the
 * result says so and the page shows Ketwise's own figures only.
 */
import "server-only";
import type Stripe from "stripe";
import type { Organization } from "@/db/schema";
import { isProviderUnavailable, PAGE_REQUEST, PROVIDER_DOWN_MESSAGE } from "./provider";
import { getStripe } from "./stripe-client";

export type InvoiceRow = {
  id: string;
  number: string | null;
  created: Date;
  total: number;
  currency: string;
  status: string | null;
  reason: string | null;
  hostedUrl: string | null;
  pdfUrl: string | null;
};

export type ProviderView =
  | {
      ok: true;
      subscription: {
        status: string;
        periodStart: Date | null;
        periodEnd: Date | null;
        cancelAtPeriodEnd: boolean;
      } | null;
      upcoming: {
        total: number;
        currency: string;
        date: Date | null;
        lines: { description: string; amount: number }[];
      } | null;
      invoices: InvoiceRow[];
    }
  | { ok: false; message: string };

const date = (unix: number | null | undefined) => (unix ? new Date(unix * 1000) : null);

function invoiceRow(i: Stripe.Invoice): InvoiceRow {
  return {
    id: i.id ?? "",
    number: i.number ?? null,
    created: new Date(i.created * 1000),
    total: i.total,
    currency: i.currency,
    status: i.status ?? null,
    reason: i.billing_reason ?? null,
    hostedUrl: i.hosted_invoice_url ?? null,
    pdfUrl: i.invoice_pdf ?? null,
  };
}

export async function loadProviderView(
  org: Pick<Organization, "stripeCustomerId" | "stripeSubscriptionId">,
): Promise<ProviderView> {
  if (!org.stripeCustomerId) return { ok: true, subscription: null, upcoming: null, invoices: [] };
  const stripe = getStripe();
  try {
    const [invoices, sub] = await Promise.all([
      stripe.invoices.list({ customer: org.stripeCustomerId, limit: 12 }, PAGE_REQUEST),
      org.stripeSubscriptionId
        ? stripe.subscriptions.retrieve(org.stripeSubscriptionId, {}, PAGE_REQUEST)
        : Promise.resolve(null),
    ]);
    let upcoming: Extract<ProviderView, { ok: true }>["upcoming"] = null;
    if (sub && sub.status !== "canceled" && !sub.cancel_at_period_end) {
      const preview = await stripe.invoices.createPreview(
        { customer: org.stripeCustomerId, subscription: sub.id },
        PAGE_REQUEST,
      );
      upcoming = {
        total: preview.total,
        currency: preview.currency,
        date: date(preview.period_end) ?? date(sub.items.data[0]?.current_period_end),
        lines: preview.lines.data.map((l) => ({
          description: l.description ?? "",
          amount: l.amount,
        })),
      };
    }
    const item = sub?.items.data[0];
    return {
      ok: true,
      subscription: sub
        ? {
            status: sub.status,
            periodStart: date(item?.current_period_start),
            periodEnd: date(item?.current_period_end),
            cancelAtPeriodEnd: sub.cancel_at_period_end,
          }
        : null,
      upcoming,
      invoices: invoices.data.map(invoiceRow),
    };
  } catch (error) {
    if (isProviderUnavailable(error))
      return {
        ok: false,
        message: PROVIDER_DOWN_MESSAGE.replace(" Nothing was changed; try again in a minute.", ""),
      };
    console.error("[ketwise] billing page: provider read failed", error);
    return {
      ok: false,
      message:
        "The payment provider answered with an error; invoices and the upcoming charge can't be shown right now.",
    };
  }
}

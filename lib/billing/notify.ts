/** Billing e-mails to an organisation's owners and admins (best effort: a failed send is logged, never retried here). */
import "server-only";
import type Stripe from "stripe";
import { sendMail } from "@/lib/mail/transport";
import { invoiceAvailableMail, paymentFailedMail } from "@/lib/mail/templates";
import { billingUrl } from "./checkout";
import { listBillingContacts } from "./queries";
import { formatLongDate, formatMoney } from "@/lib/format";

const date = (unix: number) => formatLongDate(unix * 1000);

async function sendToContacts(
  orgId: string,
  build: () => { subject: string; text: string; html: string },
) {
  const contacts = await listBillingContacts(orgId);
  const mail = build();
  const results = await Promise.allSettled(contacts.map((c) => sendMail({ to: c.email, ...mail })));
  results.forEach((r, i) => {
    if (r.status === "rejected")
      console.error(
        `[ketwise] billing mail "${mail.subject}" to ${contacts[i].email} failed`,
        r.reason,
      );
  });
  return contacts.length;
}

export function mailPaymentFailed(org: { id: string; name: string }, invoice: Stripe.Invoice) {
  return sendToContacts(org.id, () =>
    paymentFailedMail({
      orgName: org.name,
      amount: formatMoney(invoice.amount_due, invoice.currency),
      invoiceNumber: invoice.number ?? invoice.id ?? "",
      payUrl: invoice.hosted_invoice_url ?? billingUrl(),
      billingUrl: billingUrl(),
      nextAttempt: invoice.next_payment_attempt ? date(invoice.next_payment_attempt) : null,
    }),
  );
}

export function mailInvoiceAvailable(org: { id: string; name: string }, invoice: Stripe.Invoice) {
  return sendToContacts(org.id, () =>
    invoiceAvailableMail({
      orgName: org.name,
      amount: formatMoney(invoice.amount_paid, invoice.currency),
      invoiceNumber: invoice.number ?? invoice.id ?? "",
      period: `${date(invoice.period_start)} – ${date(invoice.period_end)}`,
      invoiceUrl: invoice.hosted_invoice_url ?? billingUrl(),
      pdfUrl: invoice.invoice_pdf ?? null,
      billingUrl: billingUrl(),
    }),
  );
}

/** Billing mails to an organisation's owners and admins: payment failed, invoice available. */
import { subjectSafeName } from "@/lib/validation/names";
import { frameMail, htmlTemplate, MUTED, P, textTemplate, type RenderedMail } from "./layout";

export type PaymentFailedMailData = {
  orgName: string;
  amount: string;
  invoiceNumber: string;
  /** The provider's hosted invoice page, where the invoice can be paid with another card. */
  payUrl: string;
  billingUrl: string;
  /** Next automatic retry, formatted; null when no retry is scheduled. */
  nextAttempt: string | null;
};

const failedHtml = htmlTemplate<PaymentFailedMailData>(
  `<p ${P}>We could not collect <strong>{{amount}}</strong> for invoice {{invoiceNumber}} of <strong>{{orgName}}</strong>. The subscription is now <strong>past due</strong>.</p>
<p ${P}>{{#if nextAttempt}}We will try the card again on {{nextAttempt}}. {{/if}}To keep the plan, pay the invoice with another card or update the card on file.</p>
{{> button href=payUrl label="Pay the invoice"}}
<p ${MUTED}>Billing settings: <a href="{{billingUrl}}" style="color:#13777d">{{billingUrl}}</a></p>`,
);

const failedText = textTemplate<PaymentFailedMailData>(
  `We could not collect {{amount}} for invoice {{invoiceNumber}} of {{orgName}}. The subscription is now past due.
{{#if nextAttempt}}We will try the card again on {{nextAttempt}}.{{/if}}

Pay the invoice with another card:
{{payUrl}}

Billing settings: {{billingUrl}}`,
);

export function paymentFailedMail(data: PaymentFailedMailData): RenderedMail {
  return frameMail({
    subject: `Payment failed for ${subjectSafeName(data.orgName)} — action needed`,
    title: "A payment failed",
    preview: `${data.amount} could not be collected; the subscription is past due.`,
    bodyHtml: failedHtml(data),
    text: failedText(data),
    footer: "You get this e-mail because you are an owner or admin of this Ketwise organisation.",
  });
}

export type InvoiceMailData = {
  orgName: string;
  amount: string;
  invoiceNumber: string;
  period: string;
  invoiceUrl: string;
  pdfUrl: string | null;
  billingUrl: string;
};

const invoiceHtml = htmlTemplate<InvoiceMailData>(
  `<p ${P}>Invoice <strong>{{invoiceNumber}}</strong> of <strong>{{orgName}}</strong> for {{period}} is paid: <strong>{{amount}}</strong>.</p>
{{> button href=invoiceUrl label="View the invoice"}}
<p ${MUTED}>{{#if pdfUrl}}PDF: <a href="{{pdfUrl}}" style="color:#13777d">download</a> · {{/if}}All invoices: <a href="{{billingUrl}}" style="color:#13777d">{{billingUrl}}</a></p>`,
);

const invoiceText = textTemplate<InvoiceMailData>(
  `Invoice {{invoiceNumber}} of {{orgName}} for {{period}} is paid: {{amount}}.

View it: {{invoiceUrl}}
{{#if pdfUrl}}PDF: {{pdfUrl}}
{{/if}}All invoices: {{billingUrl}}`,
);

export function invoiceAvailableMail(data: InvoiceMailData): RenderedMail {
  return frameMail({
    subject: `Your Ketwise invoice ${data.invoiceNumber} (${data.amount})`,
    title: "Your invoice is available",
    preview: `${data.amount} for ${data.period}, paid.`,
    bodyHtml: invoiceHtml(data),
    text: invoiceText(data),
    footer: "You get this e-mail because you are an owner or admin of this Ketwise organisation.",
  });
}

/**
 * Invoice lines for a subscription. Licensed (per-seat) items are billed in
 * advance for the coming period: quantity × unit price. Metered items are
 * billed in arrears for the period just ended: usage (after the price's
 * transform) × unit price. Pending prorations are added to the next invoice.
 */
import type { Fake } from "../core/fake";
import type { InvoiceItemRec, PriceRec, SubscriptionRec } from "../core/state";
import { priceOf } from "../resources/render-billing";
import type { LineInput } from "./invoicing";
import { formatCents, formatUnitDecimal, lineAmount } from "./money";
import { billableQuantity, usageFor } from "./usage";

export function productName(fake: Fake, price: PriceRec): string {
  return fake.state.products[price.product]?.name ?? price.product;
}

function describeLicensed(fake: Fake, price: PriceRec, quantity: number): string {
  return `${quantity} × ${productName(fake, price)} (at ${formatCents(price.unit_amount ?? 0, price.currency)} / month)`;
}

function describeMetered(fake: Fake, price: PriceRec, quantity: number): string {
  const per = price.transform_quantity
    ? ` per ${price.transform_quantity.divide_by.toLocaleString("en-US")}`
    : "";
  return `${quantity.toLocaleString("en-US")} × ${productName(fake, price)} (at ${formatUnitDecimal(price.unit_amount_decimal, price.currency)}${per})`;
}

export function isMetered(price: PriceRec): boolean {
  return price.recurring?.usage_type === "metered";
}

export function licensedLines(
  fake: Fake,
  sub: SubscriptionRec,
  start: number,
  end: number,
): LineInput[] {
  const lines: LineInput[] = [];
  for (const item of sub.items) {
    const price = priceOf(fake, item.price);
    if (isMetered(price)) continue;
    const quantity = item.quantity ?? 1;
    lines.push({
      amount: lineAmount(quantity, price.unit_amount_decimal),
      currency: price.currency,
      description: describeLicensed(fake, price, quantity),
      price: price.id,
      quantity,
      unit_amount_decimal: price.unit_amount_decimal,
      period_start: start,
      period_end: end,
      proration: false,
      subscription: sub.id,
      subscription_item: item.id,
      invoice_item: null,
    });
  }
  return lines;
}

export function meteredLines(
  fake: Fake,
  sub: SubscriptionRec,
  start: number,
  end: number,
): LineInput[] {
  const lines: LineInput[] = [];
  for (const item of sub.items) {
    const price = priceOf(fake, item.price);
    if (!isMetered(price)) continue;
    const quantity = billableQuantity(price, usageFor(fake, price, sub.customer, start, end));
    lines.push({
      amount: lineAmount(quantity, price.unit_amount_decimal),
      currency: price.currency,
      description: describeMetered(fake, price, quantity),
      price: price.id,
      quantity,
      unit_amount_decimal: price.unit_amount_decimal,
      period_start: start,
      period_end: end,
      proration: false,
      subscription: sub.id,
      subscription_item: item.id,
      invoice_item: null,
    });
  }
  return lines;
}

/** Pending prorations of a subscription, marked as now belonging to an invoice by the caller. */
export function pendingItems(fake: Fake, subscriptionId: string): InvoiceItemRec[] {
  return Object.values(fake.state.invoiceItems).filter(
    (ii) => ii.subscription === subscriptionId && ii.invoice === null,
  );
}

export function itemLines(fake: Fake, items: InvoiceItemRec[]): LineInput[] {
  return items.map((ii) => ({
    amount: ii.amount,
    currency: ii.currency,
    description: ii.description,
    price: ii.price,
    quantity: ii.quantity,
    unit_amount_decimal: priceOf(fake, ii.price).unit_amount_decimal,
    period_start: ii.period_start,
    period_end: ii.period_end,
    proration: true,
    subscription: ii.subscription,
    subscription_item: ii.subscription_item,
    invoice_item: ii.id,
  }));
}

/** Marks pending items as billed on `invoiceId`. */
export function claimItems(items: InvoiceItemRec[], invoiceId: string): void {
  for (const ii of items) ii.invoice = invoiceId;
}

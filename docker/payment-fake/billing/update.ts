/**
 * Changing a subscription's items (seats = quantity, plan = price) with
 * prorations. For a change at time t in period [s, e), with the unused
 * fraction f = (e − t) / (e − s), each changed licensed item gets
 *   credit  −round(old_qty × old_unit × f)  ("Unused time on …") and
 *   charge  +round(new_qty × new_unit × f)  ("Remaining time on …").
 * Metered items are never prorated (usage is billed in arrears).
 *
 * proration_behavior: `create_prorations` (default) keeps the lines as
 * pending items for the next invoice; `always_invoice` invoices and charges
 * them at once (`subscription_update`); `none` creates nothing.
 * payment_behavior `error_if_incomplete` refuses the whole change with a 402
 * when that immediate charge would fail; nothing is changed then.
 */
import { invalidRequest, noSuch } from "../core/errors";
import type { Fake } from "../core/fake";
import { newId } from "../core/ids";
import type { SubItemRec, SubscriptionRec } from "../core/state";
import { priceOf, renderSubscription } from "../resources/render-billing";
import { invoiceNow, type LineInput } from "./invoicing";
import { claimItems, isMetered, itemLines, pendingItems, productName } from "./lines";
import { formatDate, lineAmount } from "./money";
import { chargeDecline, chargeError, paymentMethodFor } from "./payments";

export interface ItemChange {
  id?: string;
  price?: string;
  quantity?: number;
  deleted?: boolean;
  metadata?: Record<string, string>;
}

export type ProrationBehavior = "create_prorations" | "always_invoice" | "none";

/** Validates item changes and returns the new item list (the subscription is not touched). */
export function planItems(
  fake: Fake,
  sub: SubscriptionRec,
  changes: ItemChange[],
  now: number,
): SubItemRec[] {
  const next = sub.items.map((i) => ({ ...i, metadata: { ...i.metadata } }));
  changes.forEach((change, index) => {
    const param = (f: string) => `items[${index}][${f}]`;
    let item: SubItemRec | undefined;
    if (change.id !== undefined) {
      item = next.find((i) => i.id === change.id);
      if (!item) throw noSuch("subscription item", change.id, param("id"));
      if (change.deleted) {
        next.splice(next.indexOf(item), 1);
        return;
      }
    } else {
      if (change.deleted) throw invalidRequest("An item to delete needs its id.", param("id"));
      if (change.price === undefined)
        throw invalidRequest("A new subscription item needs a price.", param("price"));
      item = { id: newId("si"), created: now, price: change.price, quantity: null, metadata: {} };
      next.push(item);
    }
    if (change.price !== undefined) {
      const price = fake.state.prices[change.price];
      if (!price) throw noSuch("price", change.price, param("price"));
      if (!price.active)
        throw invalidRequest(`The price ${price.id} is not active.`, param("price"));
      if (!price.recurring)
        throw invalidRequest(`The price ${price.id} is not recurring.`, param("price"));
      if (price.currency !== sub.currency) {
        throw invalidRequest(
          `The price ${price.id} is in ${price.currency}, the subscription in ${sub.currency}.`,
          param("price"),
        );
      }
      item.price = price.id;
    }
    const price = priceOf(fake, item.price);
    if (isMetered(price)) {
      if (change.quantity !== undefined) {
        throw invalidRequest(
          "Quantity should not be specified where usage_type is `metered`.",
          param("quantity"),
        );
      }
      item.quantity = null;
    } else if (change.quantity !== undefined) {
      item.quantity = change.quantity;
    } else if (item.quantity === null) {
      item.quantity = 1;
    }
    if (change.metadata) item.metadata = { ...item.metadata, ...change.metadata };
  });
  if (next.length === 0) throw invalidRequest("A subscription needs at least one item.", "items");
  const prices = next.map((i) => i.price);
  if (new Set(prices).size !== prices.length) {
    throw invalidRequest("A subscription cannot have two items with the same price.", "items");
  }
  return next;
}

/** Proration lines for moving from `before` to `after` items at time `t`. */
export function prorationLines(
  fake: Fake,
  sub: SubscriptionRec,
  after: SubItemRec[],
  t: number,
): LineInput[] {
  const start = sub.current_period_start;
  const end = sub.current_period_end;
  if (t >= end) return [];
  const fraction = (end - t) / (end - start);
  const lines: LineInput[] = [];
  const line = (item: SubItemRec, sign: 1 | -1): void => {
    const price = priceOf(fake, item.price);
    const quantity = item.quantity ?? 1;
    const full = lineAmount(quantity, price.unit_amount_decimal);
    const amount = sign * Math.round(full * fraction);
    if (amount === 0) return;
    const label = sign < 0 ? "Unused time on" : "Remaining time on";
    lines.push({
      amount,
      currency: price.currency,
      description: `${label} ${quantity} × ${productName(fake, price)} after ${formatDate(t)}`,
      price: price.id,
      quantity,
      unit_amount_decimal: price.unit_amount_decimal,
      period_start: t,
      period_end: end,
      proration: true,
      subscription: sub.id,
      subscription_item: item.id,
      invoice_item: null,
    });
  };
  for (const old of sub.items) {
    if (isMetered(priceOf(fake, old.price))) continue;
    const now = after.find((i) => i.id === old.id);
    if (!now || now.price !== old.price || now.quantity !== old.quantity) line(old, -1);
  }
  for (const item of after) {
    if (isMetered(priceOf(fake, item.price))) continue;
    const was = sub.items.find((i) => i.id === item.id);
    if (!was || was.price !== item.price || was.quantity !== item.quantity) line(item, 1);
  }
  return lines;
}

/**
 * Applies an item change with its prorations. `applyOther` sets the other
 * updated fields on the subscription; it runs only once the change is known
 * to go through, so a refused change leaves everything untouched.
 */
export function changeItems(
  fake: Fake,
  sub: SubscriptionRec,
  opts: {
    changes: ItemChange[] | undefined;
    proration: ProrationBehavior;
    prorationDate: number | undefined;
    errorIfIncomplete: boolean;
    applyOther: () => void;
  },
): void {
  const now = fake.now(sub.customer);
  const after = opts.changes ? planItems(fake, sub, opts.changes, now) : sub.items;
  const t = opts.prorationDate ?? now;
  if (t < sub.current_period_start || t > sub.current_period_end) {
    throw invalidRequest(
      "proration_date must be within the current billing period.",
      "proration_date",
    );
  }
  const lines =
    opts.changes && opts.proration !== "none" ? prorationLines(fake, sub, after, t) : [];
  const pending = opts.proration === "always_invoice" ? pendingItems(fake, sub.id) : [];
  const invoiceLines = [...lines, ...itemLines(fake, pending)];
  const due =
    invoiceLines.reduce((s, l) => s + l.amount, 0) +
    (fake.state.customers[sub.customer]?.balance ?? 0);
  if (
    opts.proration === "always_invoice" &&
    opts.errorIfIncomplete &&
    invoiceLines.length > 0 &&
    due > 0
  ) {
    const decline = chargeDecline(
      fake,
      sub.customer,
      paymentMethodFor(fake, sub.customer, sub.default_payment_method),
      { peek: true },
    );
    if (decline) throw chargeError(decline);
  }

  const before = renderSubscription(fake, sub);
  sub.items = after;
  opts.applyOther();
  fake.emit("customer.subscription.updated", renderSubscription(fake, sub), before, sub.customer);

  if (opts.proration === "create_prorations") {
    for (const l of lines) {
      const id = newId("ii");
      fake.state.invoiceItems[id] = {
        id,
        created: now,
        customer: sub.customer,
        subscription: sub.id,
        subscription_item: l.subscription_item ?? "",
        price: l.price,
        quantity: l.quantity,
        amount: l.amount,
        currency: l.currency,
        description: l.description,
        period_start: l.period_start,
        period_end: l.period_end,
        proration: true,
        invoice: null,
      };
    }
  } else if (opts.proration === "always_invoice" && invoiceLines.length > 0) {
    const inv = invoiceNow(fake, {
      customer: sub.customer,
      subscription: sub.id,
      billing_reason: "subscription_update",
      lines: invoiceLines,
      period_start: t,
      period_end: t,
      currency: sub.currency,
    });
    claimItems(pending, inv.id);
  }
}

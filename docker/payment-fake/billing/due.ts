/**
 * Work that falls due as (fake) time passes: renewals at period end,
 * scheduled cancellations, payment retries, and expiry of subscriptions
 * left incomplete for 23 hours. Due items run one at a time in time order,
 * each stamped with the moment it fell due, until nothing is due — so
 * advancing three months gives three renewals with their retries between.
 */
import type { Fake } from "../core/fake";
import type { SubscriptionRec } from "../core/state";
import { renderSubscription } from "../resources/render-billing";
import { renderInvoice } from "../resources/render-invoice";
import { attemptPayment } from "./invoicing";
import { endSubscription, renewSubscription } from "./subscriptions";

const INCOMPLETE_TTL = 23 * 3600;
const MAX_STEPS = 5000;

interface DueItem {
  at: number;
  run: () => void;
}

function nextDue(fake: Fake): DueItem | null {
  let best: DueItem | null = null;
  const consider = (at: number, customer: string, run: () => void) => {
    if (at <= fake.now(customer) && (!best || at < best.at)) best = { at, run };
  };
  for (const sub of Object.values(fake.state.subscriptions)) {
    if (sub.status === "active" || sub.status === "past_due") {
      if (sub.cancel_at !== null && sub.cancel_at < sub.current_period_end) {
        const at = sub.cancel_at;
        consider(at, sub.customer, () =>
          endSubscription(fake, sub, { at, reason: "cancellation_requested", finalInvoice: true }),
        );
      } else {
        consider(sub.current_period_end, sub.customer, () => renewSubscription(fake, sub));
      }
    } else if (sub.status === "incomplete") {
      consider(sub.created + INCOMPLETE_TTL, sub.customer, () => expireIncomplete(fake, sub));
    }
  }
  for (const inv of Object.values(fake.state.invoices)) {
    if (inv.status !== "open" || inv.next_payment_attempt === null) continue;
    consider(inv.next_payment_attempt, inv.customer, () => {
      const paid = attemptPayment(fake, inv, { automatic: true });
      const sub = inv.subscription ? fake.state.subscriptions[inv.subscription] : undefined;
      if (!paid && inv.next_payment_attempt === null && sub && sub.status !== "canceled") {
        endSubscription(fake, sub, {
          at: fake.now(sub.customer),
          reason: "payment_failed",
          finalInvoice: false,
        });
      }
    });
  }
  return best;
}

function expireIncomplete(fake: Fake, sub: SubscriptionRec): void {
  const before = renderSubscription(fake, sub);
  sub.status = "incomplete_expired";
  sub.ended_at = fake.now(sub.customer);
  for (const inv of Object.values(fake.state.invoices)) {
    if (inv.subscription === sub.id && inv.status === "open") {
      inv.status = "void";
      inv.voided_at = sub.ended_at;
      inv.next_payment_attempt = null;
      fake.emit("invoice.voided", renderInvoice(fake, inv), undefined, inv.customer);
    }
  }
  fake.emit("customer.subscription.updated", renderSubscription(fake, sub), before, sub.customer);
}

/** Runs everything due; returns how many items ran. */
export function processDue(fake: Fake): number {
  let steps = 0;
  for (; steps < MAX_STEPS; steps++) {
    const item = nextDue(fake);
    if (!item) break;
    fake.runAt(item.at, item.run);
  }
  return steps;
}

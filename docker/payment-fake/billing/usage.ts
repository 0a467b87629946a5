/**
 * Metered usage. Meter events are attributed to a billing period by their
 * `timestamp` (fake time of the customer when omitted); a period [start, end)
 * aggregates its events with the meter's formula (sum, count or last). A
 * price's `transform_quantity` then divides the total (rounding up or down),
 * e.g. "per 1,000 shots".
 */
import type { Fake } from "../core/fake";
import type { MeterRec, PriceRec } from "../core/state";

export function meterTotal(
  fake: Fake,
  meter: MeterRec,
  customer: string,
  start: number,
  end: number,
): number {
  const events = fake.state.meterEvents.filter(
    (e) =>
      e.meter === meter.id && e.customer === customer && e.timestamp >= start && e.timestamp < end,
  );
  if (meter.formula === "count") return events.length;
  if (meter.formula === "last") {
    if (events.length === 0) return 0;
    return events.reduce((a, b) => (b.timestamp >= a.timestamp ? b : a)).value;
  }
  return events.reduce((sum, e) => sum + e.value, 0);
}

export function billableQuantity(price: PriceRec, raw: number): number {
  const t = price.transform_quantity;
  if (!t) return raw;
  return t.round === "up" ? Math.ceil(raw / t.divide_by) : Math.floor(raw / t.divide_by);
}

/** Raw usage for a metered price in a period (0 when its meter is gone). */
export function usageFor(
  fake: Fake,
  price: PriceRec,
  customer: string,
  start: number,
  end: number,
): number {
  const meter = price.recurring?.meter ? fake.state.meters[price.recurring.meter] : undefined;
  return meter ? meterTotal(fake, meter, customer, start, end) : 0;
}

/**
 * The provider-side catalogue, derived from the plan table (./plans.ts) and
 * created on first use when missing: two usage meters (shots, simulation
 * seconds) and, per paid plan, a licensed per-seat monthly price and two
 * metered overage prices. Prices are found again by their lookup keys
 * `ketwise_<plan>_<seat|shots|seconds>`, so the app and the worker (and a
 * restart) share them. Shots are billed per started block of 1,000
 * (`transform_quantity` divide_by 1000, round up), seconds per second.
 */
import "server-only";
import Stripe from "stripe";
import type { OverageMetric } from "@/db/schema";
import { getPlan, isPaidPlan, plans, type PlanId } from "./plans";
import { getStripe } from "./stripe-client";

export const METER_EVENT_NAMES: Record<OverageMetric, string> = {
  shots: "ketwise_shots",
  simulation_seconds: "ketwise_simulation_seconds",
};

export type PricePart = "seat" | "shots" | "seconds";
export type PaidPlanId = Exclude<PlanId, "sandbox">;
export type PlanPrices = Record<PricePart, string>;
export type Catalog = {
  prices: Record<PaidPlanId, PlanPrices>;
  byPrice: Map<string, { plan: PaidPlanId; part: PricePart }>;
};

export const PAID_PLAN_IDS = plans.filter(isPaidPlan).map((p) => p.id as PaidPlanId);

export const lookupKey = (plan: PaidPlanId, part: PricePart) => `ketwise_${plan}_${part}`;

async function ensureMeters(stripe: Stripe): Promise<Record<OverageMetric, string>> {
  const existing = await stripe.billing.meters.list({ limit: 100 });
  const out = {} as Record<OverageMetric, string>;
  for (const metric of Object.keys(METER_EVENT_NAMES) as OverageMetric[]) {
    const event = METER_EVENT_NAMES[metric];
    const found = existing.data.find((m) => m.event_name === event && m.status === "active");
    out[metric] =
      found?.id ??
      (
        await stripe.billing.meters.create(
          {
            display_name: metric === "shots" ? "Shots" : "Simulation seconds",
            event_name: event,
            default_aggregation: { formula: "sum" },
          },
          { idempotencyKey: `ketwise-meter-${event}` },
        )
      ).id;
  }
  return out;
}

async function ensurePlanPrices(
  stripe: Stripe,
  planId: PaidPlanId,
  meters: Record<OverageMetric, string>,
): Promise<PlanPrices> {
  const plan = getPlan(planId);
  if (!isPaidPlan(plan)) throw new Error(`${planId} is not a paid plan`);
  const keys = (["seat", "shots", "seconds"] as const).map((part) => lookupKey(planId, part));
  const listed = await stripe.prices.list({ lookup_keys: keys, active: true, limit: 10 });
  const byKey = new Map(listed.data.map((p) => [p.lookup_key, p.id]));
  if (byKey.size === 3)
    return { seat: byKey.get(keys[0])!, shots: byKey.get(keys[1])!, seconds: byKey.get(keys[2])! };
  const product = await stripe.products.create(
    { name: `Ketwise ${plan.name}`, metadata: { plan: plan.id } },
    { idempotencyKey: `ketwise-product-${plan.id}` },
  );
  const create = async (part: PricePart, params: Stripe.PriceCreateParams) => {
    const key = lookupKey(planId, part);
    if (byKey.has(key)) return byKey.get(key)!;
    const price = await stripe.prices.create(
      { ...params, lookup_key: key, metadata: { plan: plan.id, part } },
      { idempotencyKey: `ketwise-price-${key}` },
    );
    return price.id;
  };
  return {
    seat: await create("seat", {
      product: product.id,
      currency: plan.currency,
      unit_amount: plan.seatPriceCents,
      recurring: { interval: "month", usage_type: "licensed" },
    }),
    shots: await create("shots", {
      product_data: { name: `${plan.name} shots above the included amount (per 1,000)` },
      currency: plan.currency,
      unit_amount_decimal: Stripe.Decimal.from(plan.overage.shotsPer1000Cents),
      recurring: { interval: "month", usage_type: "metered", meter: meters.shots },
      transform_quantity: { divide_by: 1000, round: "up" },
    }),
    seconds: await create("seconds", {
      product_data: { name: `${plan.name} simulation-seconds above the included amount` },
      currency: plan.currency,
      unit_amount_decimal: Stripe.Decimal.from(plan.overage.simulationSecondCentsDecimal),
      recurring: { interval: "month", usage_type: "metered", meter: meters.simulation_seconds },
    }),
  };
}

let cached: Promise<Catalog> | undefined;

/** The catalogue, created where missing; cached per process (a failure is not cached). */
export function ensureCatalog(stripe: Stripe = getStripe()): Promise<Catalog> {
  cached ??= (async () => {
    const meters = await ensureMeters(stripe);
    const prices = {} as Record<PaidPlanId, PlanPrices>;
    const byPrice = new Map<string, { plan: PaidPlanId; part: PricePart }>();
    for (const id of PAID_PLAN_IDS) {
      prices[id] = await ensurePlanPrices(stripe, id, meters);
      for (const part of ["seat", "shots", "seconds"] as const)
        byPrice.set(prices[id][part], { plan: id, part });
    }
    return { prices, byPrice };
  })().catch((error: unknown) => {
    cached = undefined;
    throw error;
  });
  return cached;
}

/** Forgets the cached catalogue (tests that reset the provider). */
export function forgetCatalog(): void {
  cached = undefined;
}

/**
 * Billing meters and meter events — the usage-reporting API SDK v23 exposes
 * (`stripe.billing.meters`, `stripe.billing.meterEvents`); the older
 * per-subscription-item usage records are gone from this SDK and are not
 * offered. A meter event names the meter by `event_name` and carries the
 * customer id and a whole-number value in its payload (keys set by the
 * meter, default `stripe_customer_id` and `value`). `identifier` makes a
 * report idempotent: a repeat within 24 hours is answered like the first
 * one but counted only once (the provider drops such duplicates). Timestamps may be
 * up to 35 days in the past and 5 minutes in the future (customer's fake time).
 */
import { z } from "zod";
import { invalidRequest, noSuch } from "../core/errors";
import type { Fake } from "../core/fake";
import { newId, randomText } from "../core/ids";
import type { MeterRec } from "../core/state";
import { newestFirst, paginate } from "../http/list";
import { expand, int, listShape, oneOf, parseParams, str } from "../http/params";
import { meterTotal } from "../billing/usage";
import { renderMeter } from "./render-catalog";
import type { ApiRouter } from "./types";

const DAY = 86_400;

const meterCreate = z.strictObject({
  display_name: str(),
  event_name: z
    .string()
    .regex(/^[A-Za-z0-9_.:-]{1,100}$/, "use letters, digits, _ . : - (at most 100)"),
  default_aggregation: z.strictObject({ formula: oneOf(["sum", "count", "last"] as const) }),
  customer_mapping: z
    .strictObject({ event_payload_key: str(), type: z.literal("by_id") })
    .optional(),
  value_settings: z.strictObject({ event_payload_key: str() }).optional(),
  expand: expand(),
});

const meterEventCreate = z.strictObject({
  event_name: str(),
  payload: z.record(z.string(), z.string()),
  identifier: z.string().min(1).max(100).optional(),
  timestamp: int(0).optional(),
  expand: expand(),
});

const summaryParams = z.strictObject({
  ...listShape,
  customer: z.string(),
  start_time: int(0),
  end_time: int(0),
  value_grouping_window: oneOf(["hour", "day"] as const).optional(),
});

function getMeterOrThrow(fake: Fake, id: string): MeterRec {
  const m = fake.state.meters[id];
  if (!m) throw noSuch("billing meter", id);
  return m;
}

export function registerMeters(router: ApiRouter): void {
  router.add("POST", "/v1/billing/meters", ({ fake, body }) => {
    const p = parseParams(meterCreate, body);
    const clash = Object.values(fake.state.meters).find(
      (m) => m.event_name === p.event_name && m.status === "active",
    );
    if (clash)
      throw invalidRequest(
        `An active meter (${clash.id}) already uses event_name "${p.event_name}".`,
        "event_name",
      );
    const now = fake.now();
    const meter: MeterRec = {
      id: newId("mtr"),
      created: now,
      updated: now,
      display_name: p.display_name,
      event_name: p.event_name,
      status: "active",
      deactivated_at: null,
      formula: p.default_aggregation.formula,
      customer_key: p.customer_mapping?.event_payload_key ?? "stripe_customer_id",
      value_key: p.value_settings?.event_payload_key ?? "value",
    };
    fake.state.meters[meter.id] = meter;
    return renderMeter(meter);
  });

  router.add("GET", "/v1/billing/meters/:id", ({ fake, params, body }) => {
    parseParams(z.strictObject({ expand: expand() }), body);
    return renderMeter(getMeterOrThrow(fake, params.id));
  });

  router.add("POST", "/v1/billing/meters/:id", ({ fake, params, body }) => {
    const p = parseParams(
      z.strictObject({ display_name: str().optional(), expand: expand() }),
      body,
    );
    const meter = getMeterOrThrow(fake, params.id);
    if (p.display_name !== undefined) meter.display_name = p.display_name;
    meter.updated = fake.now();
    return renderMeter(meter);
  });

  for (const action of ["deactivate", "reactivate"] as const) {
    router.add("POST", `/v1/billing/meters/:id/${action}`, ({ fake, params, body }) => {
      parseParams(z.strictObject({ expand: expand() }), body);
      const meter = getMeterOrThrow(fake, params.id);
      const want = action === "deactivate" ? "inactive" : "active";
      if (meter.status === want) throw invalidRequest(`The meter ${meter.id} is already ${want}.`);
      meter.status = want;
      meter.deactivated_at = want === "inactive" ? fake.now() : null;
      meter.updated = fake.now();
      return renderMeter(meter);
    });
  }

  router.add("GET", "/v1/billing/meters", ({ fake, body }) => {
    const p = parseParams(
      z.strictObject({ ...listShape, status: oneOf(["active", "inactive"] as const).optional() }),
      body,
    );
    const rows = newestFirst(fake.state.meters).filter(
      (m) => p.status === undefined || m.status === p.status,
    );
    return paginate(rows, p, "/v1/billing/meters", renderMeter);
  });

  router.add("GET", "/v1/billing/meters/:id/event_summaries", ({ fake, params, body }) => {
    const p = parseParams(summaryParams, body);
    const meter = getMeterOrThrow(fake, params.id);
    if (p.end_time <= p.start_time)
      throw invalidRequest("end_time must be after start_time.", "end_time");
    const step =
      p.value_grouping_window === "hour"
        ? 3600
        : p.value_grouping_window === "day"
          ? DAY
          : p.end_time - p.start_time;
    const windows: { start: number; end: number }[] = [];
    for (let s = p.start_time; s < p.end_time; s += step)
      windows.push({ start: s, end: Math.min(p.end_time, s + step) });
    const summaries = windows.reverse().map((w) => ({
      id: `mtrusg_${w.start}_${w.end}`,
      object: "billing.meter_event_summary",
      aggregated_value: meterTotal(fake, meter, p.customer, w.start, w.end),
      end_time: w.end,
      livemode: false,
      meter: meter.id,
      start_time: w.start,
    }));
    return paginate(summaries, p, `/v1/billing/meters/${meter.id}/event_summaries`, (s) => s);
  });

  router.add("POST", "/v1/billing/meter_events", ({ fake, body }) => {
    const p = parseParams(meterEventCreate, body);
    const meter = Object.values(fake.state.meters).find(
      (m) => m.event_name === p.event_name && m.status === "active",
    );
    if (!meter)
      throw invalidRequest(
        `No active meter exists for event_name "${p.event_name}".`,
        "event_name",
      );
    const customerId = p.payload[meter.customer_key];
    if (!customerId)
      throw invalidRequest(
        `The payload needs the customer id under "${meter.customer_key}".`,
        `payload[${meter.customer_key}]`,
      );
    const customer = fake.state.customers[customerId];
    if (!customer || customer.deleted)
      throw noSuch("customer", customerId, `payload[${meter.customer_key}]`);
    const raw = p.payload[meter.value_key];
    if (meter.formula !== "count" && raw === undefined) {
      throw invalidRequest(
        `The payload needs a value under "${meter.value_key}".`,
        `payload[${meter.value_key}]`,
      );
    }
    if (raw !== undefined && !/^\d+$/.test(raw)) {
      throw invalidRequest(
        `The value under "${meter.value_key}" must be a non-negative whole number, got "${raw}".`,
        `payload[${meter.value_key}]`,
      );
    }
    const now = fake.now(customerId);
    const timestamp = p.timestamp ?? now;
    if (timestamp < now - 35 * DAY || timestamp > now + 300) {
      throw invalidRequest(
        "timestamp must be within the past 35 days and at most 5 minutes in the future.",
        "timestamp",
      );
    }
    const identifier = p.identifier ?? randomText(24);
    const duplicate = fake.state.meterEvents.find(
      (e) => e.identifier === identifier && e.created > now - DAY,
    );
    const event = duplicate ?? {
      identifier,
      event_name: p.event_name,
      meter: meter.id,
      customer: customerId,
      value: raw === undefined ? 1 : Number(raw),
      timestamp,
      created: now,
      payload: { ...p.payload },
    };
    if (!duplicate) fake.state.meterEvents.push(event);
    return {
      object: "billing.meter_event",
      created: event.created,
      event_name: event.event_name,
      identifier: event.identifier,
      livemode: false,
      payload: event.payload,
      timestamp: event.timestamp,
    };
  });
}

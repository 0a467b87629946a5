/**
 * Billing-portal sessions (a link to the hosted page where the customer sees
 * invoices and the card, replaces the card or cancels) and the event log
 * (`GET /v1/events`, newest first, filterable by type and creation time).
 */
import { z } from "zod";
import { noSuch } from "../core/errors";
import { newId } from "../core/ids";
import type { PortalSessionRec } from "../core/state";
import { newestFirst, paginate } from "../http/list";
import {
  bool,
  expand,
  inRange,
  listShape,
  parseParams,
  rangeFilter,
  str,
  url,
} from "../http/params";
import { getCustomerOrThrow } from "./customers";
import { renderPortalSession } from "./render-billing";
import type { ApiRouter } from "./types";

/** Portal links stay valid for an hour, like short-lived provider sessions. */
const PORTAL_TTL = 3600;

export function registerPortalAndEvents(router: ApiRouter): void {
  router.add("POST", "/v1/billing_portal/sessions", ({ fake, body }) => {
    const p = parseParams(
      z.strictObject({
        customer: str(),
        return_url: url().optional(),
        locale: z.literal("auto").optional(),
        expand: expand(),
      }),
      body,
    );
    const customer = getCustomerOrThrow(fake, p.customer);
    const id = newId("bps");
    const now = fake.now(customer.id);
    const session: PortalSessionRec = {
      id,
      created: now,
      customer: customer.id,
      return_url: p.return_url ?? null,
      url: `${fake.config.publicUrl}/portal/${id}`,
      expires_at: now + PORTAL_TTL,
    };
    fake.state.portalSessions[id] = session;
    return renderPortalSession(session);
  });

  router.add("GET", "/v1/events/:id", ({ fake, params, body }) => {
    parseParams(z.strictObject({ expand: expand() }), body);
    const event = fake.state.events[params.id];
    if (!event) throw noSuch("event", params.id);
    return event;
  });

  router.add("GET", "/v1/events", ({ fake, body }) => {
    const p = parseParams(
      z.strictObject({
        ...listShape,
        type: z.string().optional(),
        types: z.array(z.string()).max(20).optional(),
        created: rangeFilter().optional(),
        delivery_success: bool().optional(),
      }),
      body,
    );
    const typeMatches = (t: string, pattern: string) =>
      pattern.endsWith(".*") ? t.startsWith(pattern.slice(0, -1)) : t === pattern;
    const delivered = (id: string) => {
      const ds = fake.state.deliveries.filter((d) => d.event === id);
      return ds.length > 0 && ds.every((d) => d.status === "succeeded");
    };
    const rows = newestFirst(fake.state.events).filter(
      (e) =>
        (p.type === undefined || typeMatches(e.type, p.type)) &&
        (!p.types || p.types.some((t) => typeMatches(e.type, t))) &&
        inRange(e.created, p.created) &&
        (p.delivery_success === undefined || delivered(e.id) === p.delivery_success),
    );
    return paginate(rows, p, "/v1/events", (e) => e);
  });
}

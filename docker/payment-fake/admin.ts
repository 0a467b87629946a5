/**
 * Test controls under `/_fake/*` (same secret key as the API; JSON or form
 * bodies) and `GET /health`:
 *   POST /_fake/advance            { customer?, seconds | to }  move fake time on, run what fell due
 *   POST /_fake/fail-next-payment  { customer?, count? }        make the next charge(s) fail
 *   GET  /_fake/now?customer=                                    fake time
 *   GET  /_fake/state                                            whole state (debugging)
 *   POST /_fake/reset                                            forget everything
 *   GET  /_fake/deliveries?event=                                webhook delivery log
 *   POST /_fake/webhooks/flush     { timeout_ms? }              wait until no delivery is pending
 *   POST /_fake/webhooks/redeliver { event }                    send an event again
 *   POST /_fake/config             { webhook_url }              change the webhook endpoint
 */
import type { IncomingMessage, ServerResponse } from "node:http";
import { z } from "zod";
import { processDue } from "./billing/due";
import { ApiError, invalidRequest, noSuch, unrecognizedUrl } from "./core/errors";
import type { Fake } from "./core/fake";
import { authenticate } from "./http/auth";
import { parseForm } from "./http/form";
import { int, parseParams } from "./http/params";
import { readBody, sendJson } from "./http/respond";
import type { WebhookDispatcher } from "./webhooks/dispatcher";

const numberish = z.union([z.number().int(), int()]);

async function bodyOf(req: IncomingMessage): Promise<unknown> {
  const text = await readBody(req);
  if (!text) return {};
  if ((req.headers["content-type"] ?? "").includes("application/json")) {
    try {
      return JSON.parse(text);
    } catch {
      throw invalidRequest("Body is not valid JSON.");
    }
  }
  return parseForm(text);
}

export async function handleAdmin(
  fake: Fake,
  dispatcher: WebhookDispatcher,
  req: IncomingMessage,
  res: ServerResponse,
  url: URL,
): Promise<void> {
  try {
    authenticate(req, fake.config.apiKey);
    const route = `${req.method} ${url.pathname}`;
    const body = req.method === "POST" ? await bodyOf(req) : Object.fromEntries(url.searchParams);
    const result = await run(fake, dispatcher, route, body);
    if (req.method === "POST") fake.scheduleSave();
    sendJson(res, 200, result);
  } catch (e) {
    if (e instanceof ApiError) return sendJson(res, e.status, e.toBody());
    console.error("[payment-fake] admin request failed:", e);
    sendJson(res, 500, {
      error: { type: "api_error", message: "Unexpected error in the local payment fake." },
    });
  }
}

async function run(
  fake: Fake,
  dispatcher: WebhookDispatcher,
  route: string,
  body: unknown,
): Promise<unknown> {
  switch (route) {
    case "POST /_fake/advance": {
      const p = parseParams(
        z.strictObject({
          customer: z.string().optional(),
          seconds: numberish.optional(),
          to: numberish.optional(),
        }),
        body,
      );
      if ((p.seconds === undefined) === (p.to === undefined))
        throw invalidRequest("Give exactly one of seconds or to.");
      if (p.customer && !fake.state.customers[p.customer])
        throw noSuch("customer", p.customer, "customer");
      const now = fake.now(p.customer);
      const seconds = p.seconds ?? p.to! - now;
      if (seconds < 0)
        throw invalidRequest(
          `Time only moves forward: 'to' (${p.to}) is before now (${now}).`,
          "to",
        );
      fake.clock.advance(seconds, p.customer);
      const ran = processDue(fake);
      return {
        now: fake.now(p.customer),
        customer: p.customer ?? null,
        advanced_seconds: seconds,
        due_items_run: ran,
      };
    }
    case "POST /_fake/fail-next-payment": {
      const p = parseParams(
        z.strictObject({ customer: z.string().optional(), count: numberish.optional() }),
        body,
      );
      if (p.customer && !fake.state.customers[p.customer])
        throw noSuch("customer", p.customer, "customer");
      const count = p.count ?? 1;
      if (count < 0 || count > 100)
        throw invalidRequest("count must be between 0 and 100.", "count");
      const key = p.customer ?? "*";
      if (count === 0) delete fake.state.failNext[key];
      else fake.state.failNext[key] = count;
      return { fail_next: { ...fake.state.failNext } };
    }
    case "GET /_fake/now": {
      const customer = (body as Record<string, string>).customer;
      return { now: fake.now(customer), real_now: Math.floor(fake.realNowMs() / 1000) };
    }
    case "GET /_fake/state":
      return fake.state;
    case "POST /_fake/reset":
      fake.reset();
      return { reset: true };
    case "GET /_fake/deliveries": {
      const event = (body as Record<string, string>).event;
      return { data: fake.state.deliveries.filter((d) => !event || d.event === event) };
    }
    case "POST /_fake/webhooks/flush": {
      const p = parseParams(z.strictObject({ timeout_ms: numberish.optional() }), body);
      const idle = await dispatcher.idle(Math.min(60_000, p.timeout_ms ?? 10_000));
      return { idle, pending: dispatcher.pendingCount() };
    }
    case "POST /_fake/webhooks/redeliver": {
      const p = parseParams(z.strictObject({ event: z.string() }), body);
      if (!dispatcher.redeliver(p.event)) throw noSuch("event", p.event, "event");
      return { redelivering: p.event };
    }
    case "POST /_fake/config": {
      const p = parseParams(z.strictObject({ webhook_url: z.string() }), body);
      if (p.webhook_url && !/^https?:\/\//.test(p.webhook_url))
        throw invalidRequest("webhook_url must be an http(s) URL or empty.", "webhook_url");
      fake.config.webhook.url = p.webhook_url;
      return { webhook_url: p.webhook_url };
    }
    default: {
      const [method, path] = route.split(" ");
      throw unrecognizedUrl(method, path);
    }
  }
}

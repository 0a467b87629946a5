/**
 * The `/v1` pipeline: authenticate → read and parse the form body (or the
 * query for GET/DELETE) → route → idempotency check → run the handler →
 * `expand[]` → JSON with `Request-Id`, echoing `Stripe-Version` and
 * `Idempotency-Key`. Unexpected exceptions become a logged 500 `api_error`.
 */
import type { IncomingMessage, ServerResponse } from "node:http";
import { ApiError, invalidRequest, unrecognizedUrl } from "../core/errors";
import type { Fake } from "../core/fake";
import { newId } from "../core/ids";
import { includeCheckoutField } from "../resources/checkout-sessions";
import {
  renderCustomer,
  renderMeter,
  renderPaymentMethod,
  renderPrice,
  renderProduct,
} from "../resources/render-catalog";
import {
  renderCheckoutSession,
  renderPortalSession,
  renderSubscription,
  renderSubscriptionItem,
} from "../resources/render-billing";
import { renderInvoice } from "../resources/render-invoice";
import type { ApiHandler } from "../resources/types";
import { authenticate } from "./auth";
import { applyExpand, type Expander } from "./expand";
import { FormError, parseForm, type FormObject } from "./form";
import { fingerprint, lookupIdempotent, pruneIdempotency, shouldSave } from "./idempotency";
import { BodyTooLargeError, readBody, sendJson } from "./respond";
import type { Router } from "./router";

function expanderFor(fake: Fake): Expander {
  const s = fake.state;
  return {
    resolve(id) {
      const prefix = id.slice(0, id.lastIndexOf("_"));
      switch (prefix) {
        case "cus":
          return s.customers[id] && renderCustomer(fake, s.customers[id]);
        case "prod":
          return s.products[id] && renderProduct(s.products[id]);
        case "price":
          return s.prices[id] && renderPrice(s.prices[id]);
        case "mtr":
          return s.meters[id] && renderMeter(s.meters[id]);
        case "pm":
          return s.paymentMethods[id] && renderPaymentMethod(s.paymentMethods[id]);
        case "cs_test":
          return s.checkoutSessions[id] && renderCheckoutSession(fake, s.checkoutSessions[id]);
        case "sub":
          return s.subscriptions[id] && renderSubscription(fake, s.subscriptions[id]);
        case "si": {
          const sub = Object.values(s.subscriptions).find((x) => x.items.some((i) => i.id === id));
          return (
            sub &&
            renderSubscriptionItem(
              fake,
              sub,
              sub.items.find((i) => i.id === id)!,
            )
          );
        }
        case "in":
          return s.invoices[id] && renderInvoice(fake, s.invoices[id]);
        case "bps":
          return s.portalSessions[id] && renderPortalSession(s.portalSessions[id]);
        default:
          return undefined;
      }
    },
    include: (owner, field) => includeCheckoutField(fake, owner, field),
  };
}

function header(req: IncomingMessage, name: string): string | null {
  const v = req.headers[name];
  return Array.isArray(v) ? (v[0] ?? null) : (v ?? null);
}

export async function handleApi(
  fake: Fake,
  router: Router<ApiHandler>,
  req: IncomingMessage,
  res: ServerResponse,
  url: URL,
): Promise<void> {
  const method = req.method ?? "GET";
  const requestId = newId("req");
  const idemKey = method === "POST" ? header(req, "idempotency-key") : null;
  const baseHeaders: Record<string, string> = {
    "Request-Id": requestId,
    "Stripe-Version": header(req, "stripe-version") ?? fake.config.apiVersion,
  };
  if (idemKey) baseHeaders["Idempotency-Key"] = idemKey;
  let status = 200;
  let payload: unknown;
  let scopedKey: string | null = null;
  let print = "";
  try {
    const apiKey = authenticate(req, fake.config.apiKey);
    let text: string;
    try {
      text = method === "POST" ? await readBody(req) : url.search.slice(1);
    } catch (e) {
      if (e instanceof BodyTooLargeError) throw invalidRequest(e.message);
      throw e;
    }
    let body: FormObject;
    try {
      body = parseForm(text);
    } catch (e) {
      if (e instanceof FormError) throw invalidRequest(e.message);
      throw e;
    }
    const match = router.match(method, url.pathname);
    if (match === null || match === "method") throw unrecognizedUrl(method, url.pathname);
    if (idemKey) {
      if (idemKey.length > 255)
        throw invalidRequest("Idempotency-Key must be at most 255 characters.");
      scopedKey = `${apiKey}:${idemKey}`;
      print = fingerprint(body);
      pruneIdempotency(fake.state, fake.realNowMs());
      const saved = lookupIdempotent(
        fake.state,
        scopedKey,
        method,
        url.pathname,
        print,
        fake.realNowMs(),
      );
      if (saved) {
        sendJson(res, saved.status, saved.body, { ...baseHeaders, "Idempotent-Replayed": "true" });
        return;
      }
    }
    fake.request = { id: requestId, idempotency_key: idemKey };
    try {
      const result = match.handler({ fake, params: match.params, body, path: url.pathname });
      const expandList = Array.isArray(body.expand)
        ? body.expand.filter((x): x is string => typeof x === "string")
        : undefined;
      payload = applyExpand(result, expandList, expanderFor(fake));
    } finally {
      fake.request = { id: null, idempotency_key: null };
    }
  } catch (e) {
    if (e instanceof ApiError) {
      status = e.status;
      payload = e.toBody();
    } else {
      status = 500;
      console.error(`[payment-fake] ${requestId} ${method} ${url.pathname} failed:`, e);
      payload = {
        error: {
          type: "api_error",
          message: `An unexpected error occurred in the local payment fake (request ${requestId}).`,
        },
      };
    }
  }
  const text = JSON.stringify(payload, null, 2);
  if (scopedKey && shouldSave(status)) {
    fake.state.idempotency[scopedKey] = {
      method,
      path: url.pathname,
      fingerprint: print,
      status,
      body: text,
      saved_ms: fake.realNowMs(),
    };
  }
  if (method !== "GET") fake.scheduleSave();
  sendJson(res, status, text, baseHeaders);
}

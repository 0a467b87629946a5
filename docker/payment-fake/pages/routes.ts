/**
 * Hosted pages (no API key; the unguessable ids/tokens in the URL are the
 * access control, as with the provider's hosted pages):
 *   GET/POST /pay/:session                     checkout payment page
 *   GET/POST /invoice/:id/:token               hosted invoice (pay an open one)
 *   GET      /invoice/:id/:token/pdf           invoice PDF
 *   GET      /portal/:session                  billing portal
 *   GET/POST /portal/:session/card             replace the card
 *   POST     /portal/:session/cancel|resume    cancel at period end / undo
 */
import type { IncomingMessage, ServerResponse } from "node:http";
import { checkCardInput } from "../billing/cards";
import { completeCheckout, refreshSessionStatus } from "../billing/checkout";
import { attemptPayment } from "../billing/invoicing";
import { attachPaymentMethod, createPaymentMethod } from "../billing/payments";
import type { Fake } from "../core/fake";
import type { PortalSessionRec } from "../core/state";
import { parseForm } from "../http/form";
import { readBody, redirect, sendHtml, sendPdf } from "../http/respond";
import { Router } from "../http/router";
import { renderSubscription } from "../resources/render-billing";
import { invoicePdf } from "./invoice-document";
import { notFoundPage, page } from "./layout";
import { checkoutView, invoiceView, portalView } from "./views";

interface PageCtx {
  fake: Fake;
  params: Record<string, string>;
  req: IncomingMessage;
  res: ServerResponse;
}

type PageHandler = (ctx: PageCtx) => Promise<void> | void;

async function formOf(req: IncomingMessage): Promise<Record<string, string>> {
  const parsed = parseForm(await readBody(req));
  const out: Record<string, string> = {};
  for (const [k, v] of Object.entries(parsed)) if (typeof v === "string") out[k] = v;
  return out;
}

function cardFields(f: Record<string, string>) {
  return {
    number: f.number ?? "",
    expiry: f.expiry ?? "",
    cvc: f.cvc ?? "",
    name: f.name ?? "",
    email: f.email ?? "",
  };
}

function invoiceFor(fake: Fake, params: Record<string, string>) {
  const inv = fake.state.invoices[params.id];
  return inv && inv._token === params.token && inv.status !== "draft" ? inv : null;
}

function portalFor(fake: Fake, id: string, res: ServerResponse): PortalSessionRec | null {
  const p = fake.state.portalSessions[id];
  if (!p) {
    sendHtml(res, 404, notFoundPage("This billing link does not exist."));
    return null;
  }
  if (fake.now(p.customer) >= p.expires_at) {
    sendHtml(
      res,
      410,
      page(
        "Link expired",
        `<div class="card"><h1>Link expired</h1><p>Open billing again from the application.</p></div>`,
      ),
    );
    return null;
  }
  return p;
}

export const pageRouter = new Router<PageHandler>()
  .add("GET", "/pay/:id", ({ fake, params, res }) => {
    const s = fake.state.checkoutSessions[params.id];
    if (!s) return sendHtml(res, 404, notFoundPage("This checkout session does not exist."));
    refreshSessionStatus(fake, s);
    sendHtml(res, s.status === "open" ? 200 : 410, checkoutView(fake, s));
  })
  .add("POST", "/pay/:id", async ({ fake, params, req, res }) => {
    const s = fake.state.checkoutSessions[params.id];
    if (!s) return sendHtml(res, 404, notFoundPage("This checkout session does not exist."));
    const f = cardFields(await formOf(req));
    const result = completeCheckout(fake, s, f);
    fake.scheduleSave();
    if (result.ok) return redirect(res, result.redirect);
    const status = result.field === "session" ? 409 : 402;
    sendHtml(
      res,
      status,
      checkoutView(fake, s, {
        error: result.message,
        values: { email: f.email, name: f.name, expiry: f.expiry },
      }),
    );
  })
  .add("GET", "/invoice/:id/:token", ({ fake, params, res }) => {
    const inv = invoiceFor(fake, params);
    if (!inv) return sendHtml(res, 404, notFoundPage("This invoice does not exist."));
    sendHtml(res, 200, invoiceView(fake, inv));
  })
  .add("POST", "/invoice/:id/:token", async ({ fake, params, req, res }) => {
    const inv = invoiceFor(fake, params);
    if (!inv) return sendHtml(res, 404, notFoundPage("This invoice does not exist."));
    const f = cardFields(await formOf(req));
    if (inv.status !== "open")
      return sendHtml(
        res,
        409,
        invoiceView(fake, inv, { error: `This invoice is ${inv.status}.` }),
      );
    const check = checkCardInput(f, fake.now(inv.customer));
    if (!check.ok)
      return sendHtml(res, 402, invoiceView(fake, inv, { error: check.decline.message }));
    if (check.value.card.attach)
      return sendHtml(res, 402, invoiceView(fake, inv, { error: check.value.card.attach.message }));
    const pm = createPaymentMethod(fake, check.value, {
      name: f.name || null,
      email: inv.customer_email,
    });
    attachPaymentMethod(fake, pm, inv.customer, false);
    const paid = attemptPayment(fake, inv, { automatic: false, paymentMethod: pm.id });
    fake.scheduleSave();
    if (paid)
      return sendHtml(res, 200, invoiceView(fake, inv, { ok: "Payment received. Thank you." }));
    sendHtml(
      res,
      402,
      invoiceView(fake, inv, {
        error: inv.last_payment_error?.message ?? "Your card was declined.",
      }),
    );
  })
  .add("GET", "/invoice/:id/:token/pdf", ({ fake, params, res }) => {
    const inv = invoiceFor(fake, params);
    if (!inv) return sendHtml(res, 404, notFoundPage("This invoice does not exist."));
    sendPdf(res, invoicePdf(fake, inv), `invoice-${inv.number ?? inv.id}.pdf`);
  })
  .add("GET", "/portal/:id", ({ fake, params, res }) => {
    const p = portalFor(fake, params.id, res);
    if (p) sendHtml(res, 200, portalView(fake, p));
  })
  .add("GET", "/portal/:id/card", ({ fake, params, res }) => {
    const p = portalFor(fake, params.id, res);
    if (p) sendHtml(res, 200, portalView(fake, p, { cardForm: true }));
  })
  .add("POST", "/portal/:id/card", async ({ fake, params, req, res }) => {
    const p = portalFor(fake, params.id, res);
    if (!p) return;
    const f = cardFields(await formOf(req));
    const check = checkCardInput(f, fake.now(p.customer));
    if (!check.ok)
      return sendHtml(
        res,
        402,
        portalView(fake, p, { cardForm: true, error: check.decline.message }),
      );
    if (check.value.card.attach)
      return sendHtml(
        res,
        402,
        portalView(fake, p, { cardForm: true, error: check.value.card.attach.message }),
      );
    const customer = fake.state.customers[p.customer];
    const pm = createPaymentMethod(fake, check.value, {
      name: f.name || null,
      email: customer.email,
    });
    attachPaymentMethod(fake, pm, customer.id, true);
    for (const sub of Object.values(fake.state.subscriptions)) {
      if (
        sub.customer !== customer.id ||
        sub.status === "canceled" ||
        sub.status === "incomplete_expired"
      )
        continue;
      const before = renderSubscription(fake, sub);
      sub.default_payment_method = pm.id;
      fake.emit(
        "customer.subscription.updated",
        renderSubscription(fake, sub),
        before,
        customer.id,
      );
    }
    // Unpaid invoices that already failed once are retried on the new card at once.
    const unpaid = Object.values(fake.state.invoices).filter(
      (i) => i.customer === customer.id && i.status === "open" && i.attempted,
    );
    const failed = unpaid.filter(
      (i) => !attemptPayment(fake, i, { automatic: false, paymentMethod: pm.id }),
    );
    fake.scheduleSave();
    if (failed.length) {
      return sendHtml(
        res,
        402,
        portalView(fake, p, {
          error: `Card saved, but paying ${failed.length} open invoice(s) failed: ${failed[0].last_payment_error?.message ?? "declined"}`,
        }),
      );
    }
    sendHtml(
      res,
      200,
      portalView(fake, p, {
        ok: unpaid.length ? `Card saved; ${unpaid.length} open invoice(s) paid.` : "Card saved.",
      }),
    );
  })
  .add("POST", "/portal/:id/cancel", async ({ fake, params, req, res }) =>
    setCancel(fake, params.id, req, res, true),
  )
  .add("POST", "/portal/:id/resume", async ({ fake, params, req, res }) =>
    setCancel(fake, params.id, req, res, false),
  );

async function setCancel(
  fake: Fake,
  id: string,
  req: IncomingMessage,
  res: ServerResponse,
  cancel: boolean,
): Promise<void> {
  const p = portalFor(fake, id, res);
  if (!p) return;
  const f = await formOf(req);
  const sub = fake.state.subscriptions[f.subscription ?? ""];
  if (!sub || sub.customer !== p.customer || sub.status === "canceled") {
    return sendHtml(res, 404, portalView(fake, p, { error: "That subscription is not active." }));
  }
  const before = renderSubscription(fake, sub);
  sub.cancel_at_period_end = cancel;
  sub.cancel_at = cancel ? sub.current_period_end : null;
  sub.canceled_at = cancel ? fake.now(sub.customer) : null;
  sub.cancellation_reason = cancel ? "cancellation_requested" : null;
  fake.emit("customer.subscription.updated", renderSubscription(fake, sub), before, sub.customer);
  fake.scheduleSave();
  sendHtml(
    res,
    200,
    portalView(fake, p, {
      ok: cancel
        ? "Your subscription will end at the end of the period."
        : "Your subscription will continue.",
    }),
  );
}

/** HTML views of the hosted pages: checkout, invoice and billing portal. */
import type { Fake } from "../core/fake";
import type { CheckoutSessionRec, InvoiceRec, PortalSessionRec } from "../core/state";
import { formatCents, formatDate, formatUnitDecimal } from "../billing/money";
import { priceOf } from "../resources/render-billing";
import { invoiceUrls } from "../resources/render-invoice";
import { cardForm, esc, page, type CardFormOptions } from "./layout";

export function checkoutView(
  fake: Fake,
  s: CheckoutSessionRec,
  form: Omit<CardFormOptions, "action" | "button"> = {},
): string {
  const rows = s.line_items
    .map((l) => {
      const price = priceOf(fake, l.price);
      const name = fake.state.products[price.product]?.name ?? price.product;
      if (l.quantity === null) {
        const per = price.transform_quantity
          ? ` per ${price.transform_quantity.divide_by.toLocaleString("en-US")}`
          : " per unit";
        return `<tr><td>${esc(name)}<div class="muted">Billed monthly by usage: ${esc(formatUnitDecimal(price.unit_amount_decimal, price.currency))}${esc(per)}</div></td><td class="num">—</td><td class="num">${esc(formatCents(0, s.currency))}</td></tr>`;
      }
      return `<tr><td>${esc(name)}<div class="muted">${esc(formatCents(price.unit_amount ?? 0, s.currency))} each per month</div></td><td class="num">${l.quantity}</td><td class="num">${esc(formatCents((price.unit_amount ?? 0) * l.quantity, s.currency))}</td></tr>`;
    })
    .join("");
  const customer = s.customer ? fake.state.customers[s.customer] : null;
  const email = customer?.email ?? s.customer_email;
  const body =
    s.status !== "open"
      ? `<div class="card"><h1>${s.status === "complete" ? "Payment complete" : "Checkout expired"}</h1><p>${
          s.status === "complete"
            ? "This checkout has already been paid."
            : "This checkout session has expired. Start again from the application."
        }</p></div>`
      : `<div class="card"><h1>Subscribe</h1><p class="muted">${email ? `For ${esc(email)}` : ""}</p>
<table><tr><th>Item</th><th class="num">Qty</th><th class="num">Per month</th></tr>${rows}
<tr class="total"><td>Due today</td><td></td><td class="num">${esc(formatCents(s.amount_total, s.currency))}</td></tr></table></div>
<div class="card"><h2>Pay with card</h2>${cardForm({ ...form, action: `/pay/${s.id}`, button: `Pay ${formatCents(s.amount_total, s.currency)} and subscribe`, askEmail: !email })}
${s.cancel_url ? `<p><a href="${esc(s.cancel_url)}">Cancel and go back</a></p>` : ""}</div>`;
  return page("Checkout", body);
}

export function invoiceView(
  fake: Fake,
  inv: InvoiceRec,
  notice: { error?: string; ok?: string } = {},
): string {
  const money = (c: number) => formatCents(c, inv.currency);
  const urls = invoiceUrls(fake, inv);
  const rows = inv.lines
    .map(
      (l) =>
        `<tr><td>${esc(l.description)}<div class="muted">${esc(formatDate(l.period_start))} – ${esc(formatDate(l.period_end))}${l.proration ? " · proration" : ""}</div></td><td class="num">${l.quantity.toLocaleString("en-US")}</td><td class="num">${esc(money(l.amount))}</td></tr>`,
    )
    .join("");
  const payForm =
    inv.status === "open" && inv.amount_remaining > 0
      ? `<div class="card"><h2>Pay this invoice</h2>${cardForm({ action: urls.hosted!.replace(fake.config.publicUrl, ""), button: `Pay ${money(inv.amount_remaining)}`, error: notice.error })}</div>`
      : "";
  return page(
    `Invoice ${inv.number ?? ""}`,
    `<div class="card">${notice.ok ? `<div class="ok">${esc(notice.ok)}</div>` : ""}
<h1>Invoice ${esc(inv.number)} <span class="pill ${esc(inv.status)}">${esc(inv.status)}</span></h1>
<p class="muted">Issued ${esc(formatDate(inv.finalized_at ?? inv.created))} to ${esc(inv.customer_email ?? inv.customer)} · <a href="${esc(urls.pdf)}">Download PDF</a></p>
<table><tr><th>Description</th><th class="num">Qty</th><th class="num">Amount</th></tr>${rows}
<tr><td>Subtotal</td><td></td><td class="num">${esc(money(inv.subtotal))}</td></tr>
${inv.starting_balance ? `<tr><td>Applied balance</td><td></td><td class="num">${esc(money(inv.starting_balance))}</td></tr>` : ""}
<tr><td>Amount paid</td><td></td><td class="num">${esc(money(inv.amount_paid))}</td></tr>
<tr class="total"><td>Amount due</td><td></td><td class="num">${esc(money(inv.amount_remaining))}</td></tr></table></div>${payForm}`,
  );
}

export function portalView(
  fake: Fake,
  p: PortalSessionRec,
  notice: { error?: string; ok?: string; cardForm?: boolean } = {},
): string {
  const customer = fake.state.customers[p.customer];
  const subs = Object.values(fake.state.subscriptions).filter(
    (s) => s.customer === p.customer && s.status !== "incomplete_expired",
  );
  const live = subs.filter((s) => s.status !== "canceled");
  const pmId =
    live.find((s) => s.default_payment_method)?.default_payment_method ??
    customer.default_payment_method;
  const pm = pmId ? fake.state.paymentMethods[pmId] : undefined;
  const invoices = Object.values(fake.state.invoices)
    .filter((i) => i.customer === p.customer && i.status !== "draft")
    .reverse();
  const subRows = subs
    .map((s) => {
      const items = s.items
        .map((i) => {
          const price = priceOf(fake, i.price);
          const name = fake.state.products[price.product]?.name ?? price.product;
          return i.quantity === null ? `${esc(name)} (usage)` : `${i.quantity} × ${esc(name)}`;
        })
        .join(", ");
      const state =
        s.status === "canceled"
          ? `ended ${formatDate(s.ended_at ?? s.canceled_at ?? s.created)}`
          : s.cancel_at
            ? `ends ${formatDate(s.cancel_at)}`
            : `renews ${formatDate(s.current_period_end)}`;
      const action =
        s.status === "canceled"
          ? ""
          : `<form method="post" action="/portal/${esc(p.id)}/${s.cancel_at ? "resume" : "cancel"}"><input type="hidden" name="subscription" value="${esc(s.id)}"><button class="secondary" type="submit">${
              s.cancel_at ? "Keep subscription" : "Cancel at end of period"
            }</button></form>`;
      return `<tr><td>${items}<div class="muted">${esc(state)}</div></td><td><span class="pill ${esc(s.status)}">${esc(s.status)}</span></td><td>${action}</td></tr>`;
    })
    .join("");
  const invRows = invoices
    .map((i) => {
      const urls = invoiceUrls(fake, i);
      return `<tr><td><a href="${esc(urls.hosted)}">${esc(i.number)}</a></td><td>${esc(formatDate(i.created))}</td><td><span class="pill ${esc(i.status)}">${esc(i.status)}</span></td><td class="num">${esc(formatCents(i.total, i.currency))}</td><td><a href="${esc(urls.pdf)}">PDF</a></td></tr>`;
    })
    .join("");
  const card = pm
    ? `${esc(pm.brand)} ending in ${esc(pm.last4)}, expires ${pm.exp_month}/${pm.exp_year}`
    : "No card on file";
  const cardSection = notice.cardForm
    ? cardForm({ action: `/portal/${p.id}/card`, button: "Save card", error: notice.error })
    : `${notice.error ? `<div class="error" role="alert">${esc(notice.error)}</div>` : ""}<p>${card}</p><form method="get" action="/portal/${esc(p.id)}/card"><button class="secondary" type="submit">Replace card</button></form>`;
  return page(
    "Billing",
    `<div class="card">${notice.ok ? `<div class="ok">${esc(notice.ok)}</div>` : ""}<h1>Billing</h1><p class="muted">${esc(customer.email ?? customer.id)}</p>
${p.return_url ? `<p><a href="${esc(p.return_url)}">← Return</a></p>` : ""}</div>
<div class="card"><h2>Subscriptions</h2><table>${subRows || "<tr><td>None</td></tr>"}</table></div>
<div class="card"><h2>Payment method</h2>${cardSection}</div>
<div class="card"><h2>Invoices</h2><table><tr><th>Number</th><th>Date</th><th>Status</th><th class="num">Total</th><th></th></tr>${invRows}</table></div>`,
  );
}

/**
 * Shared HTML for the hosted pages: an escaped-text helper, the page frame
 * (clearly marked as a local test page) and the card form used by checkout,
 * the hosted invoice and the portal.
 */
export function esc(value: unknown): string {
  return String(value ?? "")
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/"/g, "&quot;")
    .replace(/'/g, "&#39;");
}

const CSS = `
*{box-sizing:border-box}body{margin:0;font:15px/1.5 system-ui,-apple-system,"Segoe UI",Roboto,sans-serif;background:#f3f4f1;color:#1d2320}
.banner{background:#2b3a33;color:#e9efe9;font-size:13px;padding:6px 16px;text-align:center}
main{max-width:760px;margin:32px auto;padding:0 16px}
.card{background:#fff;border:1px solid #d9ddd6;border-radius:10px;padding:24px;margin-bottom:20px}
h1{font-size:22px;margin:0 0 4px}h2{font-size:17px;margin:0 0 12px}.muted{color:#5d6862;font-size:13px}
table{width:100%;border-collapse:collapse}td,th{padding:8px 4px;border-bottom:1px solid #eceee9;text-align:left;vertical-align:top}
th{font-size:12px;text-transform:uppercase;letter-spacing:.04em;color:#5d6862}td.num,th.num{text-align:right;white-space:nowrap}
label{display:block;font-size:13px;font-weight:600;margin:12px 0 4px}
input{width:100%;padding:10px;border:1px solid #bfc6bf;border-radius:6px;font:inherit}
.row{display:flex;gap:12px}.row>div{flex:1}
button{margin-top:18px;width:100%;padding:12px;border:0;border-radius:6px;background:#1f6b4f;color:#fff;font:600 15px system-ui,sans-serif;cursor:pointer}
button.secondary{background:#fff;color:#1f6b4f;border:1px solid #1f6b4f}
.error{background:#fdecea;border:1px solid #f1b5ae;color:#8a1c12;padding:10px 12px;border-radius:6px;margin-bottom:12px}
.ok{background:#e8f5ee;border:1px solid #a9d8bf;color:#1b5e40;padding:10px 12px;border-radius:6px;margin-bottom:12px}
.pill{display:inline-block;padding:1px 8px;border-radius:999px;font-size:12px;background:#eceee9}
.pill.paid,.pill.active{background:#dff3e8;color:#1b5e40}.pill.open,.pill.past_due{background:#fff1d6;color:#7a4b00}
a{color:#1f6b4f}.total td{font-weight:700;border-bottom:0}
`;

export function page(title: string, main: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>${esc(title)}</title><style>${CSS}</style></head><body>
<div class="banner">Local test payment provider — no real money moves. Use test card 4242 4242 4242 4242.</div>
<main>${main}</main></body></html>`;
}

export interface CardFormOptions {
  action: string;
  button: string;
  error?: string | null;
  askEmail?: boolean;
  values?: { email?: string; name?: string; expiry?: string };
}

export function cardForm(o: CardFormOptions): string {
  const v = o.values ?? {};
  return `<form method="post" action="${esc(o.action)}" novalidate>
${o.error ? `<div class="error" role="alert">${esc(o.error)}</div>` : ""}
${o.askEmail ? `<label for="email">E-mail</label><input id="email" name="email" type="email" autocomplete="email" required value="${esc(v.email)}">` : ""}
<label for="name">Name on card</label><input id="name" name="name" autocomplete="cc-name" value="${esc(v.name)}">
<label for="number">Card number</label><input id="number" name="number" inputmode="numeric" autocomplete="cc-number" placeholder="4242 4242 4242 4242" required>
<div class="row"><div><label for="expiry">Expiry (MM / YY)</label><input id="expiry" name="expiry" autocomplete="cc-exp" placeholder="12 / 34" required value="${esc(v.expiry)}"></div>
<div><label for="cvc">CVC</label><input id="cvc" name="cvc" inputmode="numeric" autocomplete="cc-csc" placeholder="123" required></div></div>
<button type="submit">${esc(o.button)}</button>
<p class="muted">Test cards: 4242 4242 4242 4242 succeeds; 4000 0000 0000 0002 is declined; 4000 0000 0000 0341 saves but later charges fail. Any future expiry, any 3-digit CVC.</p>
</form>`;
}

export function notFoundPage(what: string): string {
  return page("Not found", `<div class="card"><h1>Not found</h1><p>${esc(what)}</p></div>`);
}

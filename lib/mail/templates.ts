/** Plain, accessible e-mail bodies (text + minimal inline-styled HTML). */

const escape = (s: string) =>
  s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");

function layout(title: string, body: string): string {
  return `<!doctype html><html><body style="margin:0;padding:24px;background:#f6f7f9;font-family:system-ui,sans-serif;color:#111827">
<div style="max-width:480px;margin:0 auto;background:#fff;border:1px solid #e5e7eb;border-radius:8px;padding:28px">
<p style="margin:0 0 16px;font-weight:600;letter-spacing:.02em">Ketwise</p>
<h1 style="font-size:18px;margin:0 0 12px">${escape(title)}</h1>${body}</div></body></html>`;
}

/** The sign-in link mail; `minutes` is how long the link stays valid. */
export function magicLinkMail(url: string, minutes: number) {
  const subject = "Your Ketwise sign-in link";
  const text = `Sign in to Ketwise by opening this link:\n\n${url}\n\nIt works once and expires in ${minutes} minutes. If you did not ask for it, ignore this e-mail.\n`;
  const html = layout(
    "Sign in to Ketwise",
    `<p style="margin:0 0 20px;line-height:1.5">Use the button below to sign in. The link works once and expires in ${minutes} minutes.</p>
<p style="margin:0 0 20px"><a href="${escape(url)}" style="display:inline-block;background:#1f3a8a;color:#fff;text-decoration:none;padding:10px 18px;border-radius:6px">Sign in</a></p>
<p style="margin:0;font-size:13px;color:#6b7280;line-height:1.5">If you did not ask for this e-mail, you can ignore it.</p>`,
  );
  return { subject, text, html };
}

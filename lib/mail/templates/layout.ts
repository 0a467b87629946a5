/**
 * The shared frame of every Ketwise e-mail, as Handlebars templates (HTML with
 * automatic escaping of `{{…}}`; plain text compiled with `noEscape`).
 *
 * E-mail HTML conventions (common practice for mail clients): one centred
 * table-free column at most 560 px wide, inline styles only (clients drop
 * <style> and classes), system fonts, a bulletproof link-button, and a
 * plain-text part that says everything the HTML says.
 */
import Handlebars from "handlebars";
import { subjectSafeName } from "@/lib/validation/names";

/** Ketwise's accent (the verdigris of the logo) and neutrals, as hex for mail clients. */
export const MAIL_COLORS = {
  accent: "#13777d",
  ink: "#1b2430",
  ink2: "#4b5563",
  line: "#e3e7ec",
  canvas: "#f5f7f9",
} as const;

const hb = Handlebars.create();

hb.registerPartial(
  "button",
  `<p style="margin:24px 0"><a href="{{href}}" style="display:inline-block;background:${MAIL_COLORS.accent};color:#ffffff;text-decoration:none;font-weight:600;padding:11px 20px;border-radius:6px">{{label}}</a></p>`,
);

const frame = hb.compile(
  `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1"><title>{{title}}</title></head>
<body style="margin:0;padding:32px 12px;background:${MAIL_COLORS.canvas};font-family:-apple-system,BlinkMacSystemFont,'Segoe UI',Roboto,Helvetica,Arial,sans-serif;color:${MAIL_COLORS.ink}">
<div style="display:none;max-height:0;overflow:hidden">{{preview}}</div>
<div style="max-width:560px;margin:0 auto">
<p style="margin:0 0 16px 4px;font-size:15px;font-weight:700;letter-spacing:-0.01em;color:${MAIL_COLORS.ink}"><span style="display:inline-block;width:18px;height:18px;border-radius:4px;background:${MAIL_COLORS.accent};vertical-align:-3px;margin-right:8px"></span>ketwise</p>
<div style="background:#ffffff;border:1px solid ${MAIL_COLORS.line};border-radius:10px;padding:28px 28px 24px">
<h1 style="margin:0 0 14px;font-size:19px;line-height:1.35;font-weight:650">{{title}}</h1>
{{{body}}}
</div>
<p style="margin:16px 4px 0;font-size:12px;line-height:1.5;color:${MAIL_COLORS.ink2}">{{footer}}</p>
</div></body></html>`,
);

/** Compiles an HTML body template (escaped) with the shared partials. */
export function htmlTemplate<T>(source: string): (data: T) => string {
  return hb.compile(source, { strict: true }) as (data: T) => string;
}

/** Compiles a plain-text template (no HTML escaping). */
export function textTemplate<T>(source: string): (data: T) => string {
  return hb.compile(source, { noEscape: true, strict: true }) as (data: T) => string;
}

export type RenderedMail = { subject: string; text: string; html: string };

/** Wraps a rendered body in the frame. `preview` is the inbox preview line. */
export function frameMail(input: {
  subject: string;
  title: string;
  preview: string;
  bodyHtml: string;
  text: string;
  footer?: string;
}): RenderedMail {
  const footer =
    input.footer ??
    "You get this e-mail because of your Ketwise account. Ketwise never asks for your password by e-mail.";
  const html = frame({ title: input.title, preview: input.preview, body: input.bodyHtml, footer });
  // Subjects are one line of bounded length whatever a template put in them.
  const subject = subjectSafeName(input.subject, 160);
  return { subject, text: `${input.text.trim()}\n\n— Ketwise\n`, html };
}

/** A paragraph style shared by the body templates. */
export const P = `style="margin:0 0 14px;font-size:15px;line-height:1.6;color:${MAIL_COLORS.ink}"`;
export const MUTED = `style="margin:0;font-size:13px;line-height:1.55;color:${MAIL_COLORS.ink2}"`;

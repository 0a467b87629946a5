/** The one-time sign-in link. */
import { frameMail, htmlTemplate, MUTED, P, textTemplate, type RenderedMail } from "./layout";

type Data = { url: string; minutes: number };

const html = htmlTemplate<Data>(
  `<p ${P}>Use the button below to sign in to Ketwise. The link works once and expires in {{minutes}} minutes.</p>
{{> button href=url label="Sign in to Ketwise"}}
<p ${MUTED}>If the button does not work, paste this address into your browser:<br><a href="{{url}}" style="color:#13777d;word-break:break-all">{{url}}</a></p>
<p ${MUTED}><br>Didn't ask to sign in? Ignore this e-mail — your account stays as it is.</p>`,
);

const text = textTemplate<Data>(
  `Sign in to Ketwise by opening this link:

{{url}}

It works once and expires in {{minutes}} minutes. If you did not ask for it, ignore this e-mail.`,
);

/** The sign-in link mail; `minutes` is how long the link stays valid. */
export function magicLinkMail(url: string, minutes: number): RenderedMail {
  const data = { url, minutes };
  return frameMail({
    subject: "Your Ketwise sign-in link",
    title: "Sign in to Ketwise",
    preview: `Your sign-in link; it expires in ${minutes} minutes.`,
    bodyHtml: html(data),
    text: text(data),
  });
}

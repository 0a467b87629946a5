/**
 * Sent instead of a new account when someone signs up with an address that
 * already has one: the sign-up page answers the same either way (no account
 * enumeration), and the owner learns about the attempt here.
 */
import { frameMail, htmlTemplate, MUTED, P, textTemplate, type RenderedMail } from "./layout";

type Data = { signInUrl: string };

const html = htmlTemplate<Data>(
  `<p ${P}>Someone — probably you — tried to create a Ketwise account with this e-mail address. You already have one, so nothing was changed.</p>
{{> button href=signInUrl label="Sign in to Ketwise"}}
<p ${MUTED}>Forgot your password? On the sign-in page choose "E-mail link" to get a one-time sign-in link.</p>
<p ${MUTED}><br>Not you? You can ignore this e-mail; your account and password stay as they are.</p>`,
);

const text = textTemplate<Data>(
  `Someone — probably you — tried to create a Ketwise account with this e-mail address. You already have one, so nothing was changed.

Sign in: {{signInUrl}}

Forgot your password? Choose "E-mail link" on the sign-in page. Not you? Ignore this e-mail.`,
);

export function accountExistsMail(signInUrl: string): RenderedMail {
  return frameMail({
    subject: "You already have a Ketwise account",
    title: "You already have an account",
    preview: "Someone tried to sign up with your address; nothing was changed.",
    bodyHtml: html({ signInUrl }),
    text: text({ signInUrl }),
  });
}

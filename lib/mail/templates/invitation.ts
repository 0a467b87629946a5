/** "You're invited to an organisation" — carries the signed, single-use join link. */
import { subjectSafeName } from "@/lib/validation/names";
import { frameMail, htmlTemplate, MUTED, P, textTemplate, type RenderedMail } from "./layout";

export type InvitationMailData = {
  orgName: string;
  inviterName: string;
  roleLabel: string;
  url: string;
  /** When the link stops working, already formatted (e.g. "21 May 2026, 14:00 UTC"). */
  expires: string;
};

const html = htmlTemplate<InvitationMailData>(
  `<p ${P}><strong>{{inviterName}}</strong> invited you to join <strong>{{orgName}}</strong> on Ketwise as <strong>{{roleLabel}}</strong>.</p>
<p ${P}>Ketwise computes expectation values of observables on the states your circuits prepare — exact, sampled and noisy — for the whole team.</p>
{{> button href=url label="Accept the invitation"}}
<p ${MUTED}>The link works once and expires on {{expires}}. If the button does not work, paste this address into your browser:<br><a href="{{url}}" style="color:#13777d;word-break:break-all">{{url}}</a></p>
<p ${MUTED}><br>Not expecting this? You can ignore the e-mail; nothing happens until the link is used.</p>`,
);

const text = textTemplate<InvitationMailData>(
  `{{inviterName}} invited you to join {{orgName}} on Ketwise as {{roleLabel}}.

Accept the invitation:
{{url}}

The link works once and expires on {{expires}}. Not expecting this? Ignore this e-mail; nothing happens until the link is used.`,
);

export function invitationMail(data: InvitationMailData): RenderedMail {
  return frameMail({
    subject: `You are invited to ${subjectSafeName(data.orgName)} on Ketwise`,
    title: `Join ${data.orgName} on Ketwise`,
    preview: `You're invited as ${data.roleLabel}. The link expires on ${data.expires}.`,
    bodyHtml: html(data),
    text: text(data),
  });
}

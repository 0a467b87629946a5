/** "Your run finished" — sent when a run that took longer than a minute ends. */
import { subjectSafeName } from "@/lib/validation/names";
import { frameMail, htmlTemplate, MUTED, P, textTemplate, type RenderedMail } from "./layout";

export type RunFinishedMailData = {
  runName: string;
  /** "finished", "failed" or "canceled". */
  verb: string;
  minutes: string;
  /** One line with the outcome (values with their uncertainty, or the error). */
  outcome: string;
  url: string;
};

const html = htmlTemplate<RunFinishedMailData>(
  `<p ${P}>Your run <strong>{{runName}}</strong> {{verb}} after {{minutes}} minutes.</p>
<p ${P} >{{outcome}}</p>
{{> button href=url label="Open the run"}}
<p ${MUTED}>Simulated values are not device measurements.</p>`,
);

const text = textTemplate<RunFinishedMailData>(
  `Your Ketwise run "{{runName}}" {{verb}} after {{minutes}} minutes.

{{outcome}}

Open it: {{url}}`,
);

export function runFinishedMailFrom(data: RunFinishedMailData): RenderedMail {
  return frameMail({
    subject: `Run "${subjectSafeName(data.runName)}" ${data.verb}`,
    title: `Run ${data.verb}`,
    preview: data.outcome,
    bodyHtml: html(data),
    text: text(data),
  });
}

/** "Your run finished" — sent when a run that took longer than a minute ends. */
import { subjectSafeName } from "@/lib/validation/names";
import { frameMail, htmlTemplate, MUTED, P, textTemplate, type RenderedMail } from "./layout";

export type RunFinishedMailData = {
  runName: string;
  /** "finished", "failed" or "canceled". */
  verb: string;
  /** How long it ran ("3 min 05 s"), null when unknown. */
  duration: string | null;
  /** One line with the outcome (values with their uncertainty, or the error). */
  outcome: string;
  url: string;
};

const html = htmlTemplate<RunFinishedMailData>(
  `<p ${P}>Your run <strong>{{runName}}</strong> {{verb}}{{#if duration}} after {{duration}}{{/if}}.</p>
<p ${P} >{{outcome}}</p>
{{> button href=url label="Open the run"}}
<p ${MUTED}>Simulated values are not device measurements.</p>`,
);

const text = textTemplate<RunFinishedMailData>(
  `Your Ketwise run "{{runName}}" {{verb}}{{#if duration}} after {{duration}}{{/if}}.

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

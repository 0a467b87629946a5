/** The "your run finished" e-mail (text + minimal inline-styled HTML). */
import type { Run } from "@/db/schema";

const escape = (s: string) => s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");

function headline(run: Run): string {
  if (run.status !== "succeeded") return run.error?.detail ?? `The run ${run.status}.`;
  const result = run.result as { exact?: { value: number }; sampled?: { mean: number; stdErr: number } | null } | null;
  const exact = result?.exact ? `exact value ${result.exact.value.toPrecision(8)}` : "";
  const sampled = result?.sampled ? `, sampled ${result.sampled.mean.toPrecision(6)} ± ${result.sampled.stdErr.toPrecision(2)}` : "";
  return `Finished with ${exact}${sampled}.`;
}

export function runFinishedMail(run: Run, url: string) {
  const minutes = run.startedAt && run.finishedAt ? (run.finishedAt.getTime() - run.startedAt.getTime()) / 60_000 : 0;
  const verb = run.status === "succeeded" ? "finished" : run.status;
  const subject = `Run "${run.name}" ${verb}`;
  const line = headline(run);
  const text = `Your Ketwise run "${run.name}" ${verb} after ${minutes.toFixed(1)} minutes.\n\n${line}\n\nOpen it: ${url}\n`;
  const html = `<!doctype html><html><body style="font-family:system-ui,sans-serif;color:#111827;padding:24px">
<p style="font-weight:600">Ketwise</p><h1 style="font-size:18px">${escape(subject)}</h1>
<p style="line-height:1.5">It ran for ${minutes.toFixed(1)} minutes. ${escape(line)}</p>
<p><a href="${escape(url)}">Open the run</a></p></body></html>`;
  return { subject, text, html };
}

/** The "your run finished" e-mail (template in lib/mail/templates/run-finished.ts). */
import type { Run } from "@/db/schema";
import { runFinishedMailFrom } from "@/lib/mail/templates";
import { formatDuration, formatPlusMinus, formatSignificant } from "@/lib/format";

function headline(run: Run): string {
  if (run.status !== "succeeded") return run.error?.detail ?? `The run ${run.status}.`;
  const result = run.result as {
    exact?: { value: number };
    sampled?: { mean: number; stdErr: number } | null;
  } | null;
  const exact = result?.exact ? `exact value ${formatSignificant(result.exact.value, 8)}` : "";
  const sampled = result?.sampled
    ? `, sampled ${formatPlusMinus(result.sampled.mean, result.sampled.stdErr)}`
    : "";
  return `Finished with ${exact}${sampled}.`;
}

export function runFinishedMail(run: Run, url: string) {
  const ms =
    run.startedAt && run.finishedAt ? run.finishedAt.getTime() - run.startedAt.getTime() : null;
  const verb = run.status === "succeeded" ? "finished" : run.status;
  return runFinishedMailFrom({
    runName: run.name,
    verb,
    duration: ms === null ? null : formatDuration(ms),
    outcome: headline(run),
    url,
  });
}

/** The "your run finished" e-mail (template in lib/mail/templates/run-finished.ts). */
import type { Run } from "@/db/schema";
import { runFinishedMailFrom } from "@/lib/mail/templates";

function headline(run: Run): string {
  if (run.status !== "succeeded") return run.error?.detail ?? `The run ${run.status}.`;
  const result = run.result as {
    exact?: { value: number };
    sampled?: { mean: number; stdErr: number } | null;
  } | null;
  const exact = result?.exact ? `exact value ${result.exact.value.toPrecision(8)}` : "";
  const sampled = result?.sampled
    ? `, sampled ${result.sampled.mean.toPrecision(6)} ± ${result.sampled.stdErr.toPrecision(2)}`
    : "";
  return `Finished with ${exact}${sampled}.`;
}

export function runFinishedMail(run: Run, url: string) {
  const minutes =
    run.startedAt && run.finishedAt
      ? (run.finishedAt.getTime() - run.startedAt.getTime()) / 60_000
      : 0;
  const verb = run.status === "succeeded" ? "finished" : run.status;
  return runFinishedMailFrom({
    runName: run.name,
    verb,
    minutes: minutes.toFixed(1),
    outcome: headline(run),
    url,
  });
}

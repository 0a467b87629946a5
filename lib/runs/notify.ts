/**
 * Optional notification: when a run that took longer than a minute finishes,
 * its submitter (the user, or the creator of the API key) gets an e-mail with
 * the outcome and a link to the run page. Sent from a queued job so a mail
 * server hiccup never affects the run; best effort.
 */
import "server-only";
import { getUserById } from "@/lib/auth/queries";
import { env } from "@/lib/env";
import { sendMail } from "@/lib/mail/transport";
import { enqueue } from "@/lib/queue/enqueue";
import type { RunFinishedMailJob } from "@/lib/queue/jobs";
import { findRun } from "./queries";
import { runFinishedMail } from "./run-mail";

export const NOTIFY_AFTER_MS = 60_000;

export async function notifyIfLong(
  orgId: string,
  runId: string,
  elapsedMs: number,
  log: (m: string, e?: unknown) => void,
) {
  if (elapsedMs < NOTIFY_AFTER_MS) return;
  try {
    await enqueue("run.finished-mail", { orgId, runId }, { jobId: `mail-${runId}` });
  } catch (error) {
    log(`could not queue the finished-run mail for ${runId}`, error);
  }
}

/** Job handler: sends the mail once (the job id is per run). */
export async function sendRunFinishedMail(job: RunFinishedMailJob): Promise<void> {
  const run = await findRun(job.orgId, job.runId);
  if (!run || !run.createdByUserId || !run.finishedAt) return;
  const user = await getUserById(run.createdByUserId);
  if (!user?.email) return;
  const url = `${env.APP_URL}/app/runs/${run.id}`;
  await sendMail({ to: user.email, ...runFinishedMail(run, url) });
}

/**
 * Canceling: a queued run is canceled at once (its job is removed, and the
 * worker skips it if it was already taken); a running run is marked canceled
 * and its worker stops the engine within a fraction of a second. Canceling a
 * canceled run is a no-op; a run that already succeeded or failed is 409.
 */
import "server-only";
import type { Run } from "@/db/schema";
import { conflict } from "@/lib/api/problem";
import { removeWaitingJob } from "@/lib/queue/enqueue";
import { cancelRun as cancelRunRow } from "./mutations";
import { getRunOrThrow } from "./queries";

export async function cancelRunForOrg(orgId: string, runId: string): Promise<Run> {
  const before = await getRunOrThrow(orgId, runId);
  if (before.status === "canceled") return before;
  if (before.status === "succeeded" || before.status === "failed") {
    throw conflict(
      `The run already ${before.status === "succeeded" ? "succeeded" : "failed"}; only queued or running runs can be canceled.`,
    );
  }
  const changed = await cancelRunRow(orgId, runId);
  const after = await getRunOrThrow(orgId, runId);
  if (!changed && after.status !== "canceled") {
    throw conflict(`The run ${after.status} before it could be canceled.`);
  }
  if (before.status === "queued") await removeWaitingJob(runId);
  return after;
}

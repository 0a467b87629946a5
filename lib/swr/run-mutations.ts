"use client";
/** Run mutations from the browser (the API answers the updated run). */
import { apiFetch } from "./api-client";
import type { Run } from "./types";

export function cancelRun(orgId: string, id: string): Promise<Run> {
  return apiFetch<Run>(orgId, `/api/v1/runs/${encodeURIComponent(id)}/cancel`, { method: "POST" });
}

/** Cancels several runs one after another; returns the ids that failed with their messages. */
export async function cancelRuns(
  orgId: string,
  ids: readonly string[],
): Promise<{ id: string; message: string }[]> {
  const failures: { id: string; message: string }[] = [];
  for (const id of ids) {
    try {
      await cancelRun(orgId, id);
    } catch (e) {
      failures.push({ id, message: e instanceof Error ? e.message : "could not cancel" });
    }
  }
  return failures;
}

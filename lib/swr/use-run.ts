"use client";
import useSWR from "swr";
import { orgFetcher } from "./api-client";
import { useWorkspaceOrg } from "./org-context";
import { isTerminal, type Run } from "./types";

/** Poll interval while a run is queued or running. */
export const RUN_POLL_MS = 800;

/** One run, polled every 0.8 s until it is terminal (then no more requests). */
export function useRun(id: string | null, fallbackData?: Run) {
  const { orgId } = useWorkspaceOrg();
  return useSWR<Run>(
    id ? ([orgId, `/api/v1/runs/${encodeURIComponent(id)}`] as const) : null,
    orgFetcher,
    {
      refreshInterval: (run) => (run && isTerminal(run.status) ? 0 : RUN_POLL_MS),
      revalidateOnFocus: false,
      fallbackData,
    },
  );
}

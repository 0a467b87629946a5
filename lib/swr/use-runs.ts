"use client";
import useSWR from "swr";
import { orgFetcher, withQuery } from "./api-client";
import { useWorkspaceOrg } from "./org-context";
import { isTerminal, type Page, type RunSummary, type RunsQuery } from "./types";

export type { RunsQuery } from "./types";

/** A page of runs; refreshes every 2 s while any run on it is still queued or running. */
export function useRuns(query: RunsQuery = {}) {
  const { orgId } = useWorkspaceOrg();
  const path = withQuery("/api/v1/runs", {
    status: query.status,
    method: query.method,
    createdBy: query.createdBy,
    q: query.q,
    from: query.from,
    to: query.to,
    cursor: query.cursor,
    limit: query.limit ?? 20,
  });
  return useSWR<Page<RunSummary>>([orgId, path] as const, orgFetcher, {
    keepPreviousData: true,
    refreshInterval: (page) => (page?.data.some((r) => !isTerminal(r.status)) ? 2000 : 0),
  });
}

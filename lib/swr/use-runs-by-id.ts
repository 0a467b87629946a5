"use client";
import useSWR from "swr";
import { apiFetch } from "./api-client";
import { useWorkspaceOrg } from "./org-context";
import type { Run } from "./types";

/** Several runs at once (compare view); a missing one is reported, the others still load. */
export function useRunsById(ids: readonly string[]) {
  const { orgId } = useWorkspaceOrg();
  return useSWR<{ runs: Run[]; missing: string[] }>(
    ids.length ? ([orgId, "runs-by-id", ids.join(",")] as const) : null,
    async ([o, , joined]: readonly [string, string, string]) => {
      const list = joined.split(",");
      const settled = await Promise.allSettled(
        list.map((id) => apiFetch<Run>(o, `/api/v1/runs/${encodeURIComponent(id)}`)),
      );
      const runs: Run[] = [];
      const missing: string[] = [];
      settled.forEach((s, i) =>
        s.status === "fulfilled" ? runs.push(s.value) : missing.push(list[i]),
      );
      return { runs, missing };
    },
    {
      keepPreviousData: true,
      refreshInterval: (d) =>
        d?.runs.some((r) => r.status === "queued" || r.status === "running") ? 1500 : 0,
    },
  );
}

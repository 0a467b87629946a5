"use client";
import useSWR from "swr";
import { orgFetcher } from "./api-client";
import { useWorkspaceOrg } from "./org-context";
import type { Usage } from "./types";

/** This period's usage meters against the plan's quotas; refreshed every 15 s. */
export function useUsage() {
  const { orgId } = useWorkspaceOrg();
  return useSWR<Usage>([orgId, "/api/v1/usage"] as const, orgFetcher, { refreshInterval: 15_000 });
}

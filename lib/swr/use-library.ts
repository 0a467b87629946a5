"use client";
import useSWR from "swr";
import { orgFetcher, withQuery } from "./api-client";
import { useWorkspaceOrg } from "./org-context";
import type { LibraryCircuit, LibraryObservable, Page } from "./types";

export function useCircuits(opts: { q?: string; cursor?: string | null; limit?: number } = {}) {
  const { orgId } = useWorkspaceOrg();
  const path = withQuery("/api/v1/circuits", { q: opts.q, cursor: opts.cursor, limit: opts.limit ?? 50 });
  return useSWR<Page<LibraryCircuit>>([orgId, path] as const, orgFetcher, { keepPreviousData: true });
}

export function useObservables(opts: { q?: string; cursor?: string | null; limit?: number } = {}) {
  const { orgId } = useWorkspaceOrg();
  const path = withQuery("/api/v1/observables", { q: opts.q, cursor: opts.cursor, limit: opts.limit ?? 50 });
  return useSWR<Page<LibraryObservable>>([orgId, path] as const, orgFetcher, { keepPreviousData: true });
}

"use client";
import useSWR from "swr";
import { apiFetch, orgFetcher, withQuery } from "./api-client";
import { useWorkspaceOrg } from "./org-context";
import type {
  LibraryCircuit,
  LibraryCircuitSummary,
  LibraryObservable,
  LibraryObservableSummary,
  LibraryQuery,
  Page,
} from "./types";

type ListOpts = LibraryQuery;

/** Saved circuits of the organisation (summaries, newest first). */
export function useCircuits(opts: ListOpts = {}) {
  const { orgId } = useWorkspaceOrg();
  const path = withQuery("/api/v1/circuits", {
    tag: opts.tag,
    cursor: opts.cursor,
    limit: opts.limit ?? 50,
  });
  return useSWR<Page<LibraryCircuitSummary>>([orgId, path] as const, orgFetcher, {
    keepPreviousData: true,
  });
}

/** Saved observables of the organisation (summaries, newest first). */
export function useObservables(opts: ListOpts = {}) {
  const { orgId } = useWorkspaceOrg();
  const path = withQuery("/api/v1/observables", {
    tag: opts.tag,
    cursor: opts.cursor,
    limit: opts.limit ?? 50,
  });
  return useSWR<Page<LibraryObservableSummary>>([orgId, path] as const, orgFetcher, {
    keepPreviousData: true,
  });
}

/** One saved item with its source / terms / matrix. */
export function useLibraryItem<K extends "circuits" | "observables">(kind: K, id: string | null) {
  const { orgId } = useWorkspaceOrg();
  return useSWR<K extends "circuits" ? LibraryCircuit : LibraryObservable>(
    id ? ([orgId, `/api/v1/${kind}/${encodeURIComponent(id)}`] as const) : null,
    orgFetcher,
  );
}

export function fetchCircuit(orgId: string, id: string): Promise<LibraryCircuit> {
  return apiFetch<LibraryCircuit>(orgId, `/api/v1/circuits/${encodeURIComponent(id)}`);
}

export function fetchObservable(orgId: string, id: string): Promise<LibraryObservable> {
  return apiFetch<LibraryObservable>(orgId, `/api/v1/observables/${encodeURIComponent(id)}`);
}

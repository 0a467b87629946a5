"use client";
import useSWR from "swr";
import { apiFetch, type ApiError } from "./api-client";
import { useDebounced } from "./use-debounced";
import { useWorkspaceOrg } from "./org-context";
import type { Preview } from "./types";

/**
 * Live preview of a draft request (`POST /api/v1/runs/preview`), debounced while the
 * user types. The key holds the serialised body, so identical drafts share one answer;
 * the previous answer stays visible while the next one loads. A 400 answer carries the
 * engine's field errors (with line/column for the circuit and the observable).
 */
export function usePreview(request: object | null, delay = 450) {
  const { orgId } = useWorkspaceOrg();
  const body = useDebounced(request ? JSON.stringify(request) : null, delay);
  const swr = useSWR<Preview, ApiError>(
    body ? ([orgId, "/api/v1/runs/preview", body] as const) : null,
    ([o, path, b]: readonly [string, string, string]) =>
      apiFetch<Preview>(o, path, { method: "POST", json: JSON.parse(b) }),
    {
      keepPreviousData: true,
      revalidateOnFocus: false,
      shouldRetryOnError: false,
      dedupingInterval: 30_000,
    },
  );
  const pending = (request ? JSON.stringify(request) : null) !== body || swr.isValidating;
  return { ...swr, pending };
}

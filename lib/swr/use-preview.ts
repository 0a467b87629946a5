"use client";
import { useState } from "react";
import useSWR from "swr";
import type { CircuitOutline } from "@/lib/quantum/schemas";
import { previewProblemSchema } from "@/lib/runs/schemas";
import { apiFetch, type ApiError } from "./api-client";
import { useDebounced } from "./use-debounced";
import { useWorkspaceOrg } from "./org-context";
import type { CircuitPreview, CircuitPreviewRequest, Preview } from "./types";

const PATH = "/api/v1/runs/preview";

/** An answer with the body it answers (SWR keeps the previous key's data while the next loads). */
type Tagged<T> = { body: string; answer: T };

const post = async <T>([orgId, path, body]: readonly [string, string, string]): Promise<
  Tagged<T>
> => ({ body, answer: await apiFetch<T>(orgId, path, { method: "POST", json: JSON.parse(body) }) });

const options = {
  keepPreviousData: true,
  revalidateOnFocus: false,
  shouldRetryOnError: false,
  dedupingInterval: 30_000,
};

/** Outlines read from problems, once per error (a stable object for the same answer). */
const problemOutlines = new WeakMap<ApiError, CircuitOutline | null>();

/**
 * The outline the answer to `body` carries: its own, or the one in its problem (null: none;
 * undefined: not answered yet — an earlier draft's answer, kept on screen, never counts).
 */
function outlineOf<T extends { outline: CircuitOutline | null }>(
  swr: { data?: Tagged<T>; error?: ApiError },
  body: string,
): CircuitOutline | null | undefined {
  const { error } = swr;
  if (error) {
    if (!problemOutlines.has(error))
      problemOutlines.set(error, previewProblemSchema.safeParse(error.body).data?.outline ?? null);
    return problemOutlines.get(error) ?? null;
  }
  return swr.data?.body === body ? swr.data.answer.outline : undefined;
}

/**
 * Live preview of the new-run draft (`POST /api/v1/runs/preview`), debounced while the
 * user types: the whole `request` when the form has no issues of its own, else only its
 * `circuit` (`?only=circuit`) — one request per pause either way. Every answer carries the
 * circuit's outline (a failed full preview in its problem, when the circuit itself is
 * fine), so the diagram and the input fields follow the circuit while the observable or
 * the settings are still being written; a failed parse keeps the last good outline,
 * marked `outlineStale`. `data` / `error` are the full preview's: the previous answer
 * stays visible while the next one loads, and a 400 carries the engine's field errors
 * (with line/column for the circuit and the observable).
 */
export function usePreview(
  request: object | null,
  circuit: CircuitPreviewRequest | null,
  delay = 450,
) {
  const { orgId } = useWorkspaceOrg();
  const wanted = request
    ? `full\n${JSON.stringify(request)}`
    : circuit
      ? `circuit\n${JSON.stringify(circuit)}`
      : null;
  const settled = useDebounced(wanted, delay);
  const [mode, body] = settled ? [settled.slice(0, settled.indexOf("\n")), settled] : [null, ""];
  const json = body.slice(body.indexOf("\n") + 1);
  const full = useSWR<Tagged<Preview>, ApiError, readonly [string, string, string] | null>(
    mode === "full" ? [orgId, PATH, json] : null,
    post<Preview>,
    options,
  );
  const outlineOnly = useSWR<
    Tagged<CircuitPreview>,
    ApiError,
    readonly [string, string, string] | null
  >(
    mode === "circuit" ? [orgId, `${PATH}?only=circuit`, json] : null,
    post<CircuitPreview>,
    options,
  );

  const answer =
    mode === "full"
      ? outlineOf(full, json)
      : mode === "circuit"
        ? outlineOf(outlineOnly, json)
        : undefined;
  const [kept, setKept] = useState<CircuitOutline | null>(null);
  if (answer && answer !== kept) setKept(answer);

  return {
    data: full.data?.answer,
    error: full.error,
    pending: wanted !== settled || full.isValidating || outlineOnly.isValidating,
    /** The circuit's latest outline (null without a circuit). */
    outline: circuit ? (answer ?? kept) : null,
    /** The latest answer could not outline the circuit: `outline` is the last good one. */
    outlineStale: answer === null,
  };
}

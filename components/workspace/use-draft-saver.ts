"use client";
/**
 * Saves the new-run form's draft per organisation after each pause in typing, and at once
 * when the page is left (a reload right after a change must not lose it).
 */
import { useEffect, type RefObject } from "react";
import type { UseFormSubscribe } from "react-hook-form";
import { draftKey, writeDraft } from "./run-builder-draft";
import type { RunBuilderValues } from "./run-builder-model";

export function useDraftSaver(
  orgId: string,
  subscribe: UseFormSubscribe<RunBuilderValues>,
  /** False until the form holds its start (the defaults must not overwrite a draft). */
  loaded: RefObject<boolean>,
) {
  useEffect(() => {
    let t: ReturnType<typeof setTimeout> | undefined;
    let pending: RunBuilderValues | null = null;
    const flush = () => {
      clearTimeout(t);
      if (pending) window.localStorage.setItem(draftKey(orgId), writeDraft(pending));
      pending = null;
    };
    const unsubscribe = subscribe({
      formState: { values: true },
      callback: ({ values }) => {
        if (!loaded.current) return;
        pending = values;
        clearTimeout(t);
        t = setTimeout(flush, 300);
      },
    });
    window.addEventListener("pagehide", flush);
    return () => {
      flush();
      window.removeEventListener("pagehide", flush);
      unsubscribe();
    };
  }, [subscribe, orgId, loaded]);
}

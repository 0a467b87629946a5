"use client";
/**
 * What the new-run form starts with: an explicit prefill (?from=run, ?circuit=…,
 * ?observable=…) wins over the draft saved in this browser. The start is decided once, in
 * render, when both are known (the stored draft reads as undefined on the server and while
 * hydrating); an effect then fills the form with it. `loaded` turns true once the form
 * holds its start, so the draft saver never stores the defaults over a draft.
 */
import type { ReadonlyURLSearchParams } from "next/navigation";
import { useEffect, useRef, useState, useSyncExternalStore } from "react";
import type { UseFormReset } from "react-hook-form";
import { draftKey, readDraft } from "./run-builder-draft";
import { DEFAULT_VALUES, type RunBuilderValues } from "./run-builder-model";
import { usePrefill } from "./use-prefill";

type Start = { from: "none" } | { from: "draft" | "prefill"; values: RunBuilderValues };
const noSubscription = () => () => {};

export function useRunBuilderStart(
  orgId: string,
  search: ReadonlyURLSearchParams,
  reset: UseFormReset<RunBuilderValues>,
) {
  const loaded = useRef(false);
  const prefill = usePrefill(search);
  const storedDraft = useSyncExternalStore(
    noSubscription,
    () => window.localStorage.getItem(draftKey(orgId)),
    () => undefined,
  );
  const [start, setStart] = useState<Start | null>(null);
  if (!start && prefill.state !== "loading" && storedDraft !== undefined) {
    const draft = prefill.state === "ready" ? null : readDraft(storedDraft);
    setStart(
      prefill.state === "ready"
        ? { from: "prefill", values: prefill.values }
        : draft
          ? { from: "draft", values: draft }
          : { from: "none" },
    );
  }
  useEffect(() => {
    if (!start || loaded.current) return;
    loaded.current = true;
    if (start.from !== "none") reset(start.values);
  }, [start, reset]);

  /** Forgets the saved draft and empties the form. */
  const startOver = () => {
    window.localStorage.removeItem(draftKey(orgId));
    reset(DEFAULT_VALUES);
    setStart({ from: "none" });
  };
  const restored = start && start.from !== "none" ? start.from : null;
  return { loaded, restored, startOver };
}

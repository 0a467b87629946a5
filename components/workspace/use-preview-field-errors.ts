"use client";
/**
 * The preview's engine issues as field errors of the form: circuit and observable issues
 * are drawn inline by their editors, everything else (parameters, sweeps, estimate,
 * noise) is set on its field and cleared when the next preview answers.
 */
import { useEffect, useRef } from "react";
import type { Path, UseFormReturn } from "react-hook-form";
import type { ApiError } from "@/lib/swr/api-client";
import { formPath, type RunBuilderValues } from "./run-builder-model";
import type { RunBuilderContext, RunBuilderOutput } from "./run-builder-resolver";

/** Form paths whose issues the code editors show inline (never as field errors). */
export const EDITOR_PATHS = ["circuit.source", "observable.terms"];

export function usePreviewFieldErrors(
  previewError: ApiError | null | undefined,
  swept: string[],
  form: UseFormReturn<RunBuilderValues, RunBuilderContext, RunBuilderOutput>,
) {
  const { setError, clearErrors } = form;
  const serverPaths = useRef<string[]>([]);
  useEffect(() => {
    for (const p of serverPaths.current) clearErrors(p as Path<RunBuilderValues>);
    serverPaths.current = [];
    if (!previewError) return;
    for (const e of previewError.errors) {
      const p = formPath(e.path, swept);
      if (
        EDITOR_PATHS.includes(p) ||
        p.startsWith("circuit") ||
        p.startsWith("observable") ||
        p === "root"
      )
        continue;
      setError(p as Path<RunBuilderValues>, { type: "server", message: e.message });
      serverPaths.current.push(p);
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps -- swept names are read with the error they belong to
  }, [previewError, setError, clearErrors]);
}

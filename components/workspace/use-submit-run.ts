"use client";
/**
 * Submits the new-run form: POST /api/v1/runs with a fresh idempotency key, then the run's
 * page; a refused request's problem is kept for the submit panel and its field errors are
 * set on the form (editor issues stay with the editors).
 */
import { useRouter } from "next/navigation";
import { useCallback, useState } from "react";
import type { Path, UseFormReturn } from "react-hook-form";
import { apiFetch, isApiError, type ApiError } from "@/lib/swr/api-client";
import type { Run } from "@/lib/swr/types";
import { formPath, type RunBuilderValues } from "./run-builder-model";
import type { RunBuilderContext, RunBuilderOutput } from "./run-builder-resolver";
import { EDITOR_PATHS } from "./use-preview-field-errors";

export function useSubmitRun(
  orgId: string,
  swept: string[],
  form: UseFormReturn<RunBuilderValues, RunBuilderContext, RunBuilderOutput>,
) {
  const router = useRouter();
  const { handleSubmit, setError } = form;
  const [submitError, setSubmitError] = useState<ApiError | null>(null);
  const submit = useCallback(
    () =>
      handleSubmit(async ({ body }) => {
        setSubmitError(null);
        try {
          const run = await apiFetch<Run>(orgId, "/api/v1/runs", {
            method: "POST",
            json: body,
            headers: { "idempotency-key": crypto.randomUUID() },
          });
          router.push(`/app/runs/${run.id}`);
        } catch (error) {
          if (!isApiError(error)) throw error;
          setSubmitError(error);
          for (const e of error.errors) {
            const p = formPath(e.path, swept);
            if (!EDITOR_PATHS.includes(p) && p !== "root")
              setError(p as Path<RunBuilderValues>, { type: "server", message: e.message });
          }
        }
      })(),
    [handleSubmit, orgId, router, setError, swept],
  );
  return { submit, submitError };
}

"use client";
/** The new-run form's submit box: the run's name, what stopped the last submission, Run. */
import { useFormContext } from "react-hook-form";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Input } from "@/components/ui/input";
import { Kbd } from "@/components/ui/kbd";
import type { ApiError } from "@/lib/swr/api-client";
import type { RunBuilderValues } from "./run-builder-model";

export function SubmitPanel({
  submitError,
  readOnly,
}: {
  submitError: ApiError | null;
  readOnly: boolean;
}) {
  const { formState, register } = useFormContext<RunBuilderValues>();
  const hasErrors = Object.keys(formState.errors).length > 0;
  return (
    <div className="grid gap-3 rounded-lg border border-line bg-surface p-4 shadow-card">
      <Field
        label="Run name"
        optional
        hint="Shown in the runs list; defaults to the circuit’s."
        error={formState.errors.name?.message}
      >
        <Input
          autoComplete="off"
          placeholder="e.g. Bell pair, ZZ + XX"
          readOnly={readOnly}
          {...register("name")}
        />
      </Field>
      {submitError ? (
        <Alert tone="error" compact role="alert" title={submitError.title}>
          {submitError.message}
        </Alert>
      ) : hasErrors && formState.isSubmitted ? (
        <Alert tone="error" compact role="alert">
          Check the marked fields.
        </Alert>
      ) : null}
      <Button
        type="submit"
        size="lg"
        loading={formState.isSubmitting}
        disabled={readOnly}
        className="w-full"
      >
        Run
      </Button>
      <p className="text-center text-xs text-ink-3">
        or <Kbd>Ctrl</Kbd> + <Kbd>Enter</Kbd> (<Kbd>⌘</Kbd> + <Kbd>Enter</Kbd> on a Mac)
      </p>
    </div>
  );
}

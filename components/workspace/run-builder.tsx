"use client";
/**
 * The new-run form: circuit, observable, parameters, estimate settings and noise on
 * the left, the live preview on the right. One react-hook-form form validated by the
 * shared run schema (run-builder-resolver); the draft is saved per organisation and
 * restored after a reload (use-run-builder-start, use-draft-saver); submit with the button
 * or Ctrl/Cmd+Enter from anywhere in it (use-submit-run).
 */
import { useSearchParams } from "next/navigation";
import { useMemo, useState } from "react";
import { FormProvider, useForm, useWatch } from "react-hook-form";
import { Alert, SimulationCaution } from "@/components/ui/alert";
import { canWrite, useWorkspaceOrg } from "@/lib/swr/org-context";
import { usePreview } from "@/lib/swr/use-preview";
import { CircuitCard } from "./circuit-card";
import { DEFAULT_VALUES, toRequest, type RunBuilderValues } from "./run-builder-model";
import {
  runBuilderResolver,
  type RunBuilderContext,
  type RunBuilderOutput,
} from "./run-builder-resolver";
import { EstimateCard } from "./estimate-card";
import { NoiseCard } from "./noise-card";
import { NoiseProfileControls, useNoiseProfiles } from "./noise-profiles";
import { ObservableCard } from "./observable-card";
import { ParametersCard } from "./parameters-card";
import { PreviewPanel } from "./preview-panel";
import { RestoreNotice } from "./restore-notice";
import { SubmitPanel } from "./submit-panel";
import { useRunBuilderStart } from "./use-run-builder-start";
import { useDraftSaver } from "./use-draft-saver";
import { useInputDefaults } from "./use-input-defaults";
import { usePreviewFieldErrors } from "./use-preview-field-errors";
import { useSubmitRun } from "./use-submit-run";

export function RunBuilder() {
  const { orgId, role } = useWorkspaceOrg();
  const readOnly = !canWrite(role);
  const search = useSearchParams();
  const [inputNames, setInputNames] = useState<readonly string[] | undefined>(undefined);
  const form = useForm<RunBuilderValues, RunBuilderContext, RunBuilderOutput>({
    defaultValues: DEFAULT_VALUES,
    resolver: runBuilderResolver,
    context: { inputNames },
  });

  const { loaded, restored, startOver } = useRunBuilderStart(orgId, search, form.reset);
  useDraftSaver(orgId, form.subscribe, loaded);

  // The whole form, as the preview needs it (a fresh object per change).
  const values = useWatch({ control: form.control }) as RunBuilderValues;
  const built = useMemo(() => toRequest(values, inputNames), [values, inputNames]);
  // One preview request per typing pause: the whole request, or the circuit alone while the
  // form has issues of its own; either answer carries the circuit's outline for the diagram.
  const { format, source } = values.circuit;
  const preview = usePreview(
    built.issues.length ? null : { ...built.request },
    source.trim() ? { circuit: { format, source }, parameters: built.request.parameters } : null,
  );
  const { outline, outlineStale: stale } = preview;

  // The circuit's inputs follow its latest outline (adjusted in render, not in an effect).
  const outlineNames = outline?.inputs.map((i) => i.name);
  if (outlineNames && outlineNames.join("\n") !== inputNames?.join("\n"))
    setInputNames(outlineNames);
  useInputDefaults(outline, form);

  const previewError = preview.error;

  // Engine issues → inline markers for the editors, field errors for the rest.
  const swept = values.sweepAxes.map((a) => a.name);
  const circuitIssues = previewError?.errorsAt("circuit") ?? [];
  const observableIssues = previewError?.errorsAt("observable") ?? [];
  usePreviewFieldErrors(previewError, swept, form);

  const { submit, submitError } = useSubmitRun(orgId, swept, form);
  const noiseProfiles = useNoiseProfiles();
  const inputs = outline?.inputs ?? [];

  return (
    <FormProvider {...form}>
      <form
        noValidate
        aria-label="New run"
        onSubmit={(e) => {
          e.preventDefault();
          void submit();
        }}
        onKeyDown={(e) => {
          if (e.defaultPrevented) return;
          if (e.key === "Enter" && (e.ctrlKey || e.metaKey)) {
            e.preventDefault();
            void submit();
          }
        }}
        className="grid gap-5 lg:grid-cols-[minmax(0,1fr)_22rem] xl:grid-cols-[minmax(0,1fr)_24rem]"
      >
        <div className="grid min-w-0 content-start gap-5">
          {readOnly ? (
            <Alert tone="info" title="You can look, not run">
              Viewers can compose and preview, but only members and above can submit runs.
            </Alert>
          ) : null}
          {restored ? <RestoreNotice restored={restored} onStartOver={startOver} /> : null}
          <CircuitCard
            issues={circuitIssues}
            outline={outline}
            outlineStale={stale}
            onSubmit={submit}
            readOnly={readOnly}
          />
          <ObservableCard
            issues={observableIssues}
            summary={preview.data && !previewError ? preview.data.observable : null}
            onSubmit={submit}
            readOnly={readOnly}
          />
          {values.circuit.format === "qasm3" && inputs.length ? (
            <ParametersCard inputs={inputs} readOnly={readOnly} />
          ) : null}
          <EstimateCard readOnly={readOnly} />
          <NoiseCard
            readOnly={readOnly}
            profiles={noiseProfiles.profiles}
            profilesSlot={readOnly ? null : <NoiseProfileControls state={noiseProfiles} />}
          />
        </div>
        <aside
          className="grid content-start gap-4 lg:sticky lg:top-4 lg:self-start"
          aria-label="Preview and submit"
        >
          <PreviewPanel
            preview={preview.data}
            error={previewError}
            pending={preview.pending}
            localIssues={built.issues}
          />
          <SubmitPanel submitError={submitError} readOnly={readOnly} />
          <SimulationCaution variant="inline" />
        </aside>
      </form>
    </FormProvider>
  );
}

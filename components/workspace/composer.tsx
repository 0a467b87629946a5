"use client";
/**
 * The new-run composer: circuit, observable, parameters, estimate settings and noise on
 * the left, the live preview on the right. One react-hook-form form validated by the
 * shared run schema (composer-resolver); the draft is saved per organisation and
 * restored after a reload; submit with the button or Ctrl/Cmd+Enter from anywhere in it.
 */
import { useRouter, useSearchParams } from "next/navigation";
import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import { FormProvider, useForm, type Path } from "react-hook-form";
import { Alert, SimulationCaution } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Input } from "@/components/ui/input";
import { Kbd } from "@/components/ui/kbd";
import { apiFetch, isApiError, type ApiError } from "@/lib/swr/api-client";
import { canWrite, useWorkspaceOrg } from "@/lib/swr/org-context";
import type { Run } from "@/lib/swr/types";
import { usePreview } from "@/lib/swr/use-preview";
import { CircuitCard } from "./circuit-card";
import { draftKey, readDraft, writeDraft } from "./composer-draft";
import {
  DEFAULT_VALUES,
  formPath,
  fromRequest,
  toRequest,
  type ComposerValues,
} from "./composer-model";
import { composerResolver, type ComposerContext, type ComposerOutput } from "./composer-resolver";
import { EstimateCard } from "./estimate-card";
import { NoiseCard } from "./noise-card";
import { NoiseProfileControls, useNoiseProfiles } from "./noise-profiles";
import { ObservableCard } from "./observable-card";
import { ParametersCard } from "./parameters-card";
import { PreviewPanel } from "./preview-panel";
import { usePrefill } from "./use-prefill";
import { useCircuitOutline } from "./use-circuit-outline";

const EDITOR_PATHS = ["circuit.source", "observable.terms"];

export function Composer() {
  const { orgId, role } = useWorkspaceOrg();
  const readOnly = !canWrite(role);
  const router = useRouter();
  const search = useSearchParams();
  const [inputNames, setInputNames] = useState<string[] | undefined>(undefined);
  const form = useForm<ComposerValues, ComposerContext, ComposerOutput>({
    defaultValues: DEFAULT_VALUES,
    resolver: composerResolver,
    context: { inputNames },
  });
  const { watch, reset, setValue, setError, clearErrors, handleSubmit, formState } = form;
  const [submitError, setSubmitError] = useState<ApiError | null>(null);
  const [restored, setRestored] = useState<"draft" | "prefill" | null>(null);
  const loaded = useRef(false);

  // Restore: an explicit prefill (?from=run, ?circuit=…, ?observable=…) wins over the draft.
  const prefill = usePrefill(search);
  useEffect(() => {
    if (loaded.current || prefill.state === "loading") return;
    loaded.current = true;
    if (prefill.state === "ready") {
      reset(prefill.values);
      setRestored("prefill");
      return;
    }
    const draft = readDraft(window.localStorage.getItem(draftKey(orgId)));
    if (draft) {
      reset(draft);
      setRestored("draft");
    }
  }, [prefill, orgId, reset]);

  // Save the draft on every change (cheap: one JSON string per keystroke, debounced by idle).
  useEffect(() => {
    let t: ReturnType<typeof setTimeout> | undefined;
    const sub = watch((values) => {
      if (!loaded.current) return;
      clearTimeout(t);
      t = setTimeout(
        () => window.localStorage.setItem(draftKey(orgId), writeDraft(values as ComposerValues)),
        300,
      );
    });
    return () => {
      clearTimeout(t);
      sub.unsubscribe();
    };
  }, [watch, orgId]);

  const values = watch();
  const built = useMemo(() => toRequest(values, inputNames), [values, inputNames]);
  const numericParams = built.request.parameters ?? {};
  const { outline, stale } = useCircuitOutline(
    values.circuit.format,
    values.circuit.source,
    numericParams,
  );

  const seenInputs = useRef(new Set<string>());
  // Inputs of the circuit: give new ones a starting value, forget sweeps of vanished ones.
  useEffect(() => {
    if (!outline) return;
    const names = outline.inputs.map((i) => i.name);
    setInputNames(names);
    for (const n of names) {
      if (seenInputs.current.has(n)) continue;
      seenInputs.current.add(n);
      // A registered but never-typed field reads "" — start it at 0 like the diagram does.
      if (!form.getValues(`parameters.${n}`)) setValue(`parameters.${n}`, "0");
    }
    const axes = form.getValues("sweepAxes");
    if (axes.some((a) => !names.includes(a.name)))
      setValue(
        "sweepAxes",
        axes.filter((a) => names.includes(a.name)),
      );
  }, [outline, form, setValue]);

  const preview = usePreview(built.issues.length ? null : { ...built.request });
  const previewError = preview.error;

  // Engine issues → inline markers for the editors, field errors for the rest.
  const serverPaths = useRef<string[]>([]);
  const swept = values.sweepAxes.map((a) => a.name);
  const circuitIssues = previewError?.errorsAt("circuit") ?? [];
  const observableIssues = previewError?.errorsAt("observable") ?? [];
  useEffect(() => {
    for (const p of serverPaths.current) clearErrors(p as Path<ComposerValues>);
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
      setError(p as Path<ComposerValues>, { type: "server", message: e.message });
      serverPaths.current.push(p);
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps -- swept names are read with the error they belong to
  }, [previewError, setError, clearErrors]);

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
              setError(p as Path<ComposerValues>, { type: "server", message: e.message });
          }
        }
      })(),
    [handleSubmit, orgId, router, setError, swept],
  );

  const noiseProfiles = useNoiseProfiles();
  const inputs = outline?.inputs ?? [];
  const hasErrors = Object.keys(formState.errors).length > 0;

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
          {restored ? (
            <Alert
              tone="neutral"
              compact
              role="status"
              actions={
                restored === "draft" ? (
                  <Button
                    size="sm"
                    variant="ghost"
                    onClick={() => {
                      window.localStorage.removeItem(draftKey(orgId));
                      reset(DEFAULT_VALUES);
                      setRestored(null);
                    }}
                  >
                    Start over
                  </Button>
                ) : undefined
              }
            >
              {restored === "draft" ? "Your draft was restored." : "Filled in from your selection."}
            </Alert>
          ) : null}
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
                {...form.register("name")}
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
          <SimulationCaution variant="inline" />
        </aside>
      </form>
    </FormProvider>
  );
}

export { fromRequest };

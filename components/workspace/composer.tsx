"use client";
/**
 * The new-run form: circuit, observable, parameters, estimate settings and noise on
 * the left, the live preview on the right. One react-hook-form form validated by the
 * shared run schema (composer-resolver); the draft is saved per organisation and
 * restored after a reload; submit with the button or Ctrl/Cmd+Enter from anywhere in it.
 */
import { useRouter, useSearchParams } from "next/navigation";
import { useCallback, useEffect, useMemo, useRef, useState, useSyncExternalStore } from "react";
import { FormProvider, useForm, useWatch, type Path } from "react-hook-form";
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

const EDITOR_PATHS = ["circuit.source", "observable.terms"];

type Start = { from: "none" } | { from: "draft" | "prefill"; values: ComposerValues };
const noSubscription = () => () => {};

export function Composer() {
  const { orgId, role } = useWorkspaceOrg();
  const readOnly = !canWrite(role);
  const router = useRouter();
  const search = useSearchParams();
  const [inputNames, setInputNames] = useState<readonly string[] | undefined>(undefined);
  const form = useForm<ComposerValues, ComposerContext, ComposerOutput>({
    defaultValues: DEFAULT_VALUES,
    resolver: composerResolver,
    context: { inputNames },
  });
  const { subscribe, reset, setValue, setError, clearErrors, handleSubmit, formState } = form;
  const [submitError, setSubmitError] = useState<ApiError | null>(null);
  const loaded = useRef(false);

  // Restore: an explicit prefill (?from=run, ?circuit=…, ?observable=…) wins over the draft.
  // The start is decided once, in render, when both are known (the stored draft reads as
  // undefined on the server and while hydrating); the effect then fills the form with it.
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
  const restored = start && start.from !== "none" ? start.from : null;

  // Save the draft after each pause in typing, and at once when the page is left (a reload
  // right after a change must not lose it).
  useEffect(() => {
    let t: ReturnType<typeof setTimeout> | undefined;
    let pending: ComposerValues | null = null;
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
  }, [subscribe, orgId]);

  // The whole form, as the preview needs it (a fresh object per change).
  const values = useWatch({ control: form.control }) as ComposerValues;
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

  const seenInputs = useRef(new Set<string>());
  // Inputs of the circuit: give new ones a starting value, forget sweeps of vanished ones.
  useEffect(() => {
    if (!outline) return;
    const names = outline.inputs.map((i) => i.name);
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
                      setStart({ from: "none" });
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

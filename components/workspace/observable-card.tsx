"use client";
/**
 * Observable slot of the new-run form: a Pauli sum (with its own highlighting and inline
 * issues) or a Hermitian matrix as JSON; drag and drop / upload; the library; and a
 * summary line with the term count, the qubits it acts on and the measurement settings.
 */
import { useState } from "react";
import { Controller, useFormContext } from "react-hook-form";
import { ObservablePicker } from "@/components/library/library-picker";
import { Alert } from "@/components/ui/alert";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { Textarea } from "@/components/ui/textarea";
import { CLUSTER_TERMS } from "@/lib/examples/three-spin-cluster";
import type { LibraryObservable } from "@/lib/swr/types";
import { CodeEditor } from "./code-editor";
import type { RunBuilderValues } from "./run-builder-model";
import { extensionOf } from "./file-rules";
import { FileDropZone, type LoadedFile } from "./file-drop";
import type { SourceIssue } from "./issue-ranges";
import { IssueList } from "./issue-list";
import { formatQubitSet, pauliSupport } from "./pauli-support";
import { Segmented } from "@/components/ui/segmented";
import { SourceToolbar } from "./source-toolbar";
import { plural, pluralWord } from "@/lib/format";

export type ObservableSummary = { terms: number; settings: number } | null;

export function ObservableCard({
  issues,
  summary,
  onSubmit,
  readOnly,
}: {
  issues: SourceIssue[];
  summary: ObservableSummary;
  onSubmit: () => void;
  readOnly?: boolean;
}) {
  const { control, setValue, watch, formState, register } = useFormContext<RunBuilderValues>();
  const [picking, setPicking] = useState(false);
  const [notice, setNotice] = useState<{ tone: "error" | "success"; text: string } | null>(null);
  const format = watch("observable.format");
  const terms = watch("observable.terms");
  const e = formState.errors.observable;
  const fieldMessage = format === "pauli" ? e?.terms?.message : e?.matrixText?.message;
  const shownIssues: SourceIssue[] = issues.length
    ? issues
    : fieldMessage
      ? [{ message: fieldMessage }]
      : [];
  const support = format === "pauli" ? pauliSupport(terms) : [];

  const loadFile = (f: LoadedFile) => {
    if (extensionOf(f.name) === ".json") {
      setValue("observable.format", "matrix", { shouldDirty: true });
      setValue("observable.matrixText", f.text, { shouldDirty: true });
    } else {
      setValue("observable.format", "pauli", { shouldDirty: true });
      setValue("observable.terms", f.text, { shouldDirty: true });
    }
    setNotice({ tone: "success", text: `Loaded “${f.name}”.` });
  };

  const pick = (o: LibraryObservable) => {
    if (o.format === "matrix") {
      setValue("observable.format", "matrix", { shouldDirty: true });
      const m = o.imag ? { real: o.real, imag: o.imag } : { real: o.real };
      setValue("observable.matrixText", JSON.stringify(m), { shouldDirty: true });
    } else {
      setValue("observable.format", "pauli", { shouldDirty: true });
      setValue("observable.terms", o.terms, { shouldDirty: true });
    }
    setNotice({ tone: "success", text: `Loaded “${o.name}” from the library.` });
    setPicking(false);
  };

  return (
    <Card>
      <CardHeader
        title="Observable"
        description="A weighted Pauli sum such as 0.5 Z0 Z1 − 0.2 X0 (or dense words like XIZY), or a Hermitian matrix."
      />
      <CardBody className="grid gap-3">
        <SourceToolbar
          readOnly={readOnly}
          slot="observable"
          onLibrary={() => setPicking(true)}
          onLoad={loadFile}
          onReject={(m) => setNotice({ tone: "error", text: m })}
          formatSwitch={
            <Controller
              control={control}
              name="observable.format"
              render={({ field }) => (
                <Segmented
                  legend="Observable form"
                  hideLegend
                  size="sm"
                  value={field.value}
                  onChange={field.onChange}
                  options={[
                    { value: "pauli", label: "Pauli sum" },
                    { value: "matrix", label: "Matrix (JSON)" },
                  ]}
                />
              )}
            />
          }
        />
        <FileDropZone
          slot="observable"
          onLoad={loadFile}
          onReject={(m) => setNotice({ tone: "error", text: m })}
        >
          {format === "pauli" ? (
            <Controller
              control={control}
              name="observable.terms"
              render={({ field }) => (
                <CodeEditor
                  language="pauli"
                  label="Observable, Pauli sum"
                  value={field.value}
                  onChange={field.onChange}
                  issues={issues}
                  invalid={shownIssues.length > 0}
                  describedBy="observable-issues"
                  onSubmit={onSubmit}
                  minHeight="5.5rem"
                  maxHeight="16rem"
                  readOnly={readOnly}
                  placeholder={CLUSTER_TERMS}
                />
              )}
            />
          ) : (
            <Textarea
              mono
              rows={6}
              aria-label='Observable matrix as JSON: { "real": [[…]], "imag": [[…]] }'
              aria-describedby="observable-issues"
              aria-invalid={shownIssues.length > 0}
              placeholder='{ "real": [[1, 0], [0, -1]], "imag": [[0, 0], [0, 0]] }'
              readOnly={readOnly}
              {...register("observable.matrixText")}
            />
          )}
        </FileDropZone>
        <IssueList id="observable-issues" issues={shownIssues} />
        {format === "matrix" ? (
          <p className="text-xs leading-5 text-ink-2">
            Qubit 0 is the leftmost Kronecker factor: the matrix is A0 ⊗ A1 ⊗ …, row index i = Σ
            bₖ·2^(n−1−k). So diag(1, 1, −1, −1) is Z on qubit 0 (the word ZI).
          </p>
        ) : null}
        <p className="figures text-xs text-ink-2" aria-live="polite">
          {summary ? (
            <>
              {plural(summary.terms, "term")}
              {format === "pauli" && support.length ? (
                <>
                  {" "}
                  · acts on {pluralWord(support.length, "qubit")} {formatQubitSet(support)}
                </>
              ) : null}
              {" · "}
              {plural(summary.settings, "measurement setting")}
            </>
          ) : format === "pauli" && support.length ? (
            <>
              acts on {pluralWord(support.length, "qubit")} {formatQubitSet(support)}
            </>
          ) : (
            <span className="font-sans text-ink-3">
              Drop a .txt Pauli sum or a .json matrix on the editor to load it.
            </span>
          )}
        </p>
        {notice ? (
          <Alert tone={notice.tone} compact role={notice.tone === "error" ? "alert" : "status"}>
            {notice.text}
          </Alert>
        ) : null}
      </CardBody>
      {picking ? <ObservablePicker open onClose={() => setPicking(false)} onPick={pick} /> : null}
    </Card>
  );
}

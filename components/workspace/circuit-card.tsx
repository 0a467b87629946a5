"use client";
/**
 * Circuit slot of the new-run form: format, the OpenQASM editor with inline issues, drag and
 * drop / upload of a .qasm file, a saved circuit from the library, and the diagram.
 */
import { useState } from "react";
import { Controller, useFormContext } from "react-hook-form";
import { CircuitDiagram } from "@/components/circuit-diagram/circuit-diagram";
import type { CircuitOutline } from "@/components/circuit-diagram/outline";
import { CircuitPicker } from "@/components/library/library-picker";
import { Alert } from "@/components/ui/alert";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { CodeEditor } from "./code-editor";
import type { RunBuilderValues } from "./run-builder-model";
import { FileDropZone } from "./file-drop";
import type { SourceIssue } from "./issue-ranges";
import { IssueList } from "./issue-list";
import { Segmented } from "@/components/ui/segmented";
import { SourceToolbar } from "./source-toolbar";

export function CircuitCard({
  issues,
  outline,
  outlineStale,
  onSubmit,
  readOnly,
}: {
  issues: SourceIssue[];
  outline: CircuitOutline | null;
  outlineStale: boolean;
  onSubmit: () => void;
  readOnly?: boolean;
}) {
  const { control, setValue, watch, formState } = useFormContext<RunBuilderValues>();
  const [picking, setPicking] = useState(false);
  const [notice, setNotice] = useState<{ tone: "error" | "success"; text: string } | null>(null);
  const format = watch("circuit.format");
  const fieldError = formState.errors.circuit?.source?.message;
  const allIssues: SourceIssue[] =
    fieldError && !issues.length ? [{ message: fieldError }] : issues;

  const load = (text: string, from: string) => {
    const isQasm3 = /^\s*(\/\/[^\n]*\n\s*)*OPENQASM\s+3/.test(text);
    setValue("circuit.format", isQasm3 ? "qasm3" : "qasm2", { shouldDirty: true });
    setValue("circuit.source", text, { shouldDirty: true, shouldValidate: false });
    setNotice({ tone: "success", text: `Loaded ${from}.` });
  };

  return (
    <Card>
      <CardHeader
        title="Circuit"
        description="OpenQASM 2.0, or OpenQASM 3 with input parameters. Qubit 0 is drawn on top."
      />
      <CardBody className="grid gap-3">
        <SourceToolbar
          readOnly={readOnly}
          slot="circuit"
          onLibrary={() => setPicking(true)}
          onLoad={(f) => load(f.text, `“${f.name}”`)}
          onReject={(m) => setNotice({ tone: "error", text: m })}
          formatSwitch={
            <Controller
              control={control}
              name="circuit.format"
              render={({ field }) => (
                <Segmented
                  legend="Language"
                  hideLegend
                  size="sm"
                  value={field.value}
                  onChange={field.onChange}
                  options={[
                    { value: "qasm2", label: "OpenQASM 2.0" },
                    { value: "qasm3", label: "OpenQASM 3" },
                  ]}
                />
              )}
            />
          }
        />
        <FileDropZone
          slot="circuit"
          onLoad={(f) => load(f.text, `“${f.name}”`)}
          onReject={(m) => setNotice({ tone: "error", text: m })}
        >
          <Controller
            control={control}
            name="circuit.source"
            render={({ field }) => (
              <CodeEditor
                language="qasm"
                label={`Circuit source, ${format === "qasm3" ? "OpenQASM 3" : "OpenQASM 2.0"}`}
                value={field.value}
                onChange={field.onChange}
                issues={issues}
                invalid={allIssues.length > 0}
                describedBy="circuit-issues"
                onSubmit={onSubmit}
                readOnly={readOnly}
                placeholder='OPENQASM 2.0; include "qelib1.inc" …'
              />
            )}
          />
        </FileDropZone>
        <IssueList id="circuit-issues" issues={allIssues} />
        {notice ? (
          <Alert tone={notice.tone} compact role={notice.tone === "error" ? "alert" : "status"}>
            {notice.text}
          </Alert>
        ) : (
          <p className="text-xs text-ink-3">Drop a .qasm file on the editor to load it.</p>
        )}
        {outline && outline.qubits > 0 ? (
          <div className={outlineStale ? "opacity-60 transition-opacity" : "transition-opacity"}>
            <CircuitDiagram
              qubits={outline.qubits}
              ops={outline.ops}
              qubitLabels={outline.qubitLabels}
              omitted={outline.omitted}
            />
            {outline.placeholders.length ? (
              <p className="mt-1 text-xs text-ink-3">
                Drawn with {outline.placeholders.join(", ")} = 0 until a value is given.
              </p>
            ) : null}
          </div>
        ) : null}
      </CardBody>
      {picking ? (
        <CircuitPicker
          open
          onClose={() => setPicking(false)}
          onPick={(c) => {
            setValue("circuit.format", c.format, { shouldDirty: true });
            setValue("circuit.source", c.source, { shouldDirty: true });
            if (!watch("name")) setValue("name", c.name, { shouldDirty: true });
            setNotice({ tone: "success", text: `Loaded “${c.name}” from the library.` });
            setPicking(false);
          }}
        />
      ) : null}
    </Card>
  );
}

"use client";
/**
 * Saving a circuit or an observable to the organisation's library (a dialog). The engine
 * checks the item on the server; its issues come back with line and column and are
 * marked in the editor. What was typed stays in the dialog on an error.
 */
import { useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { Field } from "@/components/ui/field";
import { Input } from "@/components/ui/input";
import { Textarea } from "@/components/ui/textarea";
import { CodeEditor } from "@/components/workspace/code-editor";
import { parseMatrixText } from "@/components/workspace/run-builder-model";
import { IssueList } from "@/components/workspace/issue-list";
import { Segmented } from "@/components/ui/segmented";
import { STARTER_QASM } from "@/components/workspace/run-builder-model";
import { apiFetch, isApiError, type ApiError } from "@/lib/swr/api-client";
import { useWorkspaceOrg } from "@/lib/swr/org-context";

export type LibraryKind = "circuit" | "observable";

/** "a, b ,, C" → ["a", "b", "c"] (the API lower-cases and checks each tag). */
export function parseTags(text: string): string[] {
  return [
    ...new Set(
      text
        .split(",")
        .map((t) => t.trim().toLowerCase())
        .filter(Boolean),
    ),
  ];
}

export function LibraryItemForm({
  kind,
  open,
  onClose,
  onSaved,
}: {
  kind: LibraryKind;
  open: boolean;
  onClose: () => void;
  onSaved: () => void;
}) {
  const { orgId } = useWorkspaceOrg();
  const [name, setName] = useState("");
  const [description, setDescription] = useState("");
  const [tags, setTags] = useState("");
  const [circuitFormat, setCircuitFormat] = useState<"qasm2" | "qasm3">("qasm2");
  const [source, setSource] = useState(STARTER_QASM);
  const [obsFormat, setObsFormat] = useState<"pauli" | "matrix">("pauli");
  const [terms, setTerms] = useState("Z0 Z1 + 0.5 X0 X1");
  const [matrix, setMatrix] = useState('{ "real": [[1, 0], [0, -1]] }');
  const [error, setError] = useState<ApiError | null>(null);
  const [localError, setLocalError] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);

  const fieldError = (path: string) =>
    error
      ?.errorsAt(path)
      .map((e) => e.message)
      .join(" ") || undefined;
  const editorIssues = error?.errors.filter((e) => e.path === "source" || e.path === "terms") ?? [];

  const save = async () => {
    setSaving(true);
    setError(null);
    setLocalError(null);
    try {
      let body: Record<string, unknown> = { name, description, tags: parseTags(tags) };
      if (kind === "circuit") body = { ...body, format: circuitFormat, source };
      else if (obsFormat === "pauli") body = { ...body, format: "pauli", terms };
      else {
        const m = parseMatrixText(matrix);
        if (typeof m === "string") {
          setLocalError(`Matrix: ${m}`);
          return;
        }
        body = { ...body, format: "matrix", ...m };
      }
      await apiFetch(orgId, kind === "circuit" ? "/api/v1/circuits" : "/api/v1/observables", {
        method: "POST",
        json: body,
      });
      onSaved();
    } catch (e) {
      if (isApiError(e)) setError(e);
      else setLocalError("Could not save.");
    } finally {
      setSaving(false);
    }
  };

  return (
    <Dialog
      open={open}
      onClose={onClose}
      size="lg"
      title={kind === "circuit" ? "Save a circuit" : "Save an observable"}
      description="Checked by the engine before it is saved; everyone in the organisation can use it."
      footer={
        <>
          <Button variant="ghost" onClick={onClose}>
            Cancel
          </Button>
          <Button loading={saving} onClick={save}>
            Save
          </Button>
        </>
      }
    >
      <div className="grid gap-4">
        <div className="grid gap-4 sm:grid-cols-2">
          <Field label="Name" required error={fieldError("name")}>
            <Input
              value={name}
              onChange={(e) => setName(e.target.value)}
              maxLength={120}
              autoFocus
            />
          </Field>
          <Field
            label="Tags"
            optional
            hint="Comma-separated, e.g. ansatz, lattice"
            error={fieldError("tags")}
          >
            <Input value={tags} onChange={(e) => setTags(e.target.value)} />
          </Field>
        </div>
        <Field label="Description" optional error={fieldError("description")}>
          <Textarea
            rows={2}
            value={description}
            onChange={(e) => setDescription(e.target.value)}
            maxLength={2000}
          />
        </Field>
        {kind === "circuit" ? (
          <>
            <Segmented
              legend="Language"
              size="sm"
              value={circuitFormat}
              onChange={setCircuitFormat}
              options={[
                { value: "qasm2", label: "OpenQASM 2.0" },
                { value: "qasm3", label: "OpenQASM 3" },
              ]}
            />
            <CodeEditor
              language="qasm"
              label="Circuit source"
              value={source}
              onChange={setSource}
              issues={editorIssues}
              describedBy="lib-issues"
              minHeight="10rem"
              maxHeight="18rem"
            />
          </>
        ) : (
          <>
            <Segmented
              legend="Form"
              size="sm"
              value={obsFormat}
              onChange={setObsFormat}
              options={[
                { value: "pauli", label: "Pauli sum" },
                { value: "matrix", label: "Matrix (JSON)" },
              ]}
            />
            {obsFormat === "pauli" ? (
              <CodeEditor
                language="pauli"
                label="Pauli sum"
                value={terms}
                onChange={setTerms}
                issues={editorIssues}
                describedBy="lib-issues"
                minHeight="5rem"
                maxHeight="14rem"
              />
            ) : (
              <Textarea
                mono
                rows={6}
                aria-label="Matrix as JSON"
                value={matrix}
                onChange={(e) => setMatrix(e.target.value)}
                aria-describedby="lib-issues"
              />
            )}
          </>
        )}
        <IssueList
          id="lib-issues"
          issues={
            error?.errors.filter(
              (e) => !["name", "tags", "description"].some((p) => e.path.startsWith(p)),
            ) ?? []
          }
        />
        {localError || (error && !error.errors.length) ? (
          <Alert tone="error" compact role="alert">
            {localError ?? error?.message}
          </Alert>
        ) : null}
      </div>
    </Dialog>
  );
}

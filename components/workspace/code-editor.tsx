"use client";
/**
 * Source editor (CodeMirror 6) for OpenQASM or Pauli-sum text, with the engine's issues
 * shown inline (wavy underline, gutter marker, message on hover) and listed under the
 * editor for screen readers. Mod-Enter calls `onSubmit`. Tab is left to the browser so
 * the editor never traps keyboard focus.
 */
import { lintGutter, setDiagnostics, type Diagnostic } from "@codemirror/lint";
import { Prec } from "@codemirror/state";
import { EditorView, keymap, placeholder as cmPlaceholder } from "@codemirror/view";
import CodeMirror, { type ReactCodeMirrorRef } from "@uiw/react-codemirror";
import { useEffect, useMemo, useRef } from "react";
import { cn } from "@/components/ui/cn";
import { editorChrome, editorHighlighting } from "./editor-theme";
import { issueRange, type SourceIssue } from "./issue-ranges";
import { pauliLanguage, qasmLanguage } from "./qasm-language";

const SUBMIT_EVENT = "ketwise-editor-submit";

export function CodeEditor({
  value,
  onChange,
  language,
  issues = [],
  onSubmit,
  label,
  describedBy,
  minHeight = "14rem",
  maxHeight = "28rem",
  placeholder,
  invalid,
  readOnly,
  id,
}: {
  value: string;
  onChange: (value: string) => void;
  language: "qasm" | "pauli";
  issues?: SourceIssue[];
  onSubmit?: () => void;
  /** Accessible name of the editing area. */
  label: string;
  describedBy?: string;
  minHeight?: string;
  maxHeight?: string;
  placeholder?: string;
  invalid?: boolean;
  readOnly?: boolean;
  id?: string;
}) {
  const ref = useRef<ReactCodeMirrorRef>(null);
  const frame = useRef<HTMLDivElement>(null);

  // Mod-Enter raises SUBMIT_EVENT on the editor; the frame hands it to the current onSubmit.
  useEffect(() => {
    const el = frame.current;
    if (!el || !onSubmit) return;
    const handle = () => onSubmit();
    el.addEventListener(SUBMIT_EVENT, handle);
    return () => el.removeEventListener(SUBMIT_EVENT, handle);
  }, [onSubmit]);

  const extensions = useMemo(
    () => [
      language === "qasm" ? qasmLanguage : pauliLanguage,
      editorChrome,
      editorHighlighting,
      lintGutter(),
      EditorView.lineWrapping,
      EditorView.contentAttributes.of({
        "aria-label": label,
        ...(describedBy ? { "aria-describedby": describedBy } : {}),
        ...(id ? { id } : {}),
      }),
      Prec.highest(
        keymap.of([
          {
            key: "Mod-Enter",
            run: (view) => {
              view.dom.dispatchEvent(new Event(SUBMIT_EVENT, { bubbles: true }));
              return true;
            },
          },
        ]),
      ),
      ...(placeholder ? [cmPlaceholder(placeholder)] : []),
    ],
    [language, label, describedBy, placeholder, id],
  );

  // Push the issues into the editor whenever they (or the text they refer to) change.
  useEffect(() => {
    const view = ref.current?.view;
    if (!view) return;
    const text = view.state.doc.toString();
    const diagnostics: Diagnostic[] = [];
    for (const issue of issues) {
      const r = issueRange(text, issue);
      if (r)
        diagnostics.push({
          from: r.from,
          to: Math.max(r.to, r.from),
          severity: "error",
          message: r.message,
          source: "engine",
        });
    }
    view.dispatch(setDiagnostics(view.state, diagnostics));
  }, [issues, value]);

  return (
    <div
      ref={frame}
      data-invalid={invalid || undefined}
      className={cn(
        "overflow-hidden rounded-md border border-line-strong bg-surface transition-[border-color,box-shadow] duration-150",
        "focus-within:border-focus focus-within:ring-3 focus-within:ring-focus/25",
        "data-invalid:border-danger data-invalid:focus-within:ring-danger/25",
      )}
    >
      <CodeMirror
        ref={ref}
        value={value}
        onChange={onChange}
        extensions={extensions}
        theme="none"
        editable={!readOnly}
        readOnly={readOnly}
        indentWithTab={false}
        minHeight={minHeight}
        maxHeight={maxHeight}
        basicSetup={{
          foldGutter: false,
          highlightActiveLine: true,
          autocompletion: false,
          searchKeymap: true,
          closeBrackets: false,
          lintKeymap: true,
          syntaxHighlighting: false,
        }}
      />
    </div>
  );
}

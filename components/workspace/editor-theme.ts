/**
 * The editor's look, from the app's theme tokens (CSS variables), so light and dark
 * schemes follow the rest of the product without a second theme.
 */
import { HighlightStyle, syntaxHighlighting } from "@codemirror/language";
import { EditorView } from "@codemirror/view";
import { tags as t } from "@lezer/highlight";

export const editorChrome = EditorView.theme({
  "&": {
    backgroundColor: "var(--color-surface)",
    color: "var(--color-ink)",
    fontSize: "13px",
    borderRadius: "0.375rem",
  },
  "&.cm-focused": { outline: "none" },
  ".cm-scroller": { fontFamily: "var(--font-mono)", lineHeight: "1.6" },
  ".cm-content": { caretColor: "var(--color-accent)", padding: "8px 0" },
  ".cm-cursor, .cm-dropCursor": { borderLeftColor: "var(--color-accent)", borderLeftWidth: "2px" },
  "&.cm-focused > .cm-scroller > .cm-selectionLayer .cm-selectionBackground, .cm-selectionBackground, .cm-content ::selection":
    { backgroundColor: "color-mix(in oklch, var(--color-accent) 22%, transparent)" },
  ".cm-gutters": {
    backgroundColor: "var(--color-surface-2)",
    color: "var(--color-ink-3)",
    borderRight: "1px solid var(--color-line)",
  },
  ".cm-activeLineGutter": {
    backgroundColor: "var(--color-surface-3)",
    color: "var(--color-ink-2)",
  },
  ".cm-activeLine": {
    backgroundColor: "color-mix(in oklch, var(--color-surface-3) 45%, transparent)",
  },
  ".cm-lineNumbers .cm-gutterElement": {
    padding: "0 8px 0 10px",
    fontVariantNumeric: "tabular-nums",
  },
  ".cm-lintRange-error": {
    backgroundImage: "none",
    textDecoration: "underline wavy var(--color-danger)",
    textDecorationThickness: "1px",
    textUnderlineOffset: "3px",
  },
  ".cm-lintRange-warning": {
    backgroundImage: "none",
    textDecoration: "underline wavy var(--color-warn)",
  },
  ".cm-tooltip": {
    backgroundColor: "var(--color-surface)",
    border: "1px solid var(--color-line-strong)",
    borderRadius: "6px",
    boxShadow: "var(--shadow-pop)",
    color: "var(--color-ink)",
  },
  ".cm-diagnostic": { fontFamily: "var(--font-sans)", fontSize: "12.5px", padding: "4px 8px" },
  ".cm-diagnostic-error": { borderLeft: "3px solid var(--color-danger)" },
  ".cm-lint-marker-error": { content: "none" },
  ".cm-panels": { backgroundColor: "var(--color-surface-2)", color: "var(--color-ink)" },
  ".cm-placeholder": { color: "var(--color-ink-3)" },
});

const style = HighlightStyle.define([
  { tag: t.keyword, color: "var(--color-accent-ink)", fontWeight: "600" },
  { tag: t.typeName, color: "var(--color-info)" },
  { tag: [t.atom, t.bool], color: "var(--color-mitigated)" },
  { tag: t.number, color: "var(--color-noisy)" },
  { tag: t.string, color: "var(--color-ok)" },
  { tag: t.comment, color: "var(--color-ink-3)", fontStyle: "italic" },
  { tag: t.standard(t.variableName), color: "var(--color-ink)", fontWeight: "600" },
  {
    tag: t.definition(t.variableName),
    color: "var(--color-accent-ink)",
    textDecoration: "underline",
  },
  { tag: t.function(t.variableName), color: "var(--color-info)" },
  { tag: t.operator, color: "var(--color-ink-2)" },
  { tag: t.punctuation, color: "var(--color-ink-3)" },
  { tag: t.invalid, color: "var(--color-danger)" },
]);

export const editorHighlighting = syntaxHighlighting(style);

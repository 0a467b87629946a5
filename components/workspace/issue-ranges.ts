/**
 * Where an engine issue (1-based line and column) sits in a document: from the column
 * to the end of the token there (a run of word characters, or one character), clamped to
 * the line. Without a column the whole line is marked; without a line, nothing.
 */
export type SourceIssue = { message: string; line?: number; column?: number };

export type IssueRange = { from: number; to: number; message: string };

export function issueRange(text: string, issue: SourceIssue): IssueRange | null {
  if (!issue.line || issue.line < 1) return null;
  const lines = text.split("\n");
  const lineIndex = Math.min(issue.line, lines.length) - 1;
  let lineStart = 0;
  for (let i = 0; i < lineIndex; i++) lineStart += lines[i].length + 1;
  const lineText = lines[lineIndex];
  if (!issue.column || issue.column < 1) {
    return {
      from: lineStart,
      to: lineStart + Math.max(lineText.length, 0),
      message: issue.message,
    };
  }
  const col = Math.min(issue.column - 1, lineText.length);
  const rest = lineText.slice(col);
  const token = /^[\w.]+/.exec(rest)?.[0].length ?? (rest.length ? 1 : 0);
  const from = lineStart + col;
  return { from, to: from + token, message: issue.message };
}

import { IconError } from "@/components/ui/icons";
import type { SourceIssue } from "./issue-ranges";

/** The engine's issues for one editor as text (the inline markers' accessible twin). */
export function IssueList({
  id,
  issues,
  max = 6,
}: {
  id: string;
  issues: SourceIssue[];
  max?: number;
}) {
  if (!issues.length) return <div id={id} aria-live="polite" />;
  return (
    <ul id={id} aria-live="polite" className="grid gap-1 text-[12.5px] leading-5 text-danger">
      {issues.slice(0, max).map((i, k) => (
        <li key={k} className="flex items-start gap-1.5">
          <IconError className="mt-0.5 size-3.5 shrink-0" />
          <span>
            {i.line ? (
              <span className="figures mr-1.5 rounded bg-danger-soft px-1 text-[11.5px]">
                line {i.line}
                {i.column ? `:${i.column}` : ""}
              </span>
            ) : null}
            {i.message}
          </span>
        </li>
      ))}
      {issues.length > max ? (
        <li className="text-ink-3">… and {issues.length - max} more.</li>
      ) : null}
    </ul>
  );
}

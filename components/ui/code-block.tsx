import { cn } from "./cn";
import { CopyButton } from "./copy-button";

/**
 * Preformatted code in the mono face with a copy button. `title` names the snippet
 * (file name or language) in a header row. No syntax colouring (the editor has that).
 */
export function CodeBlock({
  code,
  title,
  className,
  wrap = false,
  maxHeight,
}: {
  code: string;
  title?: string;
  className?: string;
  /** Wrap long lines instead of scrolling horizontally. */
  wrap?: boolean;
  /** CSS max height of the scrolling area, e.g. "20rem". */
  maxHeight?: string;
}) {
  return (
    <div
      className={cn(
        "group relative overflow-hidden rounded-lg border border-line bg-surface-2/70",
        className,
      )}
    >
      {title ? (
        <div className="flex h-9 items-center justify-between border-b border-line pr-1.5 pl-3.5">
          <span className="font-mono text-xs text-ink-2">{title}</span>
          <CopyButton text={code} label={`Copy ${title}`} showLabel />
        </div>
      ) : (
        <CopyButton
          text={code}
          label="Copy code"
          className="absolute top-1.5 right-1.5 bg-surface-2/90 opacity-70 group-hover:opacity-100 focus-visible:opacity-100"
        />
      )}
      <pre
        tabIndex={0}
        style={maxHeight ? { maxHeight } : undefined}
        className={cn(
          "overflow-auto px-3.5 py-3 font-mono text-[12.5px] leading-[1.65] text-ink outline-none focus-visible:ring-2 focus-visible:ring-focus/40",
          wrap ? "break-words whitespace-pre-wrap" : "whitespace-pre",
          !title && "pr-11",
        )}
      >
        <code>{code}</code>
      </pre>
    </div>
  );
}

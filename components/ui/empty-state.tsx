import type { ReactNode } from "react";
import { cn } from "./cn";

/**
 * What a list or panel shows when it has nothing yet: a quiet glyph, a title that says
 * what is missing, one sentence on how to get it, and the action that does.
 */
export function EmptyState({
  title,
  description,
  action,
  icon,
  className,
}: {
  title: ReactNode;
  description?: ReactNode;
  action?: ReactNode;
  icon?: ReactNode;
  className?: string;
}) {
  return (
    <div
      className={cn(
        "flex flex-col items-center justify-center rounded-lg border border-dashed border-line-strong/80 px-6 py-12 text-center",
        className,
      )}
    >
      <div
        aria-hidden
        className="mb-3 flex size-10 items-center justify-center rounded-full bg-surface-2 text-ink-3"
      >
        {icon ?? (
          <svg
            viewBox="0 0 24 24"
            className="size-5"
            fill="none"
            stroke="currentColor"
            strokeWidth="1.5"
          >
            <path d="M7 5v14M15 6l5 6-5 6" strokeLinecap="round" strokeLinejoin="round" />
            <circle cx="12" cy="12" r="1.6" fill="currentColor" stroke="none" />
          </svg>
        )}
      </div>
      <p className="text-sm font-semibold text-ink">{title}</p>
      {description ? (
        <p className="mt-1 max-w-sm text-[13px] leading-5 text-ink-2">{description}</p>
      ) : null}
      {action ? <div className="mt-4 flex flex-wrap justify-center gap-2">{action}</div> : null}
    </div>
  );
}

import type { ReactNode } from "react";
import { cn } from "@/components/ui/cn";
import { IconError } from "@/components/ui/icons";

/**
 * An in-page error block for error.tsx files inside the signed-in area, so the shell
 * (sidebar, top bar) stays while one page failed. Generic message, the error digest to
 * quote, and actions (pass a Button calling `retry`).
 *
 *   "use client";
 *   export default function Error({ error, retry }: { error: unknown; retry: () => void }) {
 *     const digest = error instanceof Error && "digest" in error ? String(error.digest) : undefined;
 *     return <ErrorPanel digest={digest} actions={<Button onClick={() => retry()}>Try again</Button>} />;
 *   }
 */
export function ErrorPanel({
  title = "This page could not be loaded",
  children,
  digest,
  actions,
  className,
}: {
  title?: string;
  children?: ReactNode;
  digest?: string;
  actions?: ReactNode;
  className?: string;
}) {
  return (
    <div
      role="alert"
      className={cn(
        "mx-auto my-10 grid max-w-lg gap-4 rounded-xl border border-line bg-surface p-6 shadow-card",
        className,
      )}
    >
      <div className="flex items-center gap-2.5">
        <span className="flex size-8 items-center justify-center rounded-full bg-danger-soft text-danger">
          <IconError className="size-4" />
        </span>
        <h2 className="text-base font-semibold text-ink">{title}</h2>
      </div>
      <div className="text-sm leading-6 text-ink-2">
        {children ??
          "Something failed on our side. Try again; if it keeps failing, quote the reference below."}
      </div>
      {actions ? <div className="flex flex-wrap gap-2">{actions}</div> : null}
      {digest ? (
        <p className="border-t border-line pt-3 text-xs text-ink-3">
          Error reference{" "}
          <code className="figures rounded bg-surface-2 px-1.5 py-0.5 text-ink-2">{digest}</code>
        </p>
      ) : null}
    </div>
  );
}

import Link from "next/link";
import type { ReactNode } from "react";
import { cn } from "@/components/ui/cn";
import { Logo } from "@/components/ui/logo";

/**
 * A centred, full-height page for not-found, error and global-error: logo, a mono code
 * ("404", "Error"), a heading, one paragraph, actions, and an optional detail line
 * (e.g. the error digest to quote to support).
 */
export function StatusPage({
  code,
  title,
  children,
  actions,
  detail,
  className,
}: {
  code: string;
  title: string;
  children?: ReactNode;
  actions?: ReactNode;
  detail?: ReactNode;
  className?: string;
}) {
  return (
    <div className={cn("flex min-h-dvh flex-col bg-canvas", className)}>
      <header className="px-6 py-5">
        <Link href="/" aria-label="Ketwise home" className="inline-flex rounded-md">
          <Logo size="sm" />
        </Link>
      </header>
      <main id="main" className="flex flex-1 items-center justify-center px-6 pb-24">
        <div className="grid w-full max-w-md gap-5">
          <p className="figures text-sm font-medium text-accent-ink">{code}</p>
          <h1 className="text-[28px] leading-9 font-semibold tracking-[-0.02em] text-ink">
            {title}
          </h1>
          {children ? <div className="text-[15px] leading-7 text-ink-2">{children}</div> : null}
          {actions ? <div className="flex flex-wrap gap-2.5 pt-1">{actions}</div> : null}
          {detail ? (
            <div className="border-t border-line pt-4 text-xs leading-5 text-ink-3">{detail}</div>
          ) : null}
        </div>
      </main>
    </div>
  );
}

import Link from "next/link";
import type { ReactNode } from "react";
import { cn } from "@/components/ui/cn";

export type Crumb = { label: string; href?: string };

/**
 * The title row of a signed-in page: optional breadcrumbs, an h1, a description and
 * actions at the right. Server Component.
 */
export function PageHeader({
  title,
  description,
  actions,
  crumbs,
  className,
}: {
  title: ReactNode;
  description?: ReactNode;
  actions?: ReactNode;
  crumbs?: Crumb[];
  className?: string;
}) {
  return (
    <div className={cn("mb-6 grid gap-2", className)}>
      {crumbs?.length ? (
        <nav aria-label="Breadcrumb">
          <ol className="flex flex-wrap items-center gap-1.5 text-[13px] text-ink-3">
            {crumbs.map((c, i) => (
              <li key={`${c.label}-${i}`} className="flex items-center gap-1.5">
                {i > 0 ? <span aria-hidden>/</span> : null}
                {c.href ? (
                  <Link href={c.href} className="rounded hover:text-ink">
                    {c.label}
                  </Link>
                ) : (
                  <span aria-current="page" className="text-ink-2">
                    {c.label}
                  </span>
                )}
              </li>
            ))}
          </ol>
        </nav>
      ) : null}
      <div className="flex flex-wrap items-end justify-between gap-x-6 gap-y-3">
        <div className="grid min-w-0 gap-1">
          <h1 className="text-[22px] leading-8 font-semibold tracking-[-0.015em] text-ink">
            {title}
          </h1>
          {description ? (
            <p className="max-w-3xl text-sm leading-6 text-ink-2">{description}</p>
          ) : null}
        </div>
        {actions ? <div className="flex flex-wrap items-center gap-2">{actions}</div> : null}
      </div>
    </div>
  );
}

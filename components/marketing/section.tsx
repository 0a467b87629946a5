import type { ReactNode } from "react";
import { cn } from "@/components/ui/cn";

/** A landing-page section with an eyebrow, a heading and a lead paragraph. */
export function Section({
  id,
  eyebrow,
  title,
  lead,
  children,
  className,
}: {
  id?: string;
  eyebrow: string;
  title: ReactNode;
  lead?: ReactNode;
  children: ReactNode;
  className?: string;
}) {
  const headingId = id ? `${id}-title` : undefined;
  return (
    <section
      id={id}
      aria-labelledby={headingId}
      className={cn("scroll-mt-16 border-b border-line", className)}
    >
      <div className="mx-auto max-w-6xl px-5 py-18 sm:px-8 lg:py-22">
        <div className="mb-10 grid max-w-2xl gap-3">
          <p className="text-xs font-semibold tracking-[0.1em] text-accent-ink uppercase">
            {eyebrow}
          </p>
          <h2
            id={headingId}
            className="text-[28px] leading-9 font-semibold tracking-[-0.02em] text-ink sm:text-[32px] sm:leading-10"
          >
            {title}
          </h2>
          {lead ? <p className="text-base leading-7 text-ink-2">{lead}</p> : null}
        </div>
        {children}
      </div>
    </section>
  );
}

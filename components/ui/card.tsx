import type { HTMLAttributes, ReactNode } from "react";
import { cn } from "./cn";

/** A bordered surface. Compose with CardHeader / CardBody / CardFooter or pad it yourself. */
export function Card({ className, ...rest }: HTMLAttributes<HTMLDivElement>) {
  return (
    <div
      className={cn("rounded-lg border border-line bg-surface shadow-card", className)}
      {...rest}
    />
  );
}

export type CardHeaderProps = {
  title: ReactNode;
  description?: ReactNode;
  /** Buttons or links at the right end. */
  actions?: ReactNode;
  /** Heading level for the title (default h2). */
  as?: "h2" | "h3" | "h4";
  /** Small label above the title (section kind, e.g. "Usage"). */
  eyebrow?: ReactNode;
  className?: string;
};

export function CardHeader({
  title,
  description,
  actions,
  as: H = "h2",
  eyebrow,
  className,
}: CardHeaderProps) {
  return (
    <div
      className={cn(
        "flex flex-wrap items-start justify-between gap-x-4 gap-y-2 px-5 pt-4 pb-3",
        className,
      )}
    >
      <div className="min-w-0 grid gap-0.5">
        {eyebrow ? (
          <p className="text-2xs font-semibold tracking-[0.08em] text-ink-3 uppercase">{eyebrow}</p>
        ) : null}
        <H className="text-[15px] leading-6 font-semibold text-ink">{title}</H>
        {description ? <p className="text-[13px] leading-5 text-ink-2">{description}</p> : null}
      </div>
      {actions ? <div className="flex shrink-0 items-center gap-2">{actions}</div> : null}
    </div>
  );
}

export function CardBody({ className, ...rest }: HTMLAttributes<HTMLDivElement>) {
  return <div className={cn("px-5 pb-5", className)} {...rest} />;
}

export function CardFooter({ className, ...rest }: HTMLAttributes<HTMLDivElement>) {
  return (
    <div
      className={cn(
        "flex flex-wrap items-center justify-end gap-2 rounded-b-lg border-t border-line bg-surface-2/60 px-5 py-3",
        className,
      )}
      {...rest}
    />
  );
}

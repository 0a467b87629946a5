import type { HTMLAttributes, TdHTMLAttributes, ThHTMLAttributes } from "react";
import { cn } from "./cn";

/**
 * Table styles. <Table> wraps the table in a horizontally scrolling, bordered frame.
 * Mark number columns with `numeric` on TH/TD: right-aligned mono tabular figures.
 */
export function Table({
  className,
  frameClassName,
  ...rest
}: HTMLAttributes<HTMLTableElement> & { frameClassName?: string }) {
  return (
    <div className={cn("overflow-x-auto rounded-lg border border-line bg-surface", frameClassName)}>
      <table className={cn("w-full border-collapse text-left text-[13px]", className)} {...rest} />
    </div>
  );
}

export function TCaption({ className, ...rest }: HTMLAttributes<HTMLTableCaptionElement>) {
  return <caption className={cn("px-4 py-2 text-left text-xs text-ink-2", className)} {...rest} />;
}

export function THead({ className, ...rest }: HTMLAttributes<HTMLTableSectionElement>) {
  return <thead className={cn("border-b border-line bg-surface-2/70", className)} {...rest} />;
}

export function TBody({ className, ...rest }: HTMLAttributes<HTMLTableSectionElement>) {
  return <tbody className={cn("divide-y divide-line", className)} {...rest} />;
}

export function TR({ className, ...rest }: HTMLAttributes<HTMLTableRowElement>) {
  return (
    <tr
      className={cn(
        "transition-colors hover:bg-surface-2/50 aria-selected:bg-accent-soft/60",
        className,
      )}
      {...rest}
    />
  );
}

export function TH({
  numeric,
  className,
  scope = "col",
  ...rest
}: ThHTMLAttributes<HTMLTableCellElement> & { numeric?: boolean }) {
  return (
    <th
      scope={scope}
      className={cn(
        "h-9 px-3 text-2xs font-semibold tracking-[0.06em] whitespace-nowrap text-ink-2 uppercase first:pl-4 last:pr-4",
        numeric && "text-right",
        className,
      )}
      {...rest}
    />
  );
}

export function TD({
  numeric,
  className,
  ...rest
}: TdHTMLAttributes<HTMLTableCellElement> & { numeric?: boolean }) {
  return (
    <td
      className={cn(
        "h-10 px-3 align-middle text-ink first:pl-4 last:pr-4",
        numeric && "figures text-right text-[12.5px] whitespace-nowrap",
        className,
      )}
      {...rest}
    />
  );
}

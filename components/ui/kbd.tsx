import type { HTMLAttributes } from "react";
import { cn } from "./cn";

/** A key cap, e.g. <Kbd>Ctrl</Kbd> + <Kbd>Enter</Kbd>. */
export function Kbd({ className, ...rest }: HTMLAttributes<HTMLElement>) {
  return (
    <kbd
      className={cn(
        "inline-flex h-5 min-w-5 items-center justify-center rounded border border-line-strong border-b-2 bg-surface px-1 font-mono text-[11px] leading-none text-ink-2",
        className,
      )}
      {...rest}
    />
  );
}

import type { Ref, TextareaHTMLAttributes } from "react";
import { cn } from "./cn";
import { controlClasses } from "./control-styles";

export type TextareaProps = TextareaHTMLAttributes<HTMLTextAreaElement> & {
  /** Mono face for source text (Pauli sums, OpenQASM). */
  mono?: boolean;
  ref?: Ref<HTMLTextAreaElement>;
};

/** Multi-line text input; resizes vertically only. */
export function Textarea({ mono, className, rows = 4, ...rest }: TextareaProps) {
  return (
    <textarea
      rows={rows}
      className={cn(
        controlClasses,
        "read-only:bg-surface-2",
        "min-h-16 resize-y px-3 py-2 leading-relaxed",
        mono && "font-mono text-[13px] leading-6",
        className,
      )}
      {...rest}
    />
  );
}

import type { LabelHTMLAttributes } from "react";
import { cn } from "./cn";

export type LabelProps = LabelHTMLAttributes<HTMLLabelElement> & {
  /** Adds a discreet "required" marker (the control itself should carry `required`). */
  required?: boolean;
  /** Adds "optional" in muted text. */
  optional?: boolean;
};

export function Label({ required, optional, className, children, ...rest }: LabelProps) {
  return (
    <label className={cn("text-[13px] leading-5 font-medium text-ink", className)} {...rest}>
      {children}
      {required ? (
        <span aria-hidden className="ml-0.5 text-danger">
          *
        </span>
      ) : null}
      {optional ? <span className="ml-1.5 font-normal text-ink-3">optional</span> : null}
    </label>
  );
}

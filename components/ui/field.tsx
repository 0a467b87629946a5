import {
  Children,
  cloneElement,
  isValidElement,
  useId,
  type ReactElement,
  type ReactNode,
} from "react";
import { cn } from "./cn";
import { IconError } from "./icons";
import { Label } from "./label";

type ControlProps = {
  id?: string;
  "aria-describedby"?: string;
  "aria-invalid"?: boolean | "true" | "false";
  required?: boolean;
};

export type FieldProps = {
  label: ReactNode;
  /** One control element (Input, Textarea, Select, or any element taking id/aria props). */
  children: ReactElement<ControlProps>;
  hint?: ReactNode;
  /** Error text; when set the control gets aria-invalid and the message is announced. */
  error?: string | string[] | null;
  required?: boolean;
  optional?: boolean;
  /** Control id; defaults to the child's id or a generated one. */
  id?: string;
  className?: string;
  /** Element placed at the right end of the label row (e.g. a help Tooltip or counter). */
  aside?: ReactNode;
};

/**
 * Label + control + hint + error. Binds the label with htmlFor/id and the hint and
 * error with aria-describedby on the control; sets aria-invalid when there is an error.
 */
export function Field({
  label,
  children,
  hint,
  error,
  required,
  optional,
  id,
  className,
  aside,
}: FieldProps) {
  const auto = useId();
  const child = Children.only(children);
  const controlId = id ?? child.props.id ?? auto;
  const hintId = hint ? `${controlId}-hint` : undefined;
  const messages = error ? (Array.isArray(error) ? error : [error]) : [];
  const errorId = messages.length ? `${controlId}-error` : undefined;
  const describedBy =
    [child.props["aria-describedby"], hintId, errorId].filter(Boolean).join(" ") || undefined;

  const control = isValidElement(child)
    ? cloneElement(child, {
        id: controlId,
        "aria-describedby": describedBy,
        "aria-invalid": messages.length ? true : child.props["aria-invalid"],
        required: required ?? child.props.required,
      })
    : child;

  return (
    <div className={cn("grid content-start gap-1.5", className)}>
      <div className="flex items-baseline justify-between gap-3">
        <Label htmlFor={controlId} required={required} optional={optional}>
          {label}
        </Label>
        {aside}
      </div>
      {control}
      {hint ? (
        <p id={hintId} className="text-[12.5px] leading-5 text-ink-2">
          {hint}
        </p>
      ) : null}
      {errorId ? (
        <div
          id={errorId}
          aria-live="polite"
          className="flex items-start gap-1.5 text-[12.5px] leading-5 text-danger"
        >
          <IconError className="mt-0.5 size-3.5 shrink-0" />
          <span>{messages.join(" ")}</span>
        </div>
      ) : null}
    </div>
  );
}

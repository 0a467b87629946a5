import { useId, type InputHTMLAttributes, type ReactNode, type Ref } from "react";
import { cn } from "./cn";

export type CheckboxProps = Omit<InputHTMLAttributes<HTMLInputElement>, "type"> & {
  /** Visible label, placed to the right of the box. */
  label: ReactNode;
  /** Secondary line under the label, bound with aria-describedby. */
  description?: ReactNode;
  ref?: Ref<HTMLInputElement>;
};

/** Native checkbox with its own label (click target covers box and text). */
export function Checkbox({ label, description, className, id, ...rest }: CheckboxProps) {
  const auto = useId();
  const inputId = id ?? auto;
  const descId = description ? `${inputId}-desc` : undefined;
  return (
    <div className={cn("flex items-start gap-2.5", className)}>
      <input
        id={inputId}
        type="checkbox"
        aria-describedby={descId}
        className="mt-0.5 size-4 shrink-0 cursor-pointer rounded-sm border-line-strong accent-accent disabled:cursor-not-allowed"
        {...rest}
      />
      <div className="grid gap-0.5">
        <label htmlFor={inputId} className="cursor-pointer text-sm leading-5 font-medium text-ink">
          {label}
        </label>
        {description ? (
          <p id={descId} className="text-[13px] leading-5 text-ink-2">
            {description}
          </p>
        ) : null}
      </div>
    </div>
  );
}

import type { InputHTMLAttributes, Ref } from "react";
import { cn } from "./cn";
import { controlClasses, controlSizes, type ControlSize } from "./control-styles";

export type InputProps = Omit<InputHTMLAttributes<HTMLInputElement>, "size"> & {
  size?: ControlSize;
  /** Renders figures in the mono face with tabular numerals (numbers, seeds, keys). */
  mono?: boolean;
  ref?: Ref<HTMLInputElement>;
};

/** Single-line text input. Wrap in <Field> to get a label, hint and error. */
export function Input({ size = "md", mono, className, ...rest }: InputProps) {
  return (
    <input
      className={cn(
        controlClasses,
        "read-only:bg-surface-2",
        controlSizes[size],
        mono && "figures text-[13px]",
        className,
      )}
      {...rest}
    />
  );
}

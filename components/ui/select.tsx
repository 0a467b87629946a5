import type { Ref, SelectHTMLAttributes } from "react";
import { cn } from "./cn";
import { controlClasses, controlSizes, type ControlSize } from "./control-styles";
import { IconChevronDown } from "./icons";

export type SelectOption = { value: string; label: string; disabled?: boolean };

export type SelectProps = Omit<SelectHTMLAttributes<HTMLSelectElement>, "size"> & {
  size?: ControlSize;
  /** Either pass `options` or <option> children. */
  options?: SelectOption[];
  /** Adds a first, empty option with this text (e.g. "Choose…"). */
  placeholder?: string;
  ref?: Ref<HTMLSelectElement>;
};

/** Native <select> (keyboard and screen-reader behaviour of the platform) with our look. */
export function Select({
  size = "md",
  options,
  placeholder,
  className,
  children,
  ...rest
}: SelectProps) {
  return (
    <span className={cn("relative block", className)}>
      <select className={cn(controlClasses, controlSizes[size], "appearance-none pr-8")} {...rest}>
        {placeholder !== undefined ? <option value="">{placeholder}</option> : null}
        {options?.map((o) => (
          <option key={o.value} value={o.value} disabled={o.disabled}>
            {o.label}
          </option>
        ))}
        {children}
      </select>
      <IconChevronDown className="pointer-events-none absolute top-1/2 right-2.5 size-4 -translate-y-1/2 text-ink-3" />
    </span>
  );
}

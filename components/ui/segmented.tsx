"use client";
/**
 * A segmented choice built on native radio buttons (arrow keys, one tab stop and the
 * group's name come from the platform); the checked segment is raised.
 */
import { useId, type ReactNode } from "react";
import { cn } from "@/components/ui/cn";

export type Segment<T extends string> = {
  value: T;
  label: ReactNode;
  hint?: string;
  disabled?: boolean;
};

export function Segmented<T extends string>({
  legend,
  value,
  onChange,
  options,
  size = "md",
  className,
  hideLegend,
  name,
}: {
  legend: string;
  value: T;
  onChange: (value: T) => void;
  options: Segment<T>[];
  size?: "sm" | "md";
  className?: string;
  hideLegend?: boolean;
  name?: string;
}) {
  const auto = useId();
  const group = name ?? auto;
  return (
    <fieldset className={cn("grid gap-1.5", className)}>
      <legend
        className={cn("mb-1.5 text-[13px] leading-5 font-medium text-ink", hideLegend && "sr-only")}
      >
        {legend}
      </legend>
      <div className="inline-flex w-fit flex-wrap rounded-lg border border-line bg-surface-2 p-0.5">
        {options.map((o) => {
          const id = `${group}-${o.value}`;
          const on = o.value === value;
          return (
            <label
              key={o.value}
              htmlFor={id}
              title={o.hint}
              className={cn(
                "relative inline-flex cursor-pointer items-center rounded-md font-medium whitespace-nowrap transition-colors",
                size === "sm" ? "h-7 px-2.5 text-[12.5px]" : "h-8 px-3 text-[13px]",
                on ? "bg-surface text-ink shadow-card" : "text-ink-2 hover:text-ink",
                o.disabled && "cursor-not-allowed opacity-50",
                "has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-offset-1 has-[:focus-visible]:outline-focus",
              )}
            >
              <input
                id={id}
                type="radio"
                name={group}
                value={o.value}
                checked={on}
                disabled={o.disabled}
                onChange={() => onChange(o.value)}
                className="sr-only"
              />
              {o.label}
            </label>
          );
        })}
      </div>
    </fieldset>
  );
}

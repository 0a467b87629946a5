import {
  formatFixed,
  formatPlusMinus,
  formatUncertainty,
  type UncertaintyDigits,
} from "@/lib/format";
import { cn } from "./cn";

export type ValueTone = "default" | "exact" | "sampled" | "noisy" | "mitigated" | "muted";

const toneClass: Record<ValueTone, string> = {
  default: "text-ink",
  exact: "text-exact",
  sampled: "text-sampled",
  noisy: "text-noisy",
  mitigated: "text-mitigated",
  muted: "text-ink-2",
};

/**
 * A figure in mono tabular numerals. With `uncertainty` it prints concise notation
 * (−1.1372(8), see lib/format/uncertainty.ts); without, `decimals` fixed places.
 * The title tooltip and the screen-reader text spell it out as "v ± u".
 * Non-finite values print "—" with the reason in the title.
 */
export function Value({
  value,
  uncertainty,
  decimals = 6,
  digits = "pdg",
  unit,
  tone = "default",
  size = "md",
  className,
}: {
  value: number | null | undefined;
  uncertainty?: number | null;
  decimals?: number;
  digits?: UncertaintyDigits;
  unit?: string;
  tone?: ValueTone;
  size?: "sm" | "md" | "lg" | "xl";
  className?: string;
}) {
  const sizeClass = {
    sm: "text-[12.5px]",
    md: "text-sm",
    lg: "text-lg",
    xl: "text-[28px] leading-9 tracking-[-0.02em]",
  }[size];
  if (value === null || value === undefined || !Number.isFinite(value)) {
    return (
      <span
        className={cn("figures text-ink-3", sizeClass, className)}
        title={
          value === undefined || value === null ? "No value" : `Not a finite number (${value})`
        }
      >
        —
      </span>
    );
  }
  const hasU = typeof uncertainty === "number" && Number.isFinite(uncertainty) && uncertainty > 0;
  const text = hasU
    ? formatUncertainty(value, uncertainty, { digits })
    : formatFixed(value, decimals);
  const spoken = hasU ? formatPlusMinus(value, uncertainty, { digits }) : text;
  const full = hasU ? `${value} ± ${uncertainty}` : String(value);
  return (
    <span
      className={cn("figures whitespace-nowrap", toneClass[tone], sizeClass, className)}
      title={unit ? `${full} ${unit}` : full}
    >
      <span aria-hidden>{text}</span>
      <span className="sr-only">{spoken}</span>
      {unit ? <span className="ml-1 font-sans text-[0.8em] text-ink-3">{unit}</span> : null}
    </span>
  );
}

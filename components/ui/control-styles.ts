/**
 * Shared look of text-like form controls (Input, Textarea, Select). Invalid state is
 * driven by `aria-invalid="true"` so Field can set it once for every control kind.
 */
export const controlClasses =
  "w-full rounded-md border border-line-strong bg-surface text-ink text-sm shadow-[inset_0_1px_1px_oklch(0.2_0.02_252/0.04)] " +
  "placeholder:text-ink-3 transition-[border-color,box-shadow] duration-150 " +
  "hover:border-ink-3/70 focus-visible:outline-none focus-visible:border-focus focus-visible:ring-3 focus-visible:ring-focus/25 " +
  "disabled:cursor-not-allowed disabled:bg-surface-2 disabled:text-ink-3 " +
  "aria-invalid:border-danger aria-invalid:focus-visible:ring-danger/25";

export const controlSizes = {
  sm: "h-8 px-2.5 text-[13px]",
  md: "h-9 px-3",
  lg: "h-11 px-3.5 text-[15px]",
} as const;

export type ControlSize = keyof typeof controlSizes;

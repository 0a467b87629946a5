import type { ButtonHTMLAttributes, ReactNode } from "react";
import { cn } from "./cn";
import { Spinner } from "./spinner";

export type ButtonVariant = "primary" | "secondary" | "ghost" | "danger" | "link";
export type ButtonSize = "sm" | "md" | "lg" | "icon" | "icon-sm";

const base =
  "relative inline-flex items-center justify-center gap-2 whitespace-nowrap font-medium " +
  "select-none transition-[background-color,border-color,color,box-shadow] duration-150 " +
  "focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-focus " +
  "disabled:pointer-events-none disabled:opacity-55 aria-disabled:pointer-events-none aria-disabled:opacity-55";

const variants: Record<ButtonVariant, string> = {
  primary:
    "bg-accent text-on-accent shadow-[inset_0_1px_0_oklch(1_0_0/0.12)] hover:bg-accent-strong active:translate-y-px",
  secondary:
    "border border-line-strong bg-surface text-ink shadow-card hover:bg-surface-2 hover:border-ink-3/60 active:translate-y-px",
  ghost: "text-ink-2 hover:bg-surface-3/70 hover:text-ink",
  danger: "bg-danger text-white hover:brightness-95 active:translate-y-px dark:text-canvas",
  link: "h-auto! px-0! text-accent-ink underline-offset-4 hover:underline",
};

const sizes: Record<ButtonSize, string> = {
  sm: "h-8 rounded-md px-3 text-[13px]",
  md: "h-9 rounded-md px-3.5 text-sm",
  lg: "h-11 rounded-lg px-5 text-[15px]",
  icon: "size-9 rounded-md",
  "icon-sm": "size-8 rounded-md",
};

/** Class string for a button look; use it to style a `<Link>` or `<a>` as a button. */
export function buttonClasses({
  variant = "primary",
  size = "md",
  className,
}: { variant?: ButtonVariant; size?: ButtonSize; className?: string } = {}): string {
  return cn(base, variants[variant], sizes[size], className);
}

export type ButtonProps = ButtonHTMLAttributes<HTMLButtonElement> & {
  variant?: ButtonVariant;
  size?: ButtonSize;
  /** Shows a spinner, keeps the width, sets aria-busy and disables the button. */
  loading?: boolean;
  /** Icon placed before the label. */
  icon?: ReactNode;
  ref?: React.Ref<HTMLButtonElement>;
};

/** Button. `type` defaults to "button" (pass type="submit" in forms). */
export function Button({
  variant = "primary",
  size = "md",
  loading = false,
  icon,
  className,
  children,
  disabled,
  type = "button",
  ...rest
}: ButtonProps) {
  return (
    <button
      type={type}
      className={buttonClasses({ variant, size, className })}
      disabled={disabled || loading}
      aria-busy={loading || undefined}
      {...rest}
    >
      {loading ? (
        <span className="absolute inset-0 flex items-center justify-center">
          <Spinner />
        </span>
      ) : null}
      <span className={cn("inline-flex items-center gap-2", loading && "invisible")}>
        {icon}
        {children}
      </span>
    </button>
  );
}

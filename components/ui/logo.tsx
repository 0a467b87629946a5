import { cn } from "./cn";

/**
 * The Ketwise mark: a ket |•⟩ (bar, state, closing angle) on a verdigris tile.
 * Decorative by default; pass `title` to give it an accessible name.
 */
export function LogoMark({ className, title }: { className?: string; title?: string }) {
  return (
    <svg
      viewBox="0 0 32 32"
      className={cn("size-7 shrink-0", className)}
      role={title ? "img" : undefined}
      aria-hidden={title ? undefined : true}
      aria-label={title}
    >
      <rect width="32" height="32" rx="7" className="fill-accent" />
      <path
        d="M9.5 8v16M17.5 8.5 24 16l-6.5 7.5"
        className="stroke-on-accent"
        fill="none"
        strokeWidth="2.6"
        strokeLinecap="round"
        strokeLinejoin="round"
      />
      <circle cx="16.25" cy="16" r="2.35" className="fill-on-accent" />
    </svg>
  );
}

/** Mark + lower-case wordmark. The wordmark is the accessible name. */
export function Logo({ className, size = "md" }: { className?: string; size?: "sm" | "md" }) {
  return (
    <span className={cn("inline-flex items-center gap-2", className)}>
      <LogoMark className={size === "sm" ? "size-6" : "size-7"} />
      <span
        className={cn(
          "font-semibold tracking-[-0.02em] text-ink",
          size === "sm" ? "text-[15px]" : "text-[17px]",
        )}
      >
        ketwise
      </span>
    </span>
  );
}

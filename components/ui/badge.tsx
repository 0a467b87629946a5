import type { HTMLAttributes } from "react";
import { RUN_STATUS_LABELS, type RunStatus } from "@/lib/runs/constants";
import { cn } from "./cn";

export type BadgeTone = "neutral" | "accent" | "info" | "ok" | "warn" | "danger";

const tones: Record<BadgeTone, string> = {
  neutral: "border-line-strong/70 bg-surface-2 text-ink-2",
  accent: "border-accent/30 bg-accent-soft text-accent-ink",
  info: "border-info/30 bg-info-soft text-info",
  ok: "border-ok/30 bg-ok-soft text-ok",
  warn: "border-warn/35 bg-warn-soft text-warn",
  danger: "border-danger/30 bg-danger-soft text-danger",
};

export type BadgeProps = HTMLAttributes<HTMLSpanElement> & { tone?: BadgeTone };

/** A small label (role, plan, tag). */
export function Badge({ tone = "neutral", className, ...rest }: BadgeProps) {
  return (
    <span
      className={cn(
        "inline-flex h-5 items-center gap-1 rounded-[5px] border px-1.5 text-[11.5px] leading-none font-medium whitespace-nowrap",
        tones[tone],
        className,
      )}
      {...rest}
    />
  );
}

const statusLook: Record<RunStatus, { tone: BadgeTone; dot: string }> = {
  queued: { tone: "neutral", dot: "bg-ink-3" },
  running: { tone: "info", dot: "bg-info animate-pulse" },
  succeeded: { tone: "ok", dot: "bg-ok" },
  failed: { tone: "danger", dot: "bg-danger" },
  canceled: { tone: "neutral", dot: "bg-transparent border border-ink-3" },
};

/** Run status with a coloured dot; the text carries the meaning, colour only repeats it. */
export function StatusBadge({ status, className }: { status: RunStatus; className?: string }) {
  const look = statusLook[status];
  return (
    <Badge tone={look.tone} className={cn(status === "canceled" && "text-ink-3", className)}>
      <span aria-hidden className={cn("size-1.5 rounded-full", look.dot)} />
      {RUN_STATUS_LABELS[status]}
    </Badge>
  );
}

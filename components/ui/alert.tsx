import type { ReactNode } from "react";
import { cn } from "./cn";
import { IconError, IconInfo, IconSuccess, IconWarning } from "./icons";

export type AlertTone = "info" | "warning" | "error" | "success" | "neutral";

const tones: Record<AlertTone, { box: string; icon: string; Icon: typeof IconInfo }> = {
  info: { box: "border-info/30 bg-info-soft", icon: "text-info", Icon: IconInfo },
  warning: { box: "border-warn/35 bg-warn-soft", icon: "text-warn", Icon: IconWarning },
  error: { box: "border-danger/35 bg-danger-soft", icon: "text-danger", Icon: IconError },
  success: { box: "border-ok/30 bg-ok-soft", icon: "text-ok", Icon: IconSuccess },
  neutral: { box: "border-line bg-surface-2", icon: "text-ink-2", Icon: IconInfo },
};

export type AlertProps = {
  tone?: AlertTone;
  title?: ReactNode;
  children?: ReactNode;
  /** Buttons/links shown under the text. */
  actions?: ReactNode;
  className?: string;
  /** "alert" interrupts screen readers (use for errors that just appeared); default "note" is passive. */
  role?: "alert" | "status" | "note";
  compact?: boolean;
};

/** A callout: icon, optional title, text, optional actions. */
export function Alert({
  tone = "info",
  title,
  children,
  actions,
  className,
  role = "note",
  compact,
}: AlertProps) {
  const t = tones[tone];
  return (
    <div
      role={role}
      className={cn(
        "flex gap-3 rounded-lg border text-ink",
        compact ? "px-3 py-2 text-[13px]" : "px-4 py-3 text-sm",
        t.box,
        className,
      )}
    >
      <t.Icon className={cn("mt-0.5 size-4 shrink-0", t.icon)} />
      <div className="grid min-w-0 gap-1 leading-relaxed">
        {title ? <p className="font-semibold">{title}</p> : null}
        {children ? (
          <div className="text-ink-2 [&_a]:font-medium [&_a]:text-ink [&_a]:underline">
            {children}
          </div>
        ) : null}
        {actions ? <div className="mt-1.5 flex flex-wrap gap-2">{actions}</div> : null}
      </div>
    </div>
  );
}

/**
 * The standing caution shown wherever Ketwise prints simulated or noise-model values.
 * `variant="inline"` is a single muted line for footers of result panels.
 */
export function SimulationCaution({
  variant = "callout",
  className,
}: {
  variant?: "callout" | "inline";
  className?: string;
}) {
  const text = (
    <>
      Simulated values are not device measurements. Noise models are idealised: real hardware
      drifts, has correlated and leaking errors, and crosstalk that no model here captures.
    </>
  );
  if (variant === "inline") {
    return (
      <p className={cn("flex items-start gap-1.5 text-xs leading-5 text-ink-3", className)}>
        <IconInfo className="mt-0.5 size-3.5 shrink-0" />
        <span>{text}</span>
      </p>
    );
  }
  return (
    <Alert tone="warning" title="Simulation, not a measurement" className={className}>
      {text}
    </Alert>
  );
}

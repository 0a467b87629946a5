"use client";

import { useEffect, useId, useRef, type ReactNode } from "react";
import { cn } from "./cn";
import { IconClose } from "./icons";

/**
 * Modal dialog on the native <dialog> element (focus trap, Escape and the top layer come
 * from the platform). Controlled: `open` + `onClose` (called on Escape, the close button
 * and a click on the backdrop). Focus returns to the element focused before opening.
 */
export function Dialog({
  open,
  onClose,
  title,
  description,
  children,
  footer,
  size = "md",
  className,
}: {
  open: boolean;
  onClose: () => void;
  title: ReactNode;
  description?: ReactNode;
  children?: ReactNode;
  /** Action row (e.g. Cancel + Confirm buttons). */
  footer?: ReactNode;
  size?: "sm" | "md" | "lg";
  className?: string;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const descId = useId();
  const opener = useRef<Element | null>(null);

  useEffect(() => {
    const d = ref.current;
    if (!d) return;
    if (open && !d.open) {
      opener.current = document.activeElement;
      d.showModal();
    } else if (!open && d.open) {
      d.close();
      (opener.current as HTMLElement | null)?.focus?.();
    }
  }, [open]);

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      aria-describedby={description ? descId : undefined}
      onCancel={(e) => {
        e.preventDefault();
        onClose();
      }}
      onClick={(e) => {
        if (e.target === e.currentTarget) onClose();
      }}
      className={cn(
        "m-auto w-[calc(100vw-2rem)] rounded-xl border border-line bg-surface p-0 text-ink shadow-pop backdrop:backdrop-blur-[2px]",
        { sm: "max-w-sm", md: "max-w-lg", lg: "max-w-3xl" }[size],
        className,
      )}
    >
      {open ? (
        <div className="grid">
          <div className="flex items-start justify-between gap-4 px-5 pt-4 pb-2">
            <div className="grid gap-1">
              <h2 id={titleId} className="text-base font-semibold text-ink">
                {title}
              </h2>
              {description ? (
                <p id={descId} className="text-[13px] leading-5 text-ink-2">
                  {description}
                </p>
              ) : null}
            </div>
            <button
              type="button"
              onClick={onClose}
              aria-label="Close"
              className="-mt-0.5 -mr-1.5 inline-flex size-8 items-center justify-center rounded-md text-ink-3 hover:bg-surface-2 hover:text-ink"
            >
              <IconClose />
            </button>
          </div>
          {children ? <div className="px-5 pt-2 pb-5 text-sm">{children}</div> : null}
          {footer ? (
            <div className="flex flex-wrap justify-end gap-2 rounded-b-xl border-t border-line bg-surface-2/60 px-5 py-3">
              {footer}
            </div>
          ) : null}
        </div>
      ) : null}
    </dialog>
  );
}

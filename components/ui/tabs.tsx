"use client";

import { useId, useRef, useState, type ReactNode } from "react";
import { cn } from "./cn";

export type TabItem = { id: string; label: ReactNode; content: ReactNode; disabled?: boolean };

/**
 * Tabs (WAI-ARIA tabs pattern, automatic activation): ←/→ move and select, Home/End jump,
 * only the selected tab is in the tab order; panels are labelled by their tab.
 * Controlled (`value` + `onValueChange`) or uncontrolled (`defaultValue`).
 */
export function Tabs({
  items,
  value,
  defaultValue,
  onValueChange,
  label,
  className,
  variant = "underline",
}: {
  items: TabItem[];
  value?: string;
  defaultValue?: string;
  onValueChange?: (id: string) => void;
  /** Accessible name of the tab list. */
  label: string;
  className?: string;
  variant?: "underline" | "segmented";
}) {
  const base = useId();
  const [inner, setInner] = useState(defaultValue ?? items[0]?.id);
  const selected = value ?? inner;
  const refs = useRef<Record<string, HTMLButtonElement | null>>({});
  const enabled = items.filter((i) => !i.disabled);

  const select = (id: string, focus = false) => {
    if (value === undefined) setInner(id);
    onValueChange?.(id);
    if (focus) refs.current[id]?.focus();
  };

  const onKey = (e: React.KeyboardEvent) => {
    const i = enabled.findIndex((t) => t.id === selected);
    let next: number | null = null;
    if (e.key === "ArrowRight") next = (i + 1) % enabled.length;
    else if (e.key === "ArrowLeft") next = (i - 1 + enabled.length) % enabled.length;
    else if (e.key === "Home") next = 0;
    else if (e.key === "End") next = enabled.length - 1;
    if (next !== null) {
      e.preventDefault();
      select(enabled[next].id, true);
    }
  };

  return (
    <div className={className}>
      <div
        role="tablist"
        aria-label={label}
        onKeyDown={onKey}
        className={cn(
          "flex gap-1",
          variant === "underline"
            ? "border-b border-line"
            : "inline-flex rounded-lg border border-line bg-surface-2 p-0.5",
        )}
      >
        {items.map((t) => {
          const on = t.id === selected;
          return (
            <button
              key={t.id}
              ref={(el) => {
                refs.current[t.id] = el;
              }}
              type="button"
              role="tab"
              id={`${base}-tab-${t.id}`}
              aria-selected={on}
              aria-controls={`${base}-panel-${t.id}`}
              tabIndex={on ? 0 : -1}
              disabled={t.disabled}
              onClick={() => select(t.id)}
              className={cn(
                "inline-flex items-center gap-1.5 text-[13.5px] font-medium whitespace-nowrap transition-colors disabled:opacity-50",
                variant === "underline"
                  ? cn(
                      "-mb-px h-9 border-b-2 px-2.5",
                      on
                        ? "border-accent text-ink"
                        : "border-transparent text-ink-2 hover:border-line-strong hover:text-ink",
                    )
                  : cn(
                      "h-7 rounded-md px-3",
                      on ? "bg-surface text-ink shadow-card" : "text-ink-2 hover:text-ink",
                    ),
              )}
            >
              {t.label}
            </button>
          );
        })}
      </div>
      {items.map((t) => (
        <div
          key={t.id}
          role="tabpanel"
          id={`${base}-panel-${t.id}`}
          aria-labelledby={`${base}-tab-${t.id}`}
          hidden={t.id !== selected}
          tabIndex={0}
          className="pt-4 outline-none focus-visible:rounded-md focus-visible:outline-2 focus-visible:outline-focus"
        >
          {t.content}
        </div>
      ))}
    </div>
  );
}

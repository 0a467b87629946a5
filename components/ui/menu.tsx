"use client";

import { useCallback, useEffect, useId, useRef, useState, type ReactNode } from "react";
import Link from "next/link";
import { cn } from "./cn";

const ITEM = '[role="menuitem"],[role="menuitemradio"],[role="menuitemcheckbox"]';

export type MenuProps = {
  /** Content of the trigger button. */
  trigger: ReactNode;
  /** Accessible name of the trigger when its content is not enough (e.g. icon only). */
  triggerLabel?: string;
  triggerClassName?: string;
  /** Which edge of the trigger the panel aligns to. */
  align?: "start" | "end";
  /** Panel opens below (default) or above the trigger. */
  side?: "bottom" | "top";
  panelClassName?: string;
  /** Items: elements with role="menuitem" (see MenuItem) plus MenuLabel / MenuSeparator. */
  children: ReactNode;
};

/**
 * Disclosure menu (button + panel) with the menu-button keyboard pattern: Enter/Space/↓
 * opens and focuses the first item, ↑/↓/Home/End move, Escape closes and returns focus,
 * Tab or a click outside closes.
 */
export function Menu({
  trigger,
  triggerLabel,
  triggerClassName,
  align = "start",
  side = "bottom",
  panelClassName,
  children,
}: MenuProps) {
  const [open, setOpen] = useState(false);
  const root = useRef<HTMLDivElement>(null);
  const button = useRef<HTMLButtonElement>(null);
  const panelId = useId();

  const items = () =>
    Array.from(
      root.current?.querySelectorAll<HTMLElement>(`#${CSS.escape(panelId)} ${ITEM}`) ?? [],
    );
  const focusAt = (i: number) => {
    const list = items();
    if (list.length) list[(i + list.length) % list.length].focus();
  };
  const close = useCallback((refocus: boolean) => {
    setOpen(false);
    if (refocus) button.current?.focus();
  }, []);

  useEffect(() => {
    if (!open) return;
    const first = items()[0];
    first?.focus();
    const onDown = (e: PointerEvent) => {
      if (!root.current?.contains(e.target as Node)) close(false);
    };
    document.addEventListener("pointerdown", onDown);
    return () => document.removeEventListener("pointerdown", onDown);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [open, close]);

  const onPanelKey = (e: React.KeyboardEvent) => {
    const list = items();
    const i = list.indexOf(document.activeElement as HTMLElement);
    const moves: Record<string, number> = {
      ArrowDown: i + 1,
      ArrowUp: i - 1,
      Home: 0,
      End: list.length - 1,
    };
    if (e.key in moves) {
      e.preventDefault();
      focusAt(moves[e.key]);
    } else if (e.key === "Escape") {
      e.preventDefault();
      close(true);
    } else if (e.key === "Tab") {
      close(false);
    }
  };

  return (
    <div ref={root} className="relative">
      <button
        ref={button}
        type="button"
        aria-haspopup="menu"
        aria-expanded={open}
        aria-controls={open ? panelId : undefined}
        aria-label={triggerLabel}
        className={triggerClassName}
        onClick={() => setOpen((o) => !o)}
        onKeyDown={(e) => {
          if (e.key === "ArrowDown" && !open) {
            e.preventDefault();
            setOpen(true);
          }
        }}
      >
        {trigger}
      </button>
      {open ? (
        <div
          id={panelId}
          role="menu"
          aria-label={triggerLabel}
          onKeyDown={onPanelKey}
          onClick={(e) => {
            // Deferred: a submit item's form must stay mounted until its submit event ran.
            if ((e.target as HTMLElement).closest(ITEM)) setTimeout(() => close(false), 0);
          }}
          className={cn(
            "absolute z-50 min-w-56 rounded-lg border border-line bg-surface p-1 shadow-pop",
            side === "bottom" ? "top-full mt-1.5" : "bottom-full mb-1.5",
            align === "start" ? "left-0" : "right-0",
            panelClassName,
          )}
        >
          {children}
        </div>
      ) : null}
    </div>
  );
}

const itemClasses =
  "flex w-full items-center gap-2.5 rounded-md px-2.5 py-1.5 text-left text-sm text-ink " +
  "hover:bg-surface-2 focus-visible:bg-surface-2 focus-visible:outline-none outline-none " +
  "aria-disabled:opacity-50";

/** A menu entry rendered as a button; put `type="submit"` inside a <form> for actions. */
export function MenuItem({ className, ...rest }: React.ButtonHTMLAttributes<HTMLButtonElement>) {
  return (
    <button
      type="button"
      role="menuitem"
      tabIndex={-1}
      className={cn(itemClasses, className)}
      {...rest}
    />
  );
}

/** A menu entry that navigates (client-side through next/link). */
export function MenuLink({
  className,
  href,
  ...rest
}: React.AnchorHTMLAttributes<HTMLAnchorElement> & { href: string }) {
  return (
    <Link
      href={href}
      role="menuitem"
      tabIndex={-1}
      className={cn(itemClasses, className)}
      {...rest}
    />
  );
}

export function MenuLabel({ children }: { children: ReactNode }) {
  return (
    <div className="px-2.5 pt-2 pb-1 text-2xs font-semibold tracking-[0.08em] text-ink-3 uppercase">
      {children}
    </div>
  );
}

export function MenuSeparator() {
  return <div role="separator" className="my-1 h-px bg-line" />;
}

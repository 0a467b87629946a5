"use client";

import { useEffect, useState } from "react";
import { cn } from "./cn";
import { IconCheck, IconCopy } from "./icons";

/** Copies `text` to the clipboard; says "Copied" for 1.5 s (announced politely). */
export function CopyButton({
  text,
  label = "Copy",
  className,
  showLabel = false,
}: {
  text: string;
  label?: string;
  className?: string;
  showLabel?: boolean;
}) {
  const [state, setState] = useState<"idle" | "copied" | "failed">("idle");
  useEffect(() => {
    if (state === "idle") return;
    const t = setTimeout(() => setState("idle"), 1500);
    return () => clearTimeout(t);
  }, [state]);

  const copy = async () => {
    try {
      await navigator.clipboard.writeText(text);
      setState("copied");
    } catch {
      setState("failed");
    }
  };

  const message = state === "copied" ? "Copied" : state === "failed" ? "Copy failed" : "";
  return (
    <button
      type="button"
      onClick={copy}
      aria-label={showLabel ? undefined : label}
      className={cn(
        "inline-flex h-7 items-center gap-1.5 rounded-md px-2 text-xs font-medium text-ink-2 hover:bg-surface-3/70 hover:text-ink",
        className,
      )}
    >
      {state === "copied" ? (
        <IconCheck className="size-3.5 text-ok" />
      ) : (
        <IconCopy className="size-3.5" />
      )}
      {showLabel ? <span>{state === "copied" ? "Copied" : label}</span> : null}
      <span aria-live="polite" className="sr-only">
        {message}
      </span>
    </button>
  );
}

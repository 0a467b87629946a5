/** An operation's HTTP method as a small coloured tag. */
import { cn } from "@/components/ui/cn";

const METHOD_TONE: Record<string, string> = {
  get: "border-info/30 bg-info-soft text-info",
  post: "border-ok/30 bg-ok-soft text-ok",
  delete: "border-danger/30 bg-danger-soft text-danger",
};

export function MethodTag({ method }: { method: string }) {
  return (
    <span
      className={cn(
        "inline-flex h-5 min-w-12 items-center justify-center rounded-[5px] border px-1.5 font-mono text-[11px] font-semibold uppercase",
        METHOD_TONE[method] ?? "border-line bg-surface-2 text-ink-2",
      )}
    >
      {method}
    </span>
  );
}

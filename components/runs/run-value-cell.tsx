import { Value } from "@/components/ui/value";
import type { RunSummary } from "@/lib/swr/types";

/** Headline value of a run in a list: sampled mean ± error when shots were drawn, else the exact value. */
export function RunValueCell({ run }: { run: RunSummary }) {
  const s = run.summary;
  if (!s) return <span className="text-ink-3">—</span>;
  if (s.sampledMean !== null && s.sampledStdErr !== null) {
    return (
      <span className="grid justify-items-end">
        <Value value={s.sampledMean} uncertainty={s.sampledStdErr} size="sm" tone="sampled" />
        <span className="text-[11px] text-ink-3">
          exact{" "}
          <Value value={s.exact} decimals={5} size="sm" tone="muted" className="text-[11px]" />
        </span>
      </span>
    );
  }
  return <Value value={s.exact} decimals={6} size="sm" tone="exact" />;
}

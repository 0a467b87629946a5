/**
 * What the comparison shows of each run: its noise in one line, the verdict of its sampled
 * (or readout-mitigated) value against the exact one, and its row on the number line.
 */
import type { CompareRow } from "@/components/charts/compare-chart";
import type { Run } from "@/lib/swr/types";
import { agreementVerdict, pickComparison } from "@/lib/runs/verdict";

export function noiseSummary(run: Run): string {
  const n = run.request.noise;
  if (!n || !Object.keys(n).length) return "none";
  const parts: string[] = [];
  if (n.depolarizing1q) parts.push(`p₁ ${n.depolarizing1q}`);
  if (n.depolarizing2q) parts.push(`p₂ ${n.depolarizing2q}`);
  if (n.amplitudeDamping) parts.push(`γ ${n.amplitudeDamping}`);
  if (n.phaseDamping) parts.push(`λ ${n.phaseDamping}`);
  if (n.readout?.p1Given0 || n.readout?.p0Given1)
    parts.push(`readout ${n.readout.p1Given0 ?? 0}/${n.readout.p0Given1 ?? 0}`);
  return parts.join(", ");
}

export function verdictOf(run: Run) {
  const r = run.result!;
  const choice = pickComparison({
    readout: run.request.noise?.readout,
    hasMitigated: !!r.mitigated,
  });
  return agreementVerdict(
    choice.basis === "mitigated" && r.mitigated ? r.mitigated : r.sampled,
    r.exact.value,
  );
}

/** The number line's rows: one per finished run. */
export function compareChartRows(finished: Run[]): CompareRow[] {
  return finished.map((r) => ({
    id: r.id,
    label: r.name,
    exact: r.result!.exact.value,
    ideal: r.result!.ideal.value,
    sampled: r.result!.sampled
      ? { mean: r.result!.sampled.mean, ci95: r.result!.sampled.ci95 }
      : null,
    mitigated: r.result!.mitigated
      ? { mean: r.result!.mitigated.mean, ci95: r.result!.mitigated.ci95 }
      : null,
  }));
}

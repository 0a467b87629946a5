/** Percentiles (nearest-rank on the sorted sample) and table formatting for the benchmark. */
export function percentile(values: number[], p: number): number {
  if (values.length === 0) return NaN;
  const sorted = [...values].sort((a, b) => a - b);
  const rank = Math.min(sorted.length, Math.max(1, Math.ceil((p / 100) * sorted.length)));
  return sorted[rank - 1];
}

export const median = (values: number[]) => percentile(values, 50);

export function table(rows: [string, string, string][]): string {
  const head: [string, string, string] = ["measure", "value", "target"];
  const all = [head, ...rows];
  const width = [0, 1, 2].map((i) => Math.max(...all.map((r) => r[i].length)));
  const line = (r: string[]) => `| ${r.map((c, i) => c.padEnd(width[i])).join(" | ")} |`;
  return [line(head), `|${width.map((w) => "-".repeat(w + 2)).join("|")}|`, ...rows.map(line)].join(
    "\n",
  );
}

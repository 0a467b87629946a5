/**
 * Small benchmark toolkit: timing, the memory-bandwidth baseline and the result table.
 *
 * Baseline (measured in the same run as every row): copying a Float64Array pair (re + im)
 * the size of the state with TypedArray.set — one read and one write of every byte, i.e.
 * 2 × stateBytes moved. A kernel that reads and writes the whole state also moves
 * 2 × stateBytes, so its "bandwidth ratio" is t_copy / t_kernel (1.0 = as fast as memcpy).
 */

export interface RowResult {
  row: string;
  measured: string;
  /** The figure compared with the target (a ratio, unless the row says otherwise). */
  value: number;
  /** Human-readable target, e.g. "≥ 0.6"; empty when the row only reports. */
  target: string;
  /** undefined when there is no target. */
  pass?: boolean;
}

export interface BenchContext {
  /** Baseline time (ms) of copying a 2^n-amplitude re+im state once; cached per n. */
  copyMs(n: number): number;
  /** Values shared between rows of one run (e.g. a timing another row compares with). */
  shared: Map<string, unknown>;
}

export type BenchRow = (ctx: BenchContext) => Promise<RowResult[]> | RowResult[];

/**
 * Best (minimum) time in ms of `reps` runs after `warmup` runs, measured as this process's
 * CPU time (process.cpuUsage, user + system). The engine is single-threaded, so on an idle
 * machine this equals wall time; on a shared machine (other builds and tests on the same two
 * cores) it is far less disturbed than wall time. Baselines use the same clock and rule.
 */
export function timeMs(fn: () => void, reps = 5, warmup = 1): number {
  for (let i = 0; i < warmup; i++) fn();
  let best = Infinity;
  for (let i = 0; i < reps; i++) {
    const t0 = process.cpuUsage();
    fn();
    const d = process.cpuUsage(t0);
    best = Math.min(best, (d.user + d.system) / 1000);
  }
  return best;
}

/** Baseline cache: the time to copy re+im arrays of 2^n doubles each (best of 15). */
export function createContext(): BenchContext {
  const cache = new Map<number, number>();
  return {
    shared: new Map(),
    copyMs(n: number): number {
      const hit = cache.get(n);
      if (hit !== undefined) return hit;
      const len = 2 ** n;
      const srcRe = new Float64Array(len).fill(0.5);
      const srcIm = new Float64Array(len).fill(0.25);
      const dstRe = new Float64Array(len);
      const dstIm = new Float64Array(len);
      const ms = timeMs(() => {
        dstRe.set(srcRe);
        dstIm.set(srcIm);
      }, 15, 2);
      cache.set(n, ms);
      return ms;
    },
  };
}

export const fmtMs = (ms: number): string => (ms >= 100 ? `${ms.toFixed(0)} ms` : `${ms.toFixed(2)} ms`);
export const fmtRatio = (x: number): string => x.toFixed(2);
export const gbPerS = (bytes: number, ms: number): string => `${(bytes / (ms / 1000) / 2 ** 30).toFixed(1)} GiB/s`;

/** Prints the table (one line per row) in Markdown. */
export function printTable(results: RowResult[]): void {
  const head = ["row", "measured", "value", "target", "ok"];
  const lines = results.map((r) => [r.row, r.measured, fmtRatio(r.value), r.target, r.pass === undefined ? "" : r.pass ? "yes" : "NO"]);
  const widths = head.map((h, i) => Math.max(h.length, ...lines.map((l) => l[i].length)));
  const fmt = (cells: string[]): string => `| ${cells.map((c, i) => c.padEnd(widths[i])).join(" | ")} |`;
  console.log(fmt(head));
  console.log(`|${widths.map((w) => "-".repeat(w + 2)).join("|")}|`);
  for (const l of lines) console.log(fmt(l));
}

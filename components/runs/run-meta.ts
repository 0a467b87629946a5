/** Small formatting helpers of the run screens (durations, times). */

/** "850 ms", "4.2 s", "3 min 05 s". */
export function formatDuration(ms: number | null | undefined): string {
  if (ms === null || ms === undefined || !Number.isFinite(ms)) return "—";
  if (ms < 1000) return `${Math.round(ms)} ms`;
  if (ms < 60_000) return `${(ms / 1000).toFixed(ms < 10_000 ? 1 : 0)} s`;
  const m = Math.floor(ms / 60_000);
  const s = Math.round((ms % 60_000) / 1000);
  return `${m} min ${String(s).padStart(2, "0")} s`;
}

const dateTime = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short" });
export function formatWhen(iso: string | null | undefined): string {
  return iso ? dateTime.format(new Date(iso)) : "—";
}

/** "just now", "5 min ago", "3 h ago", else the date. */
export function formatAgo(iso: string, now = Date.now()): string {
  const d = now - new Date(iso).getTime();
  if (d < 45_000) return "just now";
  if (d < 3_600_000) return `${Math.round(d / 60_000)} min ago`;
  if (d < 86_400_000) return `${Math.round(d / 3_600_000)} h ago`;
  return formatWhen(iso);
}

const count = (n: number) => n.toLocaleString("en-US");

/**
 * Planned and drawn shots of a run, in words. `shots` is planned (what the quota check
 * reserved), `shotsDrawn` what the engine drew (billed); they differ when a
 * targetPrecision run was planned from worst-case bounds (the run then plans from the
 * state's variances and draws fewer).
 */
export function shotsText(run: {
  shots: number;
  shotsDrawn: number | null;
  shotsPlan: "fixed" | "state_aware" | "worst_case" | null;
}): { short: string; long: string } {
  const { shots, shotsDrawn: drawn, shotsPlan: plan } = run;
  if (!shots && !drawn) return { short: "exact", long: "exact only" };
  if (drawn !== null && drawn !== shots) {
    return {
      short: `${count(drawn)} of ${count(shots)}`,
      long: `${count(drawn)} drawn · ${count(shots)} planned${plan === "worst_case" ? " (worst-case bound)" : ""}`,
    };
  }
  if (drawn === null && plan === "worst_case") {
    return {
      short: `≤ ${count(shots)}`,
      long: `≤ ${count(shots)} planned (worst-case bound; the run plans from the state's variances)`,
    };
  }
  const how = plan === "state_aware" ? " (planned from the state's variances)" : "";
  return { short: count(shots), long: `${count(shots)}${drawn === null ? how : " drawn"}` };
}

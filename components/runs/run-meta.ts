/** The shots of a run in words (numbers through lib/format). */
import { formatCount as count } from "@/lib/format";

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

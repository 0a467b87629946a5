/**
 * Plan limits applied to a run before it is queued (all numbers from
 * lib/billing/plans.ts; the backlog cap from the environment):
 *
 * - qubits above the plan's maximum for the method → 402;
 * - Sandbox (no overage): shots used + shots of unfinished runs + this run's
 *   shots above the monthly quota → 402; simulation-seconds already used up → 402
 *   (paid plans are not refused: usage above quota is billed as overage);
 * - queued + running runs at the organisation's backlog cap → 429.
 *
 * The plan's `concurrentRuns` is enforced where runs execute (the worker
 * starts at most that many at once per organisation; the rest wait queued).
 */
import "server-only";
import { getPlan, isPaidPlan, plans, type Plan } from "@/lib/billing/plans";
import { ProblemError } from "@/lib/api/problem";
import { env } from "@/lib/env";
import { RUN_METHOD_LABELS } from "@/lib/runs/constants";
import type { QuotaVerdict } from "@/lib/runs/schemas";
import { currentPeriod } from "./period";
import { getQuotaFigures, type UnfinishedRuns, type UsageTotals } from "./queries";
import { formatNumber } from "@/lib/format";

export type RunDemand = { method: "statevector" | "density_matrix"; qubits: number; shots: number };

const fmt = (n: number) => formatNumber(n, 1);

function upgradeHint(plan: Plan, ok: (p: Plan) => boolean): string {
  const better = plans.find((p) => p.seatPriceCents > plan.seatPriceCents && ok(p));
  return better ? ` The ${better.name} plan allows it.` : "";
}

/** Pure evaluation of the limits (exported for tests and the preview). */
export function evaluateQuota(
  plan: Plan,
  demand: RunDemand,
  usage: UsageTotals,
  unfinished: UnfinishedRuns,
  period: string,
  maxUnfinished: number,
): QuotaVerdict {
  const refusals: QuotaVerdict["refusals"] = [];
  const maxQubits =
    demand.method === "density_matrix"
      ? plan.limits.maxDensityMatrixQubits
      : plan.limits.maxStatevectorQubits;
  if (demand.qubits > maxQubits) {
    const key =
      demand.method === "density_matrix" ? "maxDensityMatrixQubits" : "maxStatevectorQubits";
    refusals.push({
      limit: "max_qubits",
      status: 402,
      detail:
        `The ${plan.name} plan runs ${RUN_METHOD_LABELS[demand.method].toLowerCase()} circuits of up to ${maxQubits} qubits; this one has ${demand.qubits}.` +
        upgradeHint(plan, (p) => p.limits[key] >= demand.qubits),
    });
  }
  if (!isPaidPlan(plan)) {
    const quota = plan.limits.monthlyShots;
    const committed = usage.shots + unfinished.pendingShots;
    if (demand.shots > 0 && committed + demand.shots > quota) {
      refusals.push({
        limit: "monthly_shots",
        status: 402,
        detail:
          `The ${plan.name} plan includes ${fmt(quota)} shots a month; ${fmt(usage.shots)} are used in ${period}` +
          (unfinished.pendingShots > 0
            ? ` and ${fmt(unfinished.pendingShots)} are reserved by unfinished runs`
            : "") +
          `, so ${fmt(Math.max(0, quota - committed))} remain and this run needs ${fmt(demand.shots)}.` +
          upgradeHint(plan, () => true),
      });
    }
    const seconds = plan.limits.monthlySimulationSeconds;
    if (usage.simulationSeconds >= seconds) {
      refusals.push({
        limit: "monthly_simulation_seconds",
        status: 402,
        detail:
          `The ${plan.name} plan includes ${fmt(seconds)} simulation-seconds a month and ${fmt(usage.simulationSeconds)} are used in ${period}.` +
          upgradeHint(plan, () => true),
      });
    }
  }
  const unfinishedCount = unfinished.queued + unfinished.running;
  if (unfinishedCount >= maxUnfinished) {
    refusals.push({
      limit: "unfinished_runs",
      status: 429,
      detail: `Your organisation has ${unfinishedCount} runs queued or running (${unfinished.running} running); at most ${maxUnfinished} may wait at once. Wait for some to finish.`,
    });
  }
  return {
    allowed: refusals.length === 0,
    plan: { id: plan.id, name: plan.name },
    period,
    shots: demand.shots,
    refusals,
  };
}

/** Loads the organisation's usage and evaluates the limits for a run. */
export async function quotaVerdict(
  orgId: string,
  planId: string,
  demand: RunDemand,
): Promise<QuotaVerdict> {
  const period = currentPeriod();
  const plan = getPlan(planId);
  // Pending shots only matter where shots are a hard cap (plans without overage).
  const { usage, unfinished } = await getQuotaFigures(orgId, period, { shots: !isPaidPlan(plan) });
  return evaluateQuota(plan, demand, usage, unfinished, period, env.RUNS_MAX_UNFINISHED);
}

/** Throws the first refusal as a problem: 402 quota-exceeded, or 429 too-many-runs with Retry-After. */
export function assertAllowed(verdict: QuotaVerdict): void {
  const first = verdict.refusals.find((r) => r.status === 402) ?? verdict.refusals[0];
  if (!first) return;
  if (first.status === 402) {
    throw new ProblemError({
      type: "/problems/quota-exceeded",
      title: "Plan limit reached",
      status: 402,
      detail: first.detail,
    });
  }
  throw new ProblemError({
    type: "/problems/too-many-runs",
    title: "Too many unfinished runs",
    status: 429,
    detail: first.detail,
    retryAfter: 5,
  });
}

/** Builds the usage report of `GET /api/v1/usage` (and the usage page). */
import "server-only";
import { getPlan, isPaidPlan } from "@/lib/billing/plans";
import { env } from "@/lib/env";
import { currentPeriod } from "./period";
import { getUnfinishedRuns, getUsageTotals } from "./queries";
import type { UsageReport } from "./schemas";

export async function getUsageReport(orgId: string, planId: string): Promise<UsageReport> {
  const plan = getPlan(planId);
  const period = currentPeriod();
  const [usage, unfinished] = await Promise.all([
    getUsageTotals(orgId, period),
    getUnfinishedRuns(orgId),
  ]);
  const overage = isPaidPlan(plan);
  const meter = (used: number, pending: number, included: number) => ({
    used,
    pending,
    included,
    remaining: Math.max(0, included - used - pending),
    overage,
  });
  return {
    period,
    plan: { id: plan.id, name: plan.name },
    meters: {
      runs: { used: usage.runs },
      shots: meter(usage.shots, unfinished.pendingShots, plan.limits.monthlyShots),
      simulationSeconds: meter(usage.simulationSeconds, 0, plan.limits.monthlySimulationSeconds),
    },
    runs: {
      queued: unfinished.queued,
      running: unfinished.running,
      concurrentLimit: plan.limits.concurrentRuns,
      unfinishedLimit: env.RUNS_MAX_UNFINISHED,
    },
    limits: {
      maxStatevectorQubits: plan.limits.maxStatevectorQubits,
      maxDensityMatrixQubits: plan.limits.maxDensityMatrixQubits,
      maxRunSeconds: plan.limits.maxRunSeconds,
    },
  };
}

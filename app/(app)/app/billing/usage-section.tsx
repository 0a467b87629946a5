import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { Meter } from "@/components/ui/meter";
import type { Plan } from "@/lib/billing/plans";
import type { DailyUsage } from "@/lib/billing/queries";
import { UsageChart, type ChartPoint } from "./usage-chart";
import { formatCompact, formatFixed, formatIsoMonth } from "@/lib/format";

/** Cumulative series from the first of the period to `today` (UTC), one point per day. */
export function cumulative(
  daily: DailyUsage[],
  period: string,
  today: Date,
  pick: (d: DailyUsage) => number,
): ChartPoint[] {
  const byDay = new Map(daily.map((d) => [d.day, pick(d)]));
  const points: ChartPoint[] = [];
  const last =
    formatIsoMonth(today) === period
      ? today.getUTCDate()
      : new Date(Date.UTC(+period.slice(0, 4), +period.slice(5, 7), 0)).getUTCDate();
  let sum = 0;
  for (let d = 1; d <= last; d++) {
    const day = `${period}-${String(d).padStart(2, "0")}`;
    sum += byDay.get(day) ?? 0;
    points.push({ day, value: Math.round(sum * 100) / 100 });
  }
  return points;
}

export function UsageSection({
  plan,
  daily,
  period,
  title,
  description,
  showQuota,
}: {
  plan: Plan;
  daily: DailyUsage[];
  period: string;
  title: string;
  description: string;
  showQuota: boolean;
}) {
  const total = daily.reduce(
    (t, d) => ({
      runs: t.runs + d.runs,
      shots: t.shots + d.shots,
      seconds: t.seconds + d.simulationSeconds,
    }),
    { runs: 0, shots: 0, seconds: 0 },
  );
  const today = new Date();
  const billed = plan.overage ? "above it is billed as overage" : "Sandbox stops runs at the quota";
  return (
    <Card>
      <CardHeader title={title} description={description} eyebrow={`Period ${period} (UTC)`} />
      <CardBody className="grid gap-6">
        <div className="grid gap-5 md:grid-cols-3">
          <Meter
            label="Shots"
            used={total.shots}
            limit={showQuota ? plan.limits.monthlyShots : null}
            hint={showQuota ? `Included each month; ${billed}.` : undefined}
          />
          <Meter
            label="Simulation time"
            used={total.seconds}
            limit={showQuota ? plan.limits.monthlySimulationSeconds : null}
            unit="s"
            format={(n) => (n < 100 ? formatFixed(n, 1) : formatCompact(n))}
            hint={showQuota ? "Engine seconds, summed over runs." : undefined}
          />
          <Meter label="Runs" used={total.runs} limit={null} hint="Finished runs this period." />
        </div>
        <div className="grid gap-6 md:grid-cols-2">
          <UsageChart
            label="Shots, cumulative"
            unit="shots"
            points={cumulative(daily, period, today, (d) => d.shots)}
            included={showQuota ? plan.limits.monthlyShots : null}
          />
          <UsageChart
            label="Simulation seconds, cumulative"
            unit="s"
            points={cumulative(daily, period, today, (d) => d.simulationSeconds)}
            included={showQuota ? plan.limits.monthlySimulationSeconds : null}
          />
        </div>
      </CardBody>
    </Card>
  );
}

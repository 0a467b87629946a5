"use client";
/** This period's usage against the plan's quotas (GET /api/v1/usage), as meters. */
import Link from "next/link";
import { Alert } from "@/components/ui/alert";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { Meter } from "@/components/ui/meter";
import { Skeleton } from "@/components/ui/skeleton";
import { useUsage } from "@/lib/swr/use-usage";
import { formatCount, plural } from "@/lib/format";

export function UsageMeters() {
  const { data, error, isLoading } = useUsage();
  return (
    <Card>
      <CardHeader
        eyebrow="Usage this period"
        title={data ? `${data.plan.name} plan · ${data.period}` : "Usage"}
        actions={
          <Link
            href="/app/billing"
            className="text-[13px] font-medium text-accent-ink hover:underline"
          >
            Plan & billing
          </Link>
        }
      />
      <CardBody className="grid gap-4">
        {error ? (
          <Alert tone="error" compact role="alert">
            Usage could not be loaded: {error.message}
          </Alert>
        ) : isLoading || !data ? (
          <div className="grid gap-3" aria-busy="true" aria-label="Loading usage">
            <Skeleton className="h-9" />
            <Skeleton className="h-9" />
            <Skeleton className="h-9" />
          </div>
        ) : (
          <>
            <Meter
              label="Shots"
              used={data.meters.shots.used + data.meters.shots.pending}
              limit={data.meters.shots.included}
              hint={
                data.meters.shots.pending
                  ? `${formatCount(data.meters.shots.pending)} reserved by unfinished runs`
                  : data.meters.shots.overage
                    ? "Use above the quota is billed as overage."
                    : "A hard cap on this plan."
              }
            />
            <Meter
              label="Simulation time"
              unit="s"
              used={Math.round(data.meters.simulationSeconds.used)}
              limit={data.meters.simulationSeconds.included}
            />
            <Meter
              label="Runs in flight"
              used={data.runs.queued + data.runs.running}
              limit={data.runs.unfinishedLimit}
              hint={`${data.runs.running} running, ${data.runs.queued} queued; ${data.runs.concurrentLimit} run at once`}
            />
            <p className="figures text-xs text-ink-3">
              {plural(data.meters.runs.used, "run")} this period · up to{" "}
              {data.limits.maxStatevectorQubits} qubits statevector,{" "}
              {data.limits.maxDensityMatrixQubits} density matrix
            </p>
          </>
        )}
      </CardBody>
    </Card>
  );
}

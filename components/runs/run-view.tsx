"use client";
/**
 * The run page body: polls the run (SWR, every 0.8 s until it is terminal), shows its
 * progress, then the agreement panel, the sweep, the convergence and spectrum, the
 * per-term table, one histogram per setting, the reproduction snippets and downloads.
 */
import Link from "next/link";
import { useState } from "react";
import { ConvergenceChart } from "@/components/charts/convergence-chart";
import { HistogramChart } from "@/components/charts/histogram-chart";
import { Alert, SimulationCaution } from "@/components/ui/alert";
import { Button, buttonClasses } from "@/components/ui/button";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { StatusBadge } from "@/components/ui/badge";
import { IconStop } from "@/components/ui/icons";
import { fileStem } from "@/lib/export/run-export";
import { isApiError } from "@/lib/swr/api-client";
import { canWrite, useWorkspaceOrg } from "@/lib/swr/org-context";
import { cancelRun } from "@/lib/swr/run-mutations";
import type { Run } from "@/lib/swr/types";
import { useRun } from "@/lib/swr/use-run";
import { RUN_METHOD_LABELS } from "@/lib/runs/constants";
import { AgreementPanel } from "./agreement-panel";
import { PauliDecompositionList } from "./pauli-decomposition-list";
import { ReproduceCard } from "./reproduce-card";
import { RunDownloads } from "./run-downloads";
import { shotsText } from "./run-meta";
import { RunFailure, RunProgress } from "./run-status-card";
import { SpectrumCard } from "./spectrum-card";
import { GradientCard } from "./gradient-card";
import { SweepCard } from "./sweep-card";
import { TermsTable } from "./terms-table";
import { formatDateTime, formatDuration, formatSignificant, plural } from "@/lib/format";

function Facts({ run }: { run: Run }) {
  const items: [string, React.ReactNode][] = [
    ["Method", RUN_METHOD_LABELS[run.method]],
    ["Qubits", run.qubits],
    ["Shots", shotsText(run).long],
    [
      "Seed",
      <span key="s" className="figures">
        {run.seed}
      </span>,
    ],
    ["Queued", formatDateTime(run.queuedAt)],
    ...(run.timings.runMs !== null
      ? ([["Took", formatDuration(run.timings.runMs)]] as [string, React.ReactNode][])
      : []),
  ];
  return (
    <dl className="flex flex-wrap gap-x-6 gap-y-2 text-[13px]">
      {items.map(([k, v]) => (
        <div key={k} className="flex gap-1.5">
          <dt className="text-ink-3">{k}</dt>
          <dd className="figures text-ink">{v}</dd>
        </div>
      ))}
    </dl>
  );
}

export function RunView({ id, initial }: { id: string; initial: Run }) {
  const { orgId, role } = useWorkspaceOrg();
  const { data, error, mutate } = useRun(id, initial);
  const run = data ?? initial;
  const [cancelling, setCancelling] = useState(false);
  const [cancelError, setCancelError] = useState<string | null>(null);
  const result = run.status === "succeeded" ? run.result : null;
  const hasNoise = !!run.request.noise && Object.keys(run.request.noise).length > 0;
  const active = run.status === "queued" || run.status === "running";
  const stem = fileStem(run.name, run.id);
  const sweepNames = result?.sweep?.parameters ?? [];
  // the point the top-level figures describe: the lowest exact value (point 0 on older runs)
  const topIndex = result?.sweep?.topLevel?.index ?? 0;
  const topPoint = result?.sweep?.points[topIndex];
  const pointLabel = topPoint
    ? sweepNames.map((n) => `${n} = ${formatSignificant(topPoint.params[n], 4)}`).join(", ") +
      (result?.sweep?.topLevel ? " (lowest exact value)" : "")
    : null;

  const cancel = async () => {
    setCancelling(true);
    setCancelError(null);
    try {
      await mutate(await cancelRun(orgId, run.id), { revalidate: false });
    } catch (e) {
      setCancelError(isApiError(e) ? e.message : "Could not cancel the run.");
    } finally {
      setCancelling(false);
    }
  };

  return (
    <div className="grid gap-5">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <div className="flex flex-wrap items-center gap-3">
          <StatusBadge status={run.status} />
          <Facts run={run} />
        </div>
        <div className="flex flex-wrap gap-2">
          {active && canWrite(role) ? (
            <Button
              variant="secondary"
              size="sm"
              icon={<IconStop />}
              loading={cancelling}
              onClick={cancel}
            >
              Cancel run
            </Button>
          ) : null}
          <Link
            className={buttonClasses({ variant: "secondary", size: "sm" })}
            href={`/app/runs/new?from=${run.id}`}
          >
            Run again with changes
          </Link>
          {result ? (
            <Link
              className={buttonClasses({ variant: "ghost", size: "sm" })}
              href={`/app/compare?ids=${run.id}`}
            >
              Compare
            </Link>
          ) : null}
        </div>
      </div>
      {cancelError ? (
        <Alert tone="error" compact role="alert">
          {cancelError}
        </Alert>
      ) : null}
      {error && !isApiError(error) ? null : error ? (
        <Alert tone="warning" compact role="status">
          Lost contact with the server ({error.message}); retrying.
        </Alert>
      ) : null}

      {active ? <RunProgress run={run} /> : null}
      {run.status === "failed" || run.status === "canceled" ? <RunFailure run={run} /> : null}

      {result ? (
        <>
          {/* A sweep's landscape comes first; the panels below describe its lowest point (sweep.topLevel). */}
          {result.sweep && (result.sweep.points.length > 1 || result.sweep.kind === "points") ? (
            <SweepCard sweep={result.sweep} noisy={hasNoise} fileStem={stem} />
          ) : null}
          <AgreementPanel request={run.request} result={result} pointLabel={pointLabel} />
          {result.gradient ? (
            <GradientCard
              gradient={result.gradient}
              shots={result.gradientShots}
              noisy={hasNoise}
              pointLabel={pointLabel}
            />
          ) : null}
          <div className="grid gap-5 xl:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
            {result.sampled && result.sampled.convergence.length > 1 ? (
              <Card>
                <CardHeader
                  eyebrow="Convergence"
                  title="Running estimate against shots"
                  description="Each point uses the first shots of every setting; the band shrinks as 1/√N."
                />
                <CardBody>
                  <ConvergenceChart
                    points={result.sampled.convergence}
                    exact={result.exact.value}
                  />
                </CardBody>
              </Card>
            ) : null}
            <SpectrumCard result={result} hasNoise={hasNoise} />
          </div>
          {result.pauliDecomposition ? (
            <Card>
              <CardHeader
                eyebrow="Observable"
                title="How the matrix was read"
                description="Coefficients Tr(P·A)/2ⁿ, largest first; words read qubit 0 first."
              />
              <CardBody>
                <PauliDecompositionList decomposition={result.pauliDecomposition} limit={24} />
              </CardBody>
            </Card>
          ) : null}
          <Card>
            <CardHeader
              eyebrow="Terms"
              title={`${plural(result.terms.length, "Pauli term")} in ${plural(result.groups.length, "setting")}`}
              description="Words read qubit 0 first. Click a column heading to sort."
            />
            <CardBody>
              <TermsTable result={result} />
            </CardBody>
          </Card>
          {result.groups.some((g) => g.counts && Object.keys(g.counts).length) ? (
            <Card>
              <CardHeader
                eyebrow="Histograms"
                title="Outcomes per measurement setting"
                description="Bitstrings read qubit 0 first; unmeasured qubits (I) read 0."
              />
              <CardBody className="grid gap-6 md:grid-cols-2">
                {result.groups.map((g, i) =>
                  g.counts && Object.keys(g.counts).length ? (
                    <HistogramChart key={i} bases={g.bases} counts={g.counts} shots={g.shots} />
                  ) : null,
                )}
              </CardBody>
            </Card>
          ) : null}
          <div className="grid gap-5 xl:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
            <ReproduceCard run={run} />
            <Card>
              <CardHeader eyebrow="Downloads" title="Take the numbers with you" />
              <CardBody className="grid gap-4">
                <RunDownloads run={run} />
                <dl className="grid grid-cols-2 gap-x-4 gap-y-1 text-xs">
                  <dt className="text-ink-3">Parse</dt>
                  <dd className="figures text-ink-2">{formatDuration(result.timings.parseMs)}</dd>
                  <dt className="text-ink-3">Simulate</dt>
                  <dd className="figures text-ink-2">
                    {formatDuration(result.timings.simulateMs)}
                  </dd>
                  <dt className="text-ink-3">Sample</dt>
                  <dd className="figures text-ink-2">{formatDuration(result.timings.sampleMs)}</dd>
                  <dt className="text-ink-3">Queue wait</dt>
                  <dd className="figures text-ink-2">{formatDuration(run.timings.queueMs)}</dd>
                </dl>
              </CardBody>
            </Card>
          </div>
        </>
      ) : null}
      <SimulationCaution variant={result ? "inline" : "callout"} />
    </div>
  );
}

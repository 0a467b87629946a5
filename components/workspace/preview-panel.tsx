"use client";
/**
 * The live preview beside the new-run form: what the run will be (qubits, gates, depth),
 * how it will be measured (settings), how many shots it will draw and whether the plan
 * accepts it now. Updated as the user types; the last good answer stays visible (dimmed)
 * while the next one is computed or while the draft has errors.
 */
import { Alert } from "@/components/ui/alert";
import { Badge } from "@/components/ui/badge";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { cn } from "@/components/ui/cn";
import { IconError, IconSuccess } from "@/components/ui/icons";
import { Skeleton } from "@/components/ui/skeleton";
import { Spinner } from "@/components/ui/spinner";
import type { ApiError } from "@/lib/swr/api-client";
import type { Preview } from "@/lib/swr/types";
import { PauliDecompositionList } from "@/components/runs/pauli-decomposition-list";
import { formatCount, plural } from "@/lib/format";

function Stat({ label, value }: { label: string; value: React.ReactNode }) {
  return (
    <div className="grid gap-0.5 rounded-md border border-line bg-surface-2/50 px-3 py-2">
      <dt className="text-2xs font-semibold tracking-[0.06em] text-ink-3 uppercase">{label}</dt>
      <dd className="figures text-lg leading-6 text-ink">{value}</dd>
    </div>
  );
}

function Status({
  pending,
  error,
  preview,
}: {
  pending: boolean;
  error?: ApiError;
  preview?: Preview;
}) {
  if (pending)
    return (
      <span className="inline-flex items-center gap-1.5 text-xs text-ink-2">
        <Spinner className="size-3.5" /> Checking…
      </span>
    );
  if (error)
    return (
      <span className="inline-flex items-center gap-1.5 text-xs font-medium text-danger">
        <IconError className="size-3.5" />{" "}
        {error.errors.length > 1 ? `${error.errors.length} problems` : "Needs a fix"}
      </span>
    );
  if (preview && !preview.quota.allowed)
    return (
      <span className="inline-flex items-center gap-1.5 text-xs font-medium text-warn">
        <IconError className="size-3.5" /> Over a plan limit
      </span>
    );
  if (preview)
    return (
      <span className="inline-flex items-center gap-1.5 text-xs font-medium text-ok">
        <IconSuccess className="size-3.5" /> Ready to run
      </span>
    );
  return null;
}

/** Plain names of the form fields a local issue can point at. */
function fieldLabel(path: string): string {
  if (path === "shots") return "Total shots";
  if (path === "targetPrecision") return "Target standard error";
  if (path === "seed") return "Seed";
  if (path === "mitigateReadout") return "Readout mitigation";
  if (path === "observable.matrixText") return "Observable matrix";
  if (path.startsWith("parameters.")) return `Parameter ${path.slice(11)}`;
  if (path.startsWith("sweepAxes.")) return `Sweep ${path.split(".")[2] ?? ""}`.trim();
  if (path.startsWith("noise.")) return `Noise: ${path.split(".").pop()}`;
  return path;
}

export function PreviewPanel({
  preview,
  error,
  pending,
  localIssues = [],
}: {
  preview?: Preview;
  error?: ApiError;
  pending: boolean;
  /** Problems found in the form before asking the server (a field that is not a number…). */
  localIssues?: { path: string; message: string }[];
}) {
  if (localIssues.length) {
    return (
      <Card aria-labelledby="preview-title">
        <CardHeader
          title={<span id="preview-title">Preview</span>}
          actions={
            <span className="inline-flex items-center gap-1.5 text-xs font-medium text-danger">
              <IconError className="size-3.5" /> Needs a fix
            </span>
          }
        />
        <CardBody aria-live="polite">
          <ul className="grid gap-1 text-[13px] leading-5 text-ink-2">
            {localIssues.map((i) => (
              <li key={i.path}>
                <span className="font-medium text-ink">{fieldLabel(i.path)}</span>: {i.message}
              </li>
            ))}
          </ul>
        </CardBody>
      </Card>
    );
  }
  const stale = pending || !!error;
  const gates = preview ? Object.entries(preview.gateCounts).sort((a, b) => b[1] - a[1]) : [];
  const totalShots = preview ? preview.totalShots : 0;
  return (
    <Card aria-labelledby="preview-title">
      <CardHeader
        title={<span id="preview-title">Preview</span>}
        actions={<Status pending={pending} error={error} preview={preview} />}
      />
      <CardBody className="grid gap-4" aria-live="polite" aria-busy={pending}>
        {error && error.status !== 400 && error.status !== 422 ? (
          <Alert tone="error" compact role="alert" title={error.title}>
            {error.message}
          </Alert>
        ) : error ? (
          <p className="text-[13px] leading-5 text-ink-2">
            Fix the marked problems to see the run’s figures. Your draft is kept.
          </p>
        ) : null}
        {!preview ? (
          error ? null : (
            <div className="grid grid-cols-2 gap-2" aria-label="Loading the preview">
              <Skeleton className="h-14" />
              <Skeleton className="h-14" />
              <Skeleton className="h-14" />
              <Skeleton className="h-14" />
            </div>
          )
        ) : (
          <div className={cn("grid gap-4 transition-opacity", stale && "opacity-55")}>
            <dl className="grid grid-cols-2 gap-2">
              <Stat label="Qubits" value={preview.qubits} />
              <Stat label="Depth" value={preview.depth} />
              <Stat label="Gates" value={formatCount(preview.totalGates)} />
              <Stat label="2-qubit gates" value={formatCount(preview.twoQubitGates)} />
            </dl>
            {gates.length ? (
              <div className="flex flex-wrap gap-1" aria-label="Gate counts">
                {gates.slice(0, 14).map(([name, n]) => (
                  <Badge key={name} className="figures">
                    {name} ×{n}
                  </Badge>
                ))}
                {gates.length > 14 ? <Badge>+{gates.length - 14} more</Badge> : null}
              </div>
            ) : null}
            <section className="grid gap-2" aria-label="Measurement settings">
              <h3 className="text-2xs font-semibold tracking-[0.06em] text-ink-3 uppercase">
                Measurement settings · {preview.observable.settings}
              </h3>
              <ul className="grid max-h-44 gap-1 overflow-y-auto pr-1">
                {preview.groups.map((g, i) => (
                  <li key={i} className="flex items-center justify-between gap-3 text-[12.5px]">
                    <span className="font-mono tracking-[0.12em] text-ink">{g.bases}</span>
                    <span className="figures text-ink-3">
                      {plural(g.terms.length, "term")}
                      {preview.shotsPerSetting
                        ? ` · ${formatCount(preview.shotsPerSetting[i] ?? 0)} shots`
                        : ""}
                    </span>
                  </li>
                ))}
              </ul>
            </section>
            {preview.pauliDecomposition ? (
              <PauliDecompositionList decomposition={preview.pauliDecomposition} />
            ) : null}
            <section
              className="grid gap-1.5 rounded-md border border-line px-3 py-2.5 text-[13px]"
              aria-label="Shot plan and cost"
            >
              <div className="flex justify-between gap-3">
                <span className="text-ink-2">Shots per point</span>
                <span className="figures text-ink">
                  {preview.shots ? formatCount(preview.shots) : "exact only"}
                </span>
              </div>
              {preview.sweepPoints > 1 ? (
                <div className="flex justify-between gap-3">
                  <span className="text-ink-2">Parameter points</span>
                  <span className="figures text-ink">{formatCount(preview.sweepPoints)}</span>
                </div>
              ) : null}
              {preview.gradient && preview.gradient.shiftedCircuits > 0 ? (
                <div className="flex justify-between gap-3" data-testid="preview-gradient-shots">
                  <span className="text-ink-2">
                    Gradient: {preview.gradient.shiftedCircuits} shifted circuits per point
                  </span>
                  <span className="figures text-ink">
                    +{formatCount(preview.gradient.shotsPerPoint)} shots
                  </span>
                </div>
              ) : preview.gradient ? (
                <div className="flex justify-between gap-3">
                  <span className="text-ink-2">Gradient</span>
                  <span className="text-ink">exact only</span>
                </div>
              ) : null}
              {preview.shotPlan && preview.varianceSource === "state_aware" ? (
                <p className="text-xs leading-5 text-ink-3">
                  For a standard error of {preview.shotPlan.targetPrecision}: planned from the
                  state’s exact variances — the shots the run will draw (any state could need up to{" "}
                  <span className="figures">
                    {formatCount(preview.shotPlan.worstCase.totalShots)}
                  </span>
                  ).
                </p>
              ) : preview.shotPlan ? (
                <p className="text-xs leading-5 text-ink-3">
                  For a standard error of {preview.shotPlan.targetPrecision}: at most{" "}
                  <span className="figures">
                    {formatCount(preview.shotPlan.worstCase.totalShots)}
                  </span>{" "}
                  shots for any state (the state is too large to simulate for the plan); the run
                  plans from the state’s own variances, usually fewer, and is billed for the shots
                  it draws.
                </p>
              ) : null}
              <div className="mt-1 flex justify-between gap-3 border-t border-line pt-1.5">
                <span className="text-ink-2">Counts against {preview.quota.plan.name}</span>
                <span className="figures font-medium text-ink">
                  {formatCount(preview.quota.shots ?? totalShots)} shots
                </span>
              </div>
            </section>
            {preview.quota.refusals.length ? (
              <Alert tone="warning" compact title="The plan would refuse this run now">
                <ul className="grid gap-1">
                  {preview.quota.refusals.map((r) => (
                    <li key={r.limit}>{r.detail}</li>
                  ))}
                </ul>
              </Alert>
            ) : null}
            {preview.notes.length ? (
              <ul className="grid gap-1 text-xs leading-5 text-ink-2">
                {preview.notes.map((n, i) => (
                  <li key={i}>· {n}</li>
                ))}
              </ul>
            ) : null}
          </div>
        )}
      </CardBody>
    </Card>
  );
}

"use client";
/**
 * Compare 2–6 runs: their figures in one table (values in concise notation, the verdict of
 * each, the difference of each exact value from the first run's) and on one shared number
 * line. Runs are chosen in the runs list or added here from the recent finished runs;
 * the selection lives in the URL (?ids=a,b,c).
 */
import Link from "next/link";
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { useState } from "react";
import { CompareChart, type CompareRow } from "@/components/charts/compare-chart";
import { LegendKey, colors } from "@/components/charts/chart-frame";
import { Alert, SimulationCaution } from "@/components/ui/alert";
import { Badge, StatusBadge } from "@/components/ui/badge";
import { Button, buttonClasses } from "@/components/ui/button";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { Dialog } from "@/components/ui/dialog";
import { EmptyState } from "@/components/ui/empty-state";
import { Skeleton } from "@/components/ui/skeleton";
import { Table, TBody, TD, TH, THead, TR } from "@/components/ui/table";
import { Value } from "@/components/ui/value";
import { useRuns } from "@/lib/swr/use-runs";
import { useRunsById } from "@/lib/swr/use-runs-by-id";
import type { Run } from "@/lib/swr/types";
import { RUN_METHOD_LABELS } from "@/lib/runs/constants";
import { formatAgo } from "./run-meta";
import { agreementVerdict, pickComparison } from "./verdict";

export const MAX_COMPARE = 6;

function noiseSummary(run: Run): string {
  const n = run.request.noise;
  if (!n || !Object.keys(n).length) return "none";
  const parts: string[] = [];
  if (n.depolarizing1q) parts.push(`p₁ ${n.depolarizing1q}`);
  if (n.depolarizing2q) parts.push(`p₂ ${n.depolarizing2q}`);
  if (n.amplitudeDamping) parts.push(`γ ${n.amplitudeDamping}`);
  if (n.phaseDamping) parts.push(`λ ${n.phaseDamping}`);
  if (n.readout?.p1Given0 || n.readout?.p0Given1)
    parts.push(`readout ${n.readout.p1Given0 ?? 0}/${n.readout.p0Given1 ?? 0}`);
  return parts.join(", ");
}

function verdictOf(run: Run) {
  const r = run.result!;
  const choice = pickComparison({
    readout: run.request.noise?.readout,
    hasMitigated: !!r.mitigated,
  });
  return agreementVerdict(
    choice.basis === "mitigated" && r.mitigated ? r.mitigated : r.sampled,
    r.exact.value,
  );
}

function AddRunsDialog({
  open,
  onClose,
  current,
  onAdd,
}: {
  open: boolean;
  onClose: () => void;
  current: string[];
  onAdd: (ids: string[]) => void;
}) {
  const { data, isLoading } = useRuns({ status: "succeeded", limit: 50 });
  const [picked, setPicked] = useState<string[]>([]);
  const room = MAX_COMPARE - current.length;
  const rows = (data?.data ?? []).filter((r) => !current.includes(r.id));
  return (
    <Dialog
      open={open}
      onClose={onClose}
      title="Add runs to compare"
      description={`Recent finished runs. Up to ${MAX_COMPARE} side by side (${room} more).`}
      size="lg"
      footer={
        <>
          <Button variant="ghost" onClick={onClose}>
            Cancel
          </Button>
          <Button disabled={!picked.length} onClick={() => onAdd(picked)}>
            Add {picked.length || ""}
          </Button>
        </>
      }
    >
      {isLoading && !data ? (
        <Skeleton className="h-40" />
      ) : rows.length ? (
        <ul className="grid max-h-[50vh] gap-1 overflow-y-auto">
          {rows.map((r) => {
            const on = picked.includes(r.id);
            return (
              <li key={r.id}>
                <label className="flex cursor-pointer items-center gap-3 rounded-md border border-line px-3 py-2 hover:bg-surface-2 has-[:checked]:border-accent/50 has-[:checked]:bg-accent-soft/40">
                  <input
                    type="checkbox"
                    className="size-4 accent-accent"
                    checked={on}
                    disabled={!on && picked.length >= room}
                    onChange={() =>
                      setPicked((p) => (on ? p.filter((x) => x !== r.id) : [...p, r.id]))
                    }
                  />
                  <span className="min-w-0 flex-1 truncate text-sm text-ink">{r.name}</span>
                  <span className="figures text-xs text-ink-3">{formatAgo(r.queuedAt)}</span>
                </label>
              </li>
            );
          })}
        </ul>
      ) : (
        <p className="text-[13px] text-ink-2">No other finished runs yet.</p>
      )}
    </Dialog>
  );
}

export function CompareView() {
  const router = useRouter();
  const pathname = usePathname();
  const params = useSearchParams();
  const ids = (params.get("ids") ?? "").split(",").filter(Boolean).slice(0, MAX_COMPARE);
  const { data, error, isLoading } = useRunsById(ids);
  const [adding, setAdding] = useState(false);
  const setIds = (next: string[]) =>
    router.replace(next.length ? `${pathname}?ids=${next.join(",")}` : pathname, { scroll: false });

  const runs = data?.runs ?? [];
  const finished = runs.filter((r) => r.status === "succeeded" && r.result);
  const first = finished[0];
  const chartRows: CompareRow[] = finished.map((r) => ({
    id: r.id,
    label: r.name,
    exact: r.result!.exact.value,
    ideal: r.result!.ideal.value,
    sampled: r.result!.sampled
      ? { mean: r.result!.sampled.mean, ci95: r.result!.sampled.ci95 }
      : null,
    mitigated: r.result!.mitigated
      ? { mean: r.result!.mitigated.mean, ci95: r.result!.mitigated.ci95 }
      : null,
  }));

  return (
    <div className="grid gap-5">
      <div className="flex flex-wrap items-center gap-2">
        <Button
          variant="secondary"
          disabled={ids.length >= MAX_COMPARE}
          onClick={() => setAdding(true)}
        >
          Add runs
        </Button>
        <span className="text-[13px] text-ink-2">
          {ids.length} of at most {MAX_COMPARE} selected
        </span>
      </div>
      {adding ? (
        <AddRunsDialog
          open
          onClose={() => setAdding(false)}
          current={ids}
          onAdd={(more) => {
            setIds([...ids, ...more].slice(0, MAX_COMPARE));
            setAdding(false);
          }}
        />
      ) : null}
      {error ? (
        <Alert tone="error" role="alert">
          {error.message}
        </Alert>
      ) : null}
      {data?.missing.length ? (
        <Alert tone="warning" compact>
          {data.missing.length} run{data.missing.length === 1 ? " was" : "s were"} not found in this
          organisation and {data.missing.length === 1 ? "is" : "are"} left out.
        </Alert>
      ) : null}
      {ids.length === 0 ? (
        <EmptyState
          title="Pick runs to compare"
          description="Select two to six finished runs in the runs list, or add them here."
          action={
            <Link
              href="/app/runs?status=succeeded"
              className={buttonClasses({ variant: "secondary" })}
            >
              Open the runs list
            </Link>
          }
        />
      ) : isLoading && !data ? (
        <Skeleton className="h-72" />
      ) : (
        <>
          {finished.length >= 1 ? (
            <Card>
              <CardHeader
                eyebrow="Compare"
                title="On one number line"
                actions={
                  <div className="flex flex-wrap gap-3 text-xs text-ink-2">
                    <LegendKey color={colors.exact} label="exact" />
                    <LegendKey color={colors.ideal} kind="dash" label="ideal (if noise)" />
                    <LegendKey color={colors.sampled} kind="band" label="sampled 95 %" />
                    <LegendKey color={colors.mitigated} kind="band" label="mitigated 95 %" />
                  </div>
                }
              />
              <CardBody>
                <CompareChart rows={chartRows} />
              </CardBody>
            </Card>
          ) : null}
          <Table aria-label="Runs compared">
            <THead>
              <TR>
                <TH>Run</TH>
                <TH>Method · noise</TH>
                <TH numeric>Shots</TH>
                <TH numeric>Ideal</TH>
                <TH numeric>Exact</TH>
                <TH numeric>Sampled</TH>
                <TH numeric>Mitigated</TH>
                <TH>Verdict</TH>
                <TH numeric>Δ exact vs first</TH>
                <TH>
                  <span className="sr-only">Remove</span>
                </TH>
              </TR>
            </THead>
            <TBody>
              {runs.map((r) => {
                const res = r.status === "succeeded" ? r.result : null;
                const v = res ? verdictOf(r) : null;
                return (
                  <TR key={r.id}>
                    <TD className="max-w-[16rem]">
                      <Link
                        href={`/app/runs/${r.id}`}
                        className="block truncate font-medium text-ink hover:underline"
                      >
                        {r.name}
                      </Link>
                      {!res ? <StatusBadge status={r.status} /> : null}
                    </TD>
                    <TD className="text-[12.5px] text-ink-2">
                      {RUN_METHOD_LABELS[r.method]} · {noiseSummary(r)}
                    </TD>
                    <TD numeric>{r.shots ? r.shots.toLocaleString("en-US") : "exact"}</TD>
                    <TD numeric>
                      {res ? <Value value={res.ideal.value} size="sm" tone="exact" /> : "—"}
                    </TD>
                    <TD numeric>
                      {res ? (
                        <Value
                          value={res.exact.value}
                          size="sm"
                          tone={
                            r.request.noise && Object.keys(r.request.noise).length
                              ? "noisy"
                              : "exact"
                          }
                        />
                      ) : (
                        "—"
                      )}
                    </TD>
                    <TD numeric>
                      {res?.sampled ? (
                        <Value
                          value={res.sampled.mean}
                          uncertainty={res.sampled.stdErr}
                          size="sm"
                          tone="sampled"
                        />
                      ) : (
                        "—"
                      )}
                    </TD>
                    <TD numeric>
                      {res?.mitigated ? (
                        <Value
                          value={res.mitigated.mean}
                          uncertainty={res.mitigated.stdErr}
                          size="sm"
                          tone="mitigated"
                        />
                      ) : (
                        "—"
                      )}
                    </TD>
                    <TD>
                      {v ? (
                        <Badge
                          tone={
                            v.kind === "suspicious"
                              ? "danger"
                              : v.kind === "unavailable"
                                ? "neutral"
                                : "ok"
                          }
                        >
                          {v.kind === "unavailable" ? "exact only" : v.kind}
                          {v.z !== null ? ` · z ${v.z.toFixed(1).replace("-", "−")}` : ""}
                        </Badge>
                      ) : null}
                    </TD>
                    <TD numeric>
                      {res && first ? (
                        <Value value={res.exact.value - first.result!.exact.value} size="sm" />
                      ) : (
                        "—"
                      )}
                    </TD>
                    <TD>
                      <Button
                        variant="ghost"
                        size="sm"
                        aria-label={`Remove ${r.name} from the comparison`}
                        onClick={() => setIds(ids.filter((x) => x !== r.id))}
                      >
                        Remove
                      </Button>
                    </TD>
                  </TR>
                );
              })}
            </TBody>
          </Table>
          {ids.length === 1 ? (
            <p className="text-[13px] text-ink-2">Add at least one more run to compare.</p>
          ) : null}
        </>
      )}
      <SimulationCaution variant="inline" />
    </div>
  );
}

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
import { Alert, SimulationCaution } from "@/components/ui/alert";
import { Button, buttonClasses } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { Skeleton } from "@/components/ui/skeleton";
import { MAX_COMPARE } from "@/lib/runs/constants";
import { useRunsById } from "@/lib/swr/use-runs-by-id";
import { AddRunsDialog } from "./add-runs-dialog";
import { CompareChartCard } from "./compare-chart-card";
import { compareChartRows } from "./compare-figures";
import { CompareTable } from "./compare-table";
import { plural, pluralWord } from "@/lib/format";

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
          {plural(data.missing.length, "run was", "runs were")} not found in this organisation and{" "}
          {pluralWord(data.missing.length, "is", "are")} left out.
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
          {finished.length >= 1 ? <CompareChartCard rows={compareChartRows(finished)} /> : null}
          <CompareTable
            runs={runs}
            first={first}
            onRemove={(id) => setIds(ids.filter((x) => x !== id))}
          />
          {ids.length === 1 ? (
            <p className="text-[13px] text-ink-2">Add at least one more run to compare.</p>
          ) : null}
        </>
      )}
      <SimulationCaution variant="inline" />
    </div>
  );
}

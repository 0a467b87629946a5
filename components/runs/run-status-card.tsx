"use client";
/** Progress of a queued or running run, and what a failed or canceled run left behind. */
import Link from "next/link";
import { useEffect, useState } from "react";
import { Alert } from "@/components/ui/alert";
import { buttonClasses } from "@/components/ui/button";
import { Card, CardBody } from "@/components/ui/card";
import { ProgressBar } from "@/components/ui/progress-bar";
import { Skeleton } from "@/components/ui/skeleton";
import type { Run } from "@/lib/swr/types";
import { formatDuration } from "@/lib/format";

const PHASES: Record<string, string> = {
  parse: "Reading the circuit and the observable",
  simulate: "Simulating the state",
  sample: "Drawing shots",
  spectrum: "Computing the exact spectrum",
  done: "Writing the result",
};

function useNow(active: boolean) {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    if (!active) return;
    const t = setInterval(() => setNow(Date.now()), 500);
    return () => clearInterval(t);
  }, [active]);
  return now;
}

export function RunProgress({ run }: { run: Run }) {
  const active = run.status === "queued" || run.status === "running";
  const now = useNow(active);
  const since = run.status === "running" && run.startedAt ? run.startedAt : run.queuedAt;
  const label =
    run.status === "queued"
      ? "Waiting for a worker"
      : (PHASES[run.phase ?? ""] ?? run.phase ?? "Running");
  return (
    <Card>
      <CardBody className="grid gap-4 pt-5">
        <ProgressBar
          value={run.status === "queued" ? null : run.progress}
          label={run.status === "queued" ? "Queued" : `${label}`}
          showValue
          tone="info"
        />
        <p className="figures text-xs text-ink-3" aria-live="off">
          {run.status === "queued" ? "queued" : "running"} for{" "}
          {formatDuration(now - new Date(since).getTime())}
        </p>
        <div className="grid gap-3 sm:grid-cols-4" aria-hidden>
          <Skeleton className="h-20" />
          <Skeleton className="h-20" />
          <Skeleton className="h-20" />
          <Skeleton className="h-20" />
          <Skeleton className="h-28 sm:col-span-4" />
        </div>
      </CardBody>
    </Card>
  );
}

export function RunFailure({ run }: { run: Run }) {
  const e = run.error;
  if (run.status === "canceled") {
    return (
      <Alert
        tone="neutral"
        title="Canceled"
        actions={
          <Link
            className={buttonClasses({ variant: "secondary", size: "sm" })}
            href={`/app/runs/new?from=${run.id}`}
          >
            Run again
          </Link>
        }
      >
        {e?.detail ?? "The run was canceled before it finished."}
      </Alert>
    );
  }
  return (
    <Alert
      tone="error"
      role="alert"
      title={e?.title ?? "The run failed"}
      actions={
        <Link
          className={buttonClasses({ variant: "secondary", size: "sm" })}
          href={`/app/runs/new?from=${run.id}`}
        >
          Edit this run and submit again
        </Link>
      }
    >
      <p>{e?.detail ?? "No details were recorded."}</p>
      {e?.errors?.length ? (
        <ul className="mt-1.5 grid gap-0.5 text-[13px]">
          {e.errors.map((x, i) => (
            <li key={i}>
              <span className="font-mono text-xs">{x.path}</span>
              {x.line ? (
                <span className="figures text-xs">
                  {" "}
                  (line {x.line}
                  {x.column ? `:${x.column}` : ""})
                </span>
              ) : null}
              : {x.message}
            </li>
          ))}
        </ul>
      ) : null}
    </Alert>
  );
}

"use client";
/** The latest runs of the organisation (refreshing while any is unfinished). */
import Link from "next/link";
import { Alert } from "@/components/ui/alert";
import { StatusBadge } from "@/components/ui/badge";
import { buttonClasses } from "@/components/ui/button";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { Skeleton } from "@/components/ui/skeleton";
import { RunValueCell } from "@/components/runs/run-value-cell";
import { RelativeTime } from "@/components/ui/relative-time";
import { submitterName, useWorkspaceOrg } from "@/lib/swr/org-context";
import { useRuns } from "@/lib/swr/use-runs";

export function RecentRuns() {
  const { members } = useWorkspaceOrg();
  const { data, error, isLoading } = useRuns({ limit: 6 });
  const rows = data?.data ?? [];
  return (
    <Card>
      <CardHeader
        eyebrow="Recent runs"
        title="Latest in this organisation"
        actions={
          <Link
            href="/app/runs"
            className="text-[13px] font-medium text-accent-ink hover:underline"
          >
            All runs
          </Link>
        }
      />
      <CardBody>
        {error ? (
          <Alert tone="error" compact role="alert">
            {error.message}
          </Alert>
        ) : isLoading && !data ? (
          <div className="grid gap-2" aria-busy="true" aria-label="Loading runs">
            {Array.from({ length: 4 }, (_, i) => (
              <Skeleton key={i} className="h-10" />
            ))}
          </div>
        ) : rows.length === 0 ? (
          <EmptyState
            title="No runs yet"
            description="Start from the quick start beside this, or compose your own."
            action={
              <Link className={buttonClasses({ size: "sm" })} href="/app/runs/new">
                New run
              </Link>
            }
          />
        ) : (
          <ul className="divide-y divide-line">
            {rows.map((r) => (
              <li key={r.id} className="flex items-center gap-3 py-2.5">
                <div className="grid min-w-0 flex-1 gap-0.5">
                  <Link
                    href={`/app/runs/${r.id}`}
                    className="truncate text-sm font-medium text-ink hover:text-accent-ink hover:underline"
                  >
                    {r.name}
                  </Link>
                  <span className="text-xs text-ink-3">
                    {submitterName(members, r.createdBy)} · <RelativeTime date={r.queuedAt} />
                  </span>
                </div>
                <RunValueCell run={r} />
                <StatusBadge status={r.status} className="shrink-0" />
              </li>
            ))}
          </ul>
        )}
      </CardBody>
    </Card>
  );
}

"use client";
/**
 * The runs list: filters kept in the URL, cursor pagination (Previous / Next), a table that
 * refreshes while runs are unfinished, and bulk actions on the selection — cancel the
 * queued or running ones, or compare 2–6 finished ones.
 */
import Link from "next/link";
import { usePathname, useSearchParams } from "next/navigation";
import { useCallback, useMemo, useState } from "react";
import { Alert } from "@/components/ui/alert";
import { StatusBadge } from "@/components/ui/badge";
import { Button, buttonClasses } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { Skeleton } from "@/components/ui/skeleton";
import { Table, TBody, TD, TH, THead, TR } from "@/components/ui/table";
import { IconStop } from "@/components/ui/icons";
import { canWrite, submitterName, useWorkspaceOrg } from "@/lib/swr/org-context";
import { cancelRuns } from "@/lib/swr/run-mutations";
import { useRuns } from "@/lib/swr/use-runs";
import type { RunMethod, RunStatus } from "@/lib/swr/types";
import { MAX_COMPARE, RUN_METHOD_LABELS } from "@/lib/runs/constants";
import { shotsText } from "./run-meta";
import { EMPTY_FILTERS, RunsFilters, type RunFilters } from "./runs-filters";
import { RunValueCell } from "./run-value-cell";
import { formatPercent, plural } from "@/lib/format";
import { RelativeTime } from "@/components/ui/relative-time";

const PAGE_SIZE = 20;

function readFilters(params: URLSearchParams): RunFilters {
  const f = { ...EMPTY_FILTERS };
  for (const k of Object.keys(f) as (keyof RunFilters)[]) f[k] = params.get(k) ?? "";
  return f;
}

/**
 * The URL is the only source of truth for the filters (shareable, survives reload, back
 * and forward work). Paging and the selection belong to one filter set: they are stored
 * with the query they were made for and read as empty once the query changes.
 */
export function RunsList() {
  const { orgId, role, members } = useWorkspaceOrg();
  const pathname = usePathname();
  const params = useSearchParams();
  const query = params.toString();
  const filters = useMemo(() => readFilters(new URLSearchParams(query)), [query]);
  const [paging, setPaging] = useState<{ query: string; cursors: (string | null)[] }>({
    query,
    cursors: [null],
  });
  const [picked, setPicked] = useState<{ query: string; ids: Set<string> }>({
    query,
    ids: new Set(),
  });
  const [notice, setNotice] = useState<{ tone: "success" | "error"; text: string } | null>(null);
  const [busy, setBusy] = useState(false);
  const cursors = paging.query === query ? paging.cursors : [null];
  const selected = picked.query === query ? picked.ids : new Set<string>();
  const setCursors = (next: (c: (string | null)[]) => (string | null)[]) =>
    setPaging({ query, cursors: next(cursors) });
  const setSelected = (next: Set<string> | ((s: Set<string>) => Set<string>)) =>
    setPicked({ query, ids: typeof next === "function" ? next(selected) : next });

  // History entries are replaced without a server round trip; Next's router follows them.
  const setFilters = useCallback(
    (next: RunFilters) => {
      const search = new URLSearchParams();
      for (const [k, v] of Object.entries(next)) if (v) search.set(k, v);
      const s = search.toString();
      if (s !== query) window.history.replaceState(null, "", s ? `${pathname}?${s}` : pathname);
    },
    [query, pathname],
  );
  const q = filters.q;

  const cursor = cursors[cursors.length - 1];
  const { data, error, isLoading, mutate } = useRuns({
    q,
    status: filters.status as RunStatus | "",
    method: filters.method as RunMethod | "",
    createdBy: filters.createdBy,
    from: filters.from,
    to: filters.to,
    cursor,
    limit: PAGE_SIZE,
  });
  const rows = useMemo(() => data?.data ?? [], [data]);
  const chosen = rows.filter((r) => selected.has(r.id));
  const cancellable = chosen.filter((r) => r.status === "queued" || r.status === "running");
  const comparable = chosen.filter((r) => r.status === "succeeded");
  const filtered = Object.values(filters).some(Boolean);
  const writer = canWrite(role);

  const toggle = (id: string) =>
    setSelected((s) => {
      const n = new Set(s);
      if (n.has(id)) n.delete(id);
      else n.add(id);
      return n;
    });
  const allOnPage = rows.length > 0 && rows.every((r) => selected.has(r.id));

  const bulkCancel = async () => {
    setBusy(true);
    setNotice(null);
    const failures = await cancelRuns(
      orgId,
      cancellable.map((r) => r.id),
    );
    setBusy(false);
    const done = cancellable.length - failures.length;
    setNotice(
      failures.length
        ? {
            tone: "error",
            text: `Canceled ${done} of ${cancellable.length}. ${failures[0].message}`,
          }
        : { tone: "success", text: `Canceled ${plural(done, "run")}.` },
    );
    setSelected(new Set());
    await mutate();
  };

  return (
    <div className="grid gap-4">
      <RunsFilters value={filters} onChange={setFilters} members={members} />
      {chosen.length ? (
        <div
          role="region"
          aria-label="Selection"
          className="flex flex-wrap items-center gap-2 rounded-lg border border-accent/30 bg-accent-soft/50 px-3 py-2 text-[13px]"
        >
          <span className="font-medium text-ink">{chosen.length} selected</span>
          {writer ? (
            <Button
              size="sm"
              variant="secondary"
              icon={<IconStop />}
              disabled={!cancellable.length}
              loading={busy}
              onClick={bulkCancel}
            >
              Cancel {cancellable.length || ""} unfinished
            </Button>
          ) : null}
          <Link
            aria-disabled={comparable.length < 2 || comparable.length > MAX_COMPARE}
            className={buttonClasses({ size: "sm", variant: "secondary" })}
            href={`/app/compare?ids=${comparable.map((r) => r.id).join(",")}`}
          >
            Compare {comparable.length >= 2 ? comparable.length : ""} finished
          </Link>
          {comparable.length > MAX_COMPARE ? (
            <span className="text-xs text-ink-2">Compare takes at most {MAX_COMPARE}.</span>
          ) : null}
          <Button size="sm" variant="ghost" onClick={() => setSelected(new Set())}>
            Clear selection
          </Button>
        </div>
      ) : null}
      {notice ? (
        <Alert tone={notice.tone} compact role={notice.tone === "error" ? "alert" : "status"}>
          {notice.text}
        </Alert>
      ) : null}
      {error ? (
        <Alert
          tone="error"
          role="alert"
          title="The runs could not be loaded"
          actions={
            <Button size="sm" variant="secondary" onClick={() => mutate()}>
              Try again
            </Button>
          }
        >
          {error.message}
        </Alert>
      ) : isLoading && !data ? (
        <div className="grid gap-2" aria-busy="true" aria-label="Loading runs">
          {Array.from({ length: 6 }, (_, i) => (
            <Skeleton key={i} className="h-11" />
          ))}
        </div>
      ) : rows.length === 0 ? (
        filtered ? (
          <EmptyState
            title="No runs match these filters"
            description="Loosen a filter or clear them all."
            action={
              <Button variant="secondary" onClick={() => setFilters(EMPTY_FILTERS)}>
                Clear filters
              </Button>
            }
          />
        ) : (
          <EmptyState
            title="No runs yet"
            description="Compose a circuit and an observable, preview the cost, and submit — results appear here."
            action={
              <Link className={buttonClasses()} href="/app/runs/new">
                New run
              </Link>
            }
          />
        )
      ) : (
        <Table aria-label="Runs" aria-busy={isLoading}>
          <THead>
            <TR>
              <TH className="w-8">
                <input
                  type="checkbox"
                  aria-label="Select every run on this page"
                  className="size-4 accent-accent"
                  checked={allOnPage}
                  onChange={() =>
                    setSelected(allOnPage ? new Set() : new Set(rows.map((r) => r.id)))
                  }
                />
              </TH>
              <TH>Name</TH>
              <TH>Status</TH>
              <TH>Method</TH>
              <TH numeric>Qubits</TH>
              <TH numeric>Shots</TH>
              <TH numeric>⟨A⟩</TH>
              <TH>Submitted by</TH>
              <TH>Queued</TH>
            </TR>
          </THead>
          <TBody>
            {rows.map((r) => (
              <TR key={r.id} aria-selected={selected.has(r.id) || undefined}>
                <TD>
                  <input
                    type="checkbox"
                    aria-label={`Select ${r.name}`}
                    className="size-4 accent-accent"
                    checked={selected.has(r.id)}
                    onChange={() => toggle(r.id)}
                  />
                </TD>
                <TD className="max-w-[22rem]">
                  <Link
                    href={`/app/runs/${r.id}`}
                    className="block truncate font-medium text-ink hover:text-accent-ink hover:underline"
                  >
                    {r.name}
                  </Link>
                  {r.status === "running" ? (
                    <span className="figures text-[11px] text-ink-3">
                      {formatPercent(r.progress)} · {r.phase ?? "running"}
                    </span>
                  ) : r.status === "failed" && r.error ? (
                    <span className="block truncate text-[11px] text-danger">{r.error.detail}</span>
                  ) : null}
                </TD>
                <TD>
                  <StatusBadge status={r.status} />
                </TD>
                <TD className="text-[12.5px] whitespace-nowrap text-ink-2">
                  {RUN_METHOD_LABELS[r.method]}
                </TD>
                <TD numeric>{r.qubits}</TD>
                <TD numeric title={shotsText(r).long}>
                  {shotsText(r).short}
                </TD>
                <TD numeric>
                  <RunValueCell run={r} />
                </TD>
                <TD className="text-[12.5px] text-ink-2">{submitterName(members, r.createdBy)}</TD>
                <TD className="text-[12.5px] whitespace-nowrap text-ink-2">
                  <RelativeTime date={r.queuedAt} />
                </TD>
              </TR>
            ))}
          </TBody>
        </Table>
      )}
      {rows.length || cursors.length > 1 ? (
        <nav
          aria-label="Pages"
          className="flex items-center justify-between gap-3 text-[13px] text-ink-2"
        >
          <span className="figures">Page {cursors.length}</span>
          <div className="flex gap-2">
            <Button
              size="sm"
              variant="secondary"
              disabled={cursors.length <= 1}
              onClick={() => setCursors((c) => c.slice(0, -1))}
            >
              Previous
            </Button>
            <Button
              size="sm"
              variant="secondary"
              disabled={!data?.nextCursor}
              onClick={() => data?.nextCursor && setCursors((c) => [...c, data.nextCursor])}
            >
              Next
            </Button>
          </div>
        </nav>
      ) : null}
    </div>
  );
}

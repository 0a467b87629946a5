"use client";
/**
 * The organisation's saved circuits and observables: searchable lists with tags, the
 * source on demand, "use in a new run", delete (members and above) and save dialogs.
 */
import Link from "next/link";
import { useMemo, useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Badge } from "@/components/ui/badge";
import { Button, buttonClasses } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { CodeBlock } from "@/components/ui/code-block";
import { EmptyState } from "@/components/ui/empty-state";
import { Input } from "@/components/ui/input";
import { Skeleton } from "@/components/ui/skeleton";
import { Tabs } from "@/components/ui/tabs";
import { IconSearch } from "@/components/ui/icons";
import { apiFetch, isApiError } from "@/lib/swr/api-client";
import { canWrite, submitterName, useWorkspaceOrg } from "@/lib/swr/org-context";
import { useCircuits, useLibraryItem, useObservables } from "@/lib/swr/use-library";
import type { LibraryCircuitSummary, LibraryObservableSummary } from "@/lib/swr/types";
import { LibraryItemForm, type LibraryKind } from "./library-item-form";
import { plural } from "@/lib/format";
import { RelativeTime } from "@/components/ui/relative-time";

type Summary = LibraryCircuitSummary | LibraryObservableSummary;

function ItemSource({ kind, id }: { kind: LibraryKind; id: string }) {
  const { data, error, isLoading } = useLibraryItem(
    kind === "circuit" ? "circuits" : "observables",
    id,
  );
  if (error) return <p className="text-xs text-danger">{error.message}</p>;
  if (isLoading || !data) return <Skeleton className="h-24" />;
  const text =
    "source" in data
      ? data.source
      : data.format === "pauli"
        ? data.terms
        : JSON.stringify(
            data.imag ? { real: data.real, imag: data.imag } : { real: data.real },
            null,
            1,
          );
  return (
    <CodeBlock
      code={text}
      title={
        kind === "circuit"
          ? `${data.format} source`
          : data.format === "pauli"
            ? "Pauli sum"
            : "matrix (JSON)"
      }
      maxHeight="18rem"
    />
  );
}

function ItemRow({
  kind,
  item,
  onDeleted,
}: {
  kind: LibraryKind;
  item: Summary;
  onDeleted: () => void;
}) {
  const { orgId, role, members } = useWorkspaceOrg();
  const [open, setOpen] = useState(false);
  const [confirm, setConfirm] = useState(false);
  const [err, setErr] = useState<string | null>(null);
  const remove = async () => {
    try {
      await apiFetch(
        orgId,
        `/api/v1/${kind === "circuit" ? "circuits" : "observables"}/${item.id}`,
        { method: "DELETE" },
      );
      onDeleted();
    } catch (e) {
      setErr(isApiError(e) ? e.message : "Could not delete.");
    }
  };
  return (
    <li className="grid gap-3 px-4 py-3">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div className="grid min-w-0 gap-1">
          <p className="flex flex-wrap items-center gap-2">
            <span className="font-medium text-ink">{item.name}</span>
            <span className="figures text-xs text-ink-3">
              {plural(item.qubits, "qubit")} · {item.format}
            </span>
          </p>
          {item.description ? (
            <p className="max-w-3xl text-[13px] leading-5 text-ink-2">{item.description}</p>
          ) : null}
          <p className="flex flex-wrap items-center gap-1.5 text-xs text-ink-3">
            {item.tags.map((t) => (
              <Badge key={t}>{t}</Badge>
            ))}
            <span>
              by{" "}
              {submitterName(members, item.createdBy ? { type: "user", id: item.createdBy } : null)}{" "}
              · <RelativeTime date={item.createdAt} />
            </span>
          </p>
        </div>
        <div className="flex flex-wrap gap-1.5">
          <Button variant="ghost" size="sm" aria-expanded={open} onClick={() => setOpen((v) => !v)}>
            {open ? "Hide" : kind === "circuit" ? "Source" : "Terms"}
          </Button>
          <Link
            className={buttonClasses({ variant: "secondary", size: "sm" })}
            href={`/app/runs/new?${kind}=${item.id}`}
          >
            Use in a new run
          </Link>
          {canWrite(role) ? (
            confirm ? (
              <>
                <Button variant="danger" size="sm" onClick={remove}>
                  Delete
                </Button>
                <Button variant="ghost" size="sm" onClick={() => setConfirm(false)}>
                  Keep
                </Button>
              </>
            ) : (
              <Button
                variant="ghost"
                size="sm"
                aria-label={`Delete ${item.name}`}
                onClick={() => setConfirm(true)}
              >
                Delete…
              </Button>
            )
          ) : null}
        </div>
      </div>
      {err ? (
        <Alert tone="error" compact role="alert">
          {err}
        </Alert>
      ) : null}
      {open ? <ItemSource kind={kind} id={item.id} /> : null}
    </li>
  );
}

function ItemList({ kind }: { kind: LibraryKind }) {
  const { role } = useWorkspaceOrg();
  const [tag, setTag] = useState("");
  const [q, setQ] = useState("");
  const [saving, setSaving] = useState(false);
  const circuits = useCircuits({
    tag: kind === "circuit" ? tag || undefined : undefined,
    limit: 100,
  });
  const observables = useObservables({
    tag: kind === "observable" ? tag || undefined : undefined,
    limit: 100,
  });
  const swr = kind === "circuit" ? circuits : observables;
  const items: Summary[] = useMemo(() => swr.data?.data ?? [], [swr.data]);
  const allTags = useMemo(() => [...new Set(items.flatMap((i) => i.tags))].sort(), [items]);
  const shown = items.filter(
    (i) => !q || `${i.name} ${i.description}`.toLowerCase().includes(q.toLowerCase()),
  );
  return (
    <div className="grid gap-3">
      <div className="flex flex-wrap items-center gap-2">
        <label className="relative block min-w-64 flex-1">
          <span className="sr-only">Search {kind}s</span>
          <IconSearch className="pointer-events-none absolute top-1/2 left-2.5 size-4 -translate-y-1/2 text-ink-3" />
          <Input
            type="search"
            placeholder={`Search ${kind}s`}
            value={q}
            onChange={(e) => setQ(e.target.value)}
            className="pl-8"
          />
        </label>
        {canWrite(role) ? <Button onClick={() => setSaving(true)}>Save a {kind}</Button> : null}
      </div>
      {allTags.length || tag ? (
        <div
          className="flex flex-wrap items-center gap-1.5"
          role="group"
          aria-label="Filter by tag"
        >
          <span className="text-xs text-ink-3">Tags</span>
          {(tag && !allTags.includes(tag) ? [tag, ...allTags] : allTags).map((t) => (
            <button
              key={t}
              type="button"
              aria-pressed={tag === t}
              onClick={() => setTag(tag === t ? "" : t)}
              className="rounded-[5px] border border-line-strong/70 px-1.5 py-0.5 text-[11.5px] text-ink-2 hover:text-ink aria-pressed:border-accent aria-pressed:bg-accent-soft aria-pressed:text-accent-ink"
            >
              {t}
            </button>
          ))}
        </div>
      ) : null}
      {swr.error ? (
        <Alert tone="error" role="alert">
          {swr.error.message}
        </Alert>
      ) : swr.isLoading && !swr.data ? (
        <Skeleton className="h-48" />
      ) : shown.length === 0 ? (
        <EmptyState
          title={items.length ? `No ${kind} matches` : `No saved ${kind}s yet`}
          description={
            items.length
              ? "Try another word or tag."
              : `Save a ${kind} to reuse it in runs and share it with the organisation.`
          }
        />
      ) : (
        <Card>
          <ul className="divide-y divide-line">
            {shown.map((item) => (
              <ItemRow key={item.id} kind={kind} item={item} onDeleted={() => swr.mutate()} />
            ))}
          </ul>
        </Card>
      )}
      {saving ? (
        <LibraryItemForm
          kind={kind}
          open
          onClose={() => setSaving(false)}
          onSaved={() => {
            setSaving(false);
            void swr.mutate();
          }}
        />
      ) : null}
    </div>
  );
}

export function LibraryView() {
  return (
    <Tabs
      label="Library sections"
      items={[
        { id: "circuits", label: "Circuits", content: <ItemList kind="circuit" /> },
        { id: "observables", label: "Observables", content: <ItemList kind="observable" /> },
      ]}
    />
  );
}

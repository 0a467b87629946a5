"use client";
/**
 * Picks a saved circuit or observable of the organisation (used by the new-run page).
 * A searchable list inside a dialog; Enter or a click on an entry picks it.
 */
import Link from "next/link";
import { useMemo, useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Badge } from "@/components/ui/badge";
import { Dialog } from "@/components/ui/dialog";
import { Input } from "@/components/ui/input";
import { Skeleton } from "@/components/ui/skeleton";
import { useWorkspaceOrg } from "@/lib/swr/org-context";
import { fetchCircuit, fetchObservable, useCircuits, useObservables } from "@/lib/swr/use-library";
import type {
  LibraryCircuit,
  LibraryCircuitSummary,
  LibraryObservable,
  LibraryObservableSummary,
} from "@/lib/swr/types";
import { plural } from "@/lib/format";

type Item = LibraryCircuitSummary | LibraryObservableSummary;

function matches(item: Item, q: string): boolean {
  if (!q) return true;
  const hay = `${item.name} ${item.description} ${item.tags.join(" ")}`.toLowerCase();
  return q
    .toLowerCase()
    .split(/\s+/)
    .every((w) => hay.includes(w));
}

function PickerList<T extends Item>({
  items,
  loading,
  error,
  onPick,
  kind,
}: {
  items: T[] | undefined;
  loading: boolean;
  error: Error | undefined;
  onPick: (item: T) => Promise<void>;
  kind: "circuit" | "observable";
}) {
  const [q, setQ] = useState("");
  const [busy, setBusy] = useState<string | null>(null);
  const [pickError, setPickError] = useState<string | null>(null);
  const shown = useMemo(() => (items ?? []).filter((i) => matches(i, q)), [items, q]);
  return (
    <div className="grid gap-3">
      <Input
        type="search"
        placeholder={`Search ${kind}s by name, description or tag`}
        aria-label={`Search saved ${kind}s`}
        value={q}
        onChange={(e) => setQ(e.target.value)}
        autoFocus
      />
      {pickError ? (
        <Alert tone="error" compact role="alert">
          {pickError}
        </Alert>
      ) : null}
      {error ? (
        <Alert tone="error" compact role="alert">
          The library could not be loaded: {error.message}
        </Alert>
      ) : loading && !items ? (
        <div className="grid gap-2" aria-busy="true" aria-label="Loading the library">
          <Skeleton className="h-14" />
          <Skeleton className="h-14" />
          <Skeleton className="h-14" />
        </div>
      ) : shown.length === 0 ? (
        <p className="rounded-md border border-dashed border-line-strong px-4 py-6 text-center text-[13px] text-ink-2">
          {items?.length ? `No saved ${kind} matches “${q}”.` : `No saved ${kind}s yet.`}{" "}
          <Link href="/app/library" className="font-medium text-accent-ink underline">
            Open the library
          </Link>
        </p>
      ) : (
        <ul
          className="grid max-h-[50vh] gap-1.5 overflow-y-auto pr-1"
          aria-label={`Saved ${kind}s`}
        >
          {shown.map((item) => (
            <li key={item.id}>
              <button
                type="button"
                disabled={busy !== null}
                aria-busy={busy === item.id || undefined}
                onClick={async () => {
                  setBusy(item.id);
                  setPickError(null);
                  try {
                    await onPick(item);
                  } catch (e) {
                    setPickError(e instanceof Error ? e.message : "Could not load it.");
                  } finally {
                    setBusy(null);
                  }
                }}
                className="grid w-full gap-1 rounded-md border border-line px-3 py-2 text-left hover:border-accent/50 hover:bg-accent-soft/40 focus-visible:border-focus"
              >
                <span className="flex items-center justify-between gap-3">
                  <span className="truncate text-sm font-medium text-ink">{item.name}</span>
                  <span className="figures shrink-0 text-xs text-ink-3">
                    {plural(item.qubits, "qubit")} · {item.format}
                  </span>
                </span>
                {item.description ? (
                  <span className="line-clamp-2 text-[12.5px] text-ink-2">{item.description}</span>
                ) : null}
                {item.tags.length ? (
                  <span className="flex flex-wrap gap-1">
                    {item.tags.map((t) => (
                      <Badge key={t}>{t}</Badge>
                    ))}
                  </span>
                ) : null}
              </button>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

export function CircuitPicker({
  open,
  onClose,
  onPick,
}: {
  open: boolean;
  onClose: () => void;
  onPick: (c: LibraryCircuit) => void;
}) {
  const { orgId } = useWorkspaceOrg();
  const { data, error, isLoading } = useCircuits({ limit: 100 });
  return (
    <Dialog
      open={open}
      onClose={onClose}
      title="Saved circuits"
      description="Load a circuit of your organisation into the editor."
      size="lg"
    >
      <PickerList
        kind="circuit"
        items={data?.data}
        loading={isLoading}
        error={error}
        onPick={async (c) => onPick(await fetchCircuit(orgId, c.id))}
      />
    </Dialog>
  );
}

export function ObservablePicker({
  open,
  onClose,
  onPick,
}: {
  open: boolean;
  onClose: () => void;
  onPick: (o: LibraryObservable) => void;
}) {
  const { orgId } = useWorkspaceOrg();
  const { data, error, isLoading } = useObservables({ limit: 100 });
  return (
    <Dialog
      open={open}
      onClose={onClose}
      title="Saved observables"
      description="Load an observable of your organisation."
      size="lg"
    >
      <PickerList
        kind="observable"
        items={data?.data}
        loading={isLoading}
        error={error}
        onPick={async (o) => onPick(await fetchObservable(orgId, o.id))}
      />
    </Dialog>
  );
}

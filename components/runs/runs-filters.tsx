"use client";
/**
 * Filter bar of the runs list: name search, status, method, submitter and queued days.
 * `value` comes from the URL; the search box keeps what is being typed and hands it on
 * once typing pauses, and takes the URL's text whenever that changes elsewhere (Clear,
 * back and forward).
 */
import { useEffect, useState } from "react";
import { Button } from "@/components/ui/button";
import { Input } from "@/components/ui/input";
import { Select } from "@/components/ui/select";
import { IconSearch } from "@/components/ui/icons";
import type { WorkspaceMember } from "@/lib/swr/org-context";
import {
  RUN_METHOD_LABELS,
  RUN_METHODS,
  RUN_STATUS_LABELS,
  RUN_STATUSES,
} from "@/lib/runs/constants";

export type RunFilters = {
  q: string;
  status: string;
  method: string;
  createdBy: string;
  from: string;
  to: string;
};

export const EMPTY_FILTERS: RunFilters = {
  q: "",
  status: "",
  method: "",
  createdBy: "",
  from: "",
  to: "",
};

const SEARCH_PAUSE_MS = 300;

export function RunsFilters({
  value,
  onChange,
  members,
}: {
  value: RunFilters;
  onChange: (next: RunFilters) => void;
  members: WorkspaceMember[];
}) {
  const set = (k: keyof RunFilters) => (e: { target: { value: string } }) =>
    onChange({ ...value, [k]: e.target.value });
  const active = Object.values(value).some(Boolean);
  const [draft, setDraft] = useState(value.q);
  const [seenQ, setSeenQ] = useState(value.q);
  if (seenQ !== value.q) {
    setSeenQ(value.q);
    if (draft.trim() !== value.q) setDraft(value.q);
  }
  useEffect(() => {
    const text = draft.trim();
    if (text === value.q) return;
    const t = setTimeout(() => onChange({ ...value, q: text }), SEARCH_PAUSE_MS);
    return () => clearTimeout(t);
  }, [draft, value, onChange]);
  return (
    <div
      role="search"
      aria-label="Filter runs"
      className="grid gap-2 md:grid-cols-[minmax(12rem,1.6fr)_repeat(3,minmax(8rem,1fr))] xl:grid-cols-[minmax(14rem,1.6fr)_repeat(3,minmax(8rem,1fr))_auto_auto_auto]"
    >
      <label className="relative block">
        <span className="sr-only">Search by name</span>
        <IconSearch className="pointer-events-none absolute top-1/2 left-2.5 size-4 -translate-y-1/2 text-ink-3" />
        <Input
          type="search"
          placeholder="Search by name"
          value={draft}
          onChange={(e) => setDraft(e.target.value)}
          className="pl-8"
        />
      </label>
      <Select aria-label="Status" value={value.status} onChange={set("status")}>
        <option value="">Any status</option>
        {RUN_STATUSES.map((s) => (
          <option key={s} value={s}>
            {RUN_STATUS_LABELS[s]}
          </option>
        ))}
      </Select>
      <Select aria-label="Method" value={value.method} onChange={set("method")}>
        <option value="">Any method</option>
        {RUN_METHODS.map((m) => (
          <option key={m} value={m}>
            {RUN_METHOD_LABELS[m]}
          </option>
        ))}
      </Select>
      <Select aria-label="Submitted by" value={value.createdBy} onChange={set("createdBy")}>
        <option value="">Anyone</option>
        {members.map((m) => (
          <option key={m.id} value={m.id}>
            {m.name}
          </option>
        ))}
      </Select>
      <label className="flex items-center gap-1.5 text-xs text-ink-2">
        <span className="shrink-0">From</span>
        <Input
          type="date"
          size="md"
          value={value.from}
          max={value.to || undefined}
          onChange={set("from")}
          aria-label="Queued on or after"
        />
      </label>
      <label className="flex items-center gap-1.5 text-xs text-ink-2">
        <span className="shrink-0">to</span>
        <Input
          type="date"
          size="md"
          value={value.to}
          min={value.from || undefined}
          onChange={set("to")}
          aria-label="Queued on or before"
        />
      </label>
      <Button variant="ghost" disabled={!active} onClick={() => onChange(EMPTY_FILTERS)}>
        Clear
      </Button>
    </div>
  );
}

"use client";
/** The dialog that adds recent finished runs to the comparison (up to MAX_COMPARE in all). */
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { Skeleton } from "@/components/ui/skeleton";
import { MAX_COMPARE } from "@/lib/runs/constants";
import { useRuns } from "@/lib/swr/use-runs";
import { RelativeTime } from "@/components/ui/relative-time";

export function AddRunsDialog({
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
                  <RelativeTime date={r.queuedAt} className="figures text-xs text-ink-3" />
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

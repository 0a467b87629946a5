"use client";
/**
 * The organisation's saved noise profiles on the new-run page: loaded through a server
 * action (SWR key includes the org id, which every call names), applied from the profile
 * picker, saved from the current fields (same name = edit), deleted.
 */
import { useState } from "react";
import { useFormContext } from "react-hook-form";
import useSWR from "swr";
import {
  deleteNoiseProfileAction,
  listNoiseProfilesAction,
  saveNoiseProfileAction,
} from "@/app/(app)/app/runs/new/noise-actions";
import { Button } from "@/components/ui/button";
import { actionData, actionText } from "@/lib/api/action-state";
import { Input } from "@/components/ui/input";
import type { NoiseProfileView } from "@/lib/noise-profiles/schemas";
import { useWorkspaceOrg } from "@/lib/swr/org-context";
import { toRequest, type RunBuilderValues } from "./run-builder-model";
import { IconSave } from "@/components/ui/icons";
import type { NoiseProfile } from "./noise-help";
import { advancedNoiseFromRequest } from "./noise-advanced-model";

const s = (x: number | undefined) => (typeof x === "number" ? String(x) : "");

/** A saved profile in the picker's shape (text fields, like the form). */
export function toPickerProfile(p: NoiseProfileView): NoiseProfile {
  const n = p.noise;
  return {
    id: p.id,
    name: p.name,
    values: {
      depolarizing1q: s(n.depolarizing1q),
      depolarizing2q: s(n.depolarizing2q),
      amplitudeDamping: s(n.amplitudeDamping),
      phaseDamping: s(n.phaseDamping),
      p1Given0: s(n.readout?.p1Given0),
      p0Given1: s(n.readout?.p0Given1),
    },
    advanced: advancedNoiseFromRequest(n),
  };
}

export function useNoiseProfiles() {
  const { orgId } = useWorkspaceOrg();
  const swr = useSWR(
    [orgId, "noise-profiles"] as const,
    async () => actionData(await listNoiseProfilesAction({ orgId })),
    { revalidateOnFocus: false },
  );
  return { ...swr, profiles: (swr.data ?? []).map(toPickerProfile) };
}

export function NoiseProfileControls({ state }: { state: ReturnType<typeof useNoiseProfiles> }) {
  const { orgId } = useWorkspaceOrg();
  const { getValues } = useFormContext<RunBuilderValues>();
  const [naming, setNaming] = useState(false);
  const [name, setName] = useState("");
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);

  const save = async () => {
    const built = toRequest({ ...getValues(), noiseEnabled: true });
    const noiseIssues = built.issues.filter((i) => i.path.startsWith("noise"));
    if (noiseIssues.length) {
      setMessage({ ok: false, text: "Fix the marked probabilities first." });
      return;
    }
    setBusy(true);
    const answer = await saveNoiseProfileAction({
      orgId,
      name,
      noise: built.request.noise ?? {},
    });
    setBusy(false);
    const ok = answer.status === "success";
    setMessage({ ok, text: actionText(answer) });
    if (ok) {
      setNaming(false);
      await state.mutate();
    }
  };

  const remove = async (id: string) => {
    const answer = await deleteNoiseProfileAction({ orgId, id });
    setMessage({ ok: answer.status === "success", text: actionText(answer) });
    await state.mutate();
  };

  return (
    <div className="grid gap-2">
      {naming ? (
        <div className="flex flex-wrap items-end gap-2">
          <label className="grid gap-1 text-[13px] font-medium text-ink">
            Profile name
            <Input
              size="md"
              value={name}
              maxLength={80}
              onChange={(e) => setName(e.target.value)}
              onKeyDown={(e) => {
                if (e.key === "Enter") {
                  e.preventDefault();
                  void save();
                }
              }}
              autoFocus
            />
          </label>
          <Button size="md" loading={busy} disabled={!name.trim()} onClick={save}>
            Save
          </Button>
          <Button size="md" variant="ghost" onClick={() => setNaming(false)}>
            Cancel
          </Button>
        </div>
      ) : (
        <div className="flex flex-wrap gap-2">
          <Button variant="secondary" size="md" icon={<IconSave />} onClick={() => setNaming(true)}>
            Save as profile
          </Button>
          {state.profiles.length ? (
            <details className="relative">
              <summary className="flex h-9 cursor-pointer items-center rounded-md px-3 text-[13px] text-ink-2 hover:bg-surface-2">
                Manage saved ({state.profiles.length})
              </summary>
              <ul className="absolute z-20 mt-1 grid w-72 gap-0.5 rounded-md border border-line bg-surface p-1 shadow-pop">
                {state.profiles.map((p) => (
                  <li
                    key={p.id}
                    className="flex items-center justify-between gap-2 rounded px-2 py-1 text-[13px] hover:bg-surface-2"
                  >
                    <span className="truncate">{p.name}</span>
                    <Button
                      variant="ghost"
                      size="sm"
                      aria-label={`Delete the profile ${p.name}`}
                      onClick={() => remove(p.id)}
                    >
                      Delete
                    </Button>
                  </li>
                ))}
              </ul>
            </details>
          ) : null}
        </div>
      )}
      {message ? (
        <p role="status" className={message.ok ? "text-xs text-ok" : "text-xs text-danger"}>
          {message.text}
        </p>
      ) : null}
    </div>
  );
}

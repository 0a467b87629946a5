/**
 * Drafts of the run builder in localStorage, one per organisation, so nothing typed is lost
 * on a reload or an error. A stored draft is merged field by field onto the defaults:
 * fields of the wrong type (an older or tampered draft) fall back to the default.
 */
import { DEFAULT_VALUES, type RunBuilderValues } from "./run-builder-model";

const VERSION = 1;

export const draftKey = (orgId: string) => `ketwise:new-run-draft:${orgId}`;

function mergeInto(defaults: unknown, stored: unknown): unknown {
  if (Array.isArray(defaults)) return Array.isArray(stored) ? stored : defaults;
  if (defaults && typeof defaults === "object") {
    if (!stored || typeof stored !== "object" || Array.isArray(stored)) return defaults;
    const out: Record<string, unknown> = {};
    for (const [k, v] of Object.entries(defaults))
      out[k] = mergeInto(v, (stored as Record<string, unknown>)[k]);
    return out;
  }
  return typeof stored === typeof defaults ? stored : defaults;
}

function cleanAxes(axes: unknown): RunBuilderValues["sweepAxes"] {
  if (!Array.isArray(axes)) return [];
  return axes
    .slice(0, 2)
    .filter((a): a is Record<string, unknown> => !!a && typeof a === "object")
    .map((a) => ({
      name: typeof a.name === "string" ? a.name : "",
      from: typeof a.from === "string" ? a.from : "",
      to: typeof a.to === "string" ? a.to : "",
      points: typeof a.points === "string" ? a.points : "",
    }));
}

function cleanParams(p: unknown): Record<string, string> {
  if (!p || typeof p !== "object" || Array.isArray(p)) return {};
  return Object.fromEntries(Object.entries(p).filter(([, v]) => typeof v === "string")) as Record<
    string,
    string
  >;
}

/** Parses stored draft text; null when absent or unreadable. */
export function readDraft(text: string | null): RunBuilderValues | null {
  if (!text) return null;
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch {
    return null;
  }
  if (!data || typeof data !== "object" || (data as { v?: unknown }).v !== VERSION) return null;
  const values = (data as { values?: unknown }).values;
  const merged = mergeInto(DEFAULT_VALUES, values) as RunBuilderValues;
  const raw = (values ?? {}) as Record<string, unknown>;
  return {
    ...merged,
    parameters: cleanParams(raw.parameters),
    sweepAxes: cleanAxes(raw.sweepAxes),
  };
}

export function writeDraft(values: RunBuilderValues): string {
  return JSON.stringify({ v: VERSION, savedAt: new Date().toISOString(), values });
}

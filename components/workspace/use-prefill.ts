"use client";
/**
 * Values to start the new-run form with, from the URL: `?from=<run id>` (run again with
 * changes), or `?circuit=<id>` and/or `?observable=<id>` (from the library). Loaded once.
 */
import type { ReadonlyURLSearchParams } from "next/navigation";
import { useEffect, useState } from "react";
import { apiFetch } from "@/lib/swr/api-client";
import { useWorkspaceOrg } from "@/lib/swr/org-context";
import type { Run } from "@/lib/swr/types";
import { fetchCircuit, fetchObservable } from "@/lib/swr/use-library";
import { DEFAULT_VALUES, fromRequest, type RunBuilderValues } from "./run-builder-model";

export type Prefill =
  | { state: "none" }
  | { state: "loading" }
  | { state: "ready"; values: RunBuilderValues }
  | { state: "failed"; message: string };

export function usePrefill(search: ReadonlyURLSearchParams): Prefill {
  const { orgId } = useWorkspaceOrg();
  const from = search.get("from");
  const circuitId = search.get("circuit");
  const observableId = search.get("observable");
  const wanted = !!(from || circuitId || observableId);
  const [state, setState] = useState<Prefill>(wanted ? { state: "loading" } : { state: "none" });

  useEffect(() => {
    if (!wanted) return;
    let live = true;
    (async () => {
      if (from) {
        const run = await apiFetch<Run>(orgId, `/api/v1/runs/${encodeURIComponent(from)}`);
        return fromRequest(run.request, `${run.name} (again)`);
      }
      const v: RunBuilderValues = structuredClone(DEFAULT_VALUES);
      if (circuitId) {
        const c = await fetchCircuit(orgId, circuitId);
        v.circuit = { format: c.format, source: c.source };
        v.name = c.name;
      }
      if (observableId) {
        const o = await fetchObservable(orgId, observableId);
        v.observable =
          o.format === "matrix"
            ? {
                format: "matrix",
                terms: "",
                matrixText: JSON.stringify(
                  o.imag ? { real: o.real, imag: o.imag } : { real: o.real },
                ),
              }
            : { format: "pauli", terms: o.terms, matrixText: "" };
      }
      return v;
    })()
      .then((values) => live && setState({ state: "ready", values }))
      .catch(
        (e: unknown) =>
          live &&
          setState({ state: "failed", message: e instanceof Error ? e.message : "could not load" }),
      );
    return () => {
      live = false;
    };
  }, [wanted, from, circuitId, observableId, orgId]);

  return state;
}

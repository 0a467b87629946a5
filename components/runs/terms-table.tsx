"use client";
/**
 * Per-term table of a run: each Pauli word (qubit 0 first) with its coefficient, exact
 * ⟨P⟩, sampled ⟨P⟩ ± standard error, its contribution c·⟨P⟩ and the measurement setting
 * that measured it. Columns sort on click (TanStack Table v9, client-side sorting);
 * the sorted column carries aria-sort.
 */
import {
  createColumnHelper,
  createSortedRowModel,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_basic,
  tableFeatures,
  useTable,
} from "@tanstack/react-table";
import { useMemo, useState } from "react";
import { Button } from "@/components/ui/button";
import { Table, TBody, TD, TH, THead, TR } from "@/components/ui/table";
import { Value } from "@/components/ui/value";
import { intervalZ } from "@/lib/quantum/sampling/interval";
import type { EstimateResult } from "@/lib/swr/types";
import { IconSort } from "@/components/ui/icons";
import { formatFixed } from "@/lib/format";

type Term = EstimateResult["terms"][number];
type Row = Term & { contribution: number; bases: string | null; index: number };

const features = tableFeatures({
  rowSortingFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, basic: sortFn_basic },
});
const helper = createColumnHelper<typeof features, Row>();

const columns = helper.columns([
  helper.accessor("pauli", {
    header: "Pauli word",
    sortFn: "alphanumeric",
    cell: (c) => (
      <span className="grid">
        <span className="font-mono text-[12.5px] tracking-[0.12em] text-ink">{c.getValue()}</span>
        <span className="font-mono text-[11px] text-ink-3">{c.row.original.label}</span>
      </span>
    ),
  }),
  helper.accessor("coefficient", {
    header: "Coefficient",
    sortFn: "basic",
    meta: { numeric: true },
    cell: (c) => <Value value={c.getValue()} decimals={6} size="sm" />,
  }),
  helper.accessor("exact", {
    header: "Exact ⟨P⟩",
    sortFn: "basic",
    meta: { numeric: true },
    cell: (c) => <Value value={c.getValue()} decimals={6} size="sm" tone="exact" />,
  }),
  helper.accessor((r) => r.sampledMean ?? Number.NaN, {
    id: "sampled",
    header: "Sampled ⟨P⟩",
    sortFn: "basic",
    meta: { numeric: true },
    cell: (c) =>
      c.row.original.sampledMean === undefined ? (
        <span className="text-ink-3">{c.row.original.group === null ? "constant" : "—"}</span>
      ) : (
        <Value
          value={c.row.original.sampledMean}
          uncertainty={c.row.original.stdErr}
          size="sm"
          tone="sampled"
        />
      ),
  }),
  helper.accessor(
    (r) =>
      r.sampledMean === undefined || !r.stdErr
        ? Number.NaN
        : (intervalZ({ mean: r.sampledMean, stdErr: r.stdErr, ci95: r.ci95 }, r.exact) ??
          Number.NaN),
    {
      id: "z",
      header: "z",
      sortFn: "basic",
      meta: { numeric: true },
      cell: (c) => {
        const z = c.getValue();
        return Number.isFinite(z) ? (
          <span className={Math.abs(z) > 3 ? "text-danger" : "text-ink-2"}>
            {formatFixed(z, 2)}
          </span>
        ) : (
          <span className="text-ink-3">—</span>
        );
      },
    },
  ),
  helper.accessor("contribution", {
    header: "c·⟨P⟩",
    sortFn: "basic",
    meta: { numeric: true },
    cell: (c) => <Value value={c.getValue()} decimals={6} size="sm" />,
  }),
  helper.accessor((r) => r.group ?? -1, {
    id: "setting",
    header: "Setting",
    sortFn: "basic",
    cell: (c) =>
      c.row.original.bases ? (
        <span className="figures text-[12px] text-ink-2">
          #{c.row.original.group}{" "}
          <span className="tracking-[0.12em] text-ink">{c.row.original.bases}</span>
        </span>
      ) : (
        <span className="text-xs text-ink-3">none (identity)</span>
      ),
  }),
]);

const PAGE = 50;

export function TermsTable({ result }: { result: EstimateResult }) {
  const data = useMemo<Row[]>(
    () =>
      result.terms.map((t, index) => ({
        ...t,
        index,
        contribution: t.coefficient * t.exact,
        bases: t.group === null ? null : (result.groups[t.group]?.bases ?? null),
      })),
    [result],
  );
  const [shown, setShown] = useState(PAGE);
  const table = useTable({ features, columns, data, enableSortingRemoval: true });
  const rows = table.getRowModel().rows;
  return (
    <div className="grid gap-2">
      <Table aria-label="Terms of the observable">
        <THead>
          {table.getHeaderGroups().map((group) => (
            <TR key={group.id}>
              {group.headers.map((header) => {
                const sorted = header.column.getIsSorted();
                const numeric = (header.column.columnDef.meta as { numeric?: boolean } | undefined)
                  ?.numeric;
                return (
                  <TH
                    key={header.id}
                    numeric={numeric}
                    aria-sort={
                      sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : "none"
                    }
                  >
                    <button
                      type="button"
                      onClick={header.column.getToggleSortingHandler()}
                      className={`inline-flex items-center gap-1 uppercase hover:text-ink ${numeric ? "flex-row-reverse" : ""}`}
                    >
                      <table.FlexRender header={header} />
                      <IconSort dir={sorted} />
                    </button>
                  </TH>
                );
              })}
            </TR>
          ))}
        </THead>
        <TBody>
          {rows.slice(0, shown).map((row) => (
            <TR key={row.id}>
              {row.getAllCells().map((cell) => (
                <TD
                  key={cell.id}
                  numeric={
                    (cell.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric
                  }
                >
                  <table.FlexRender cell={cell} />
                </TD>
              ))}
            </TR>
          ))}
        </TBody>
      </Table>
      {rows.length > shown ? (
        <Button
          variant="secondary"
          size="sm"
          className="justify-self-start"
          onClick={() => setShown((s) => s + PAGE * 4)}
        >
          Show more ({rows.length - shown} left)
        </Button>
      ) : null}
    </div>
  );
}

/**
 * The compared runs in one table: method and noise, shots, ideal, exact, sampled and
 * mitigated values, the verdict and each exact value's difference from the first run's.
 */
import Link from "next/link";
import { Badge, StatusBadge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { Table, TBody, TD, TH, THead, TR } from "@/components/ui/table";
import { Value } from "@/components/ui/value";
import { RUN_METHOD_LABELS } from "@/lib/runs/constants";
import type { Run } from "@/lib/swr/types";
import { noiseSummary, verdictOf } from "./compare-figures";
import { formatCount, formatFixed } from "@/lib/format";

export function CompareTable({
  runs,
  first,
  onRemove,
}: {
  runs: Run[];
  /** The first finished run: the reference of the last column. */
  first: Run | undefined;
  onRemove: (id: string) => void;
}) {
  return (
    <Table aria-label="Runs compared">
      <THead>
        <TR>
          <TH>Run</TH>
          <TH>Method · noise</TH>
          <TH numeric>Shots</TH>
          <TH numeric>Ideal</TH>
          <TH numeric>Exact</TH>
          <TH numeric>Sampled</TH>
          <TH numeric>Mitigated</TH>
          <TH>Verdict</TH>
          <TH numeric>Δ exact vs first</TH>
          <TH>
            <span className="sr-only">Remove</span>
          </TH>
        </TR>
      </THead>
      <TBody>
        {runs.map((r) => {
          const res = r.status === "succeeded" ? r.result : null;
          const v = res ? verdictOf(r) : null;
          return (
            <TR key={r.id}>
              <TD className="max-w-[16rem]">
                <Link
                  href={`/app/runs/${r.id}`}
                  className="block truncate font-medium text-ink hover:underline"
                >
                  {r.name}
                </Link>
                {!res ? <StatusBadge status={r.status} /> : null}
              </TD>
              <TD className="text-[12.5px] text-ink-2">
                {RUN_METHOD_LABELS[r.method]} · {noiseSummary(r)}
              </TD>
              <TD numeric>{r.shots ? formatCount(r.shots) : "exact"}</TD>
              <TD numeric>
                {res ? <Value value={res.ideal.value} size="sm" tone="exact" /> : "—"}
              </TD>
              <TD numeric>
                {res ? (
                  <Value
                    value={res.exact.value}
                    size="sm"
                    tone={
                      r.request.noise && Object.keys(r.request.noise).length ? "noisy" : "exact"
                    }
                  />
                ) : (
                  "—"
                )}
              </TD>
              <TD numeric>
                {res?.sampled ? (
                  <Value
                    value={res.sampled.mean}
                    uncertainty={res.sampled.stdErr}
                    size="sm"
                    tone="sampled"
                  />
                ) : (
                  "—"
                )}
              </TD>
              <TD numeric>
                {res?.mitigated ? (
                  <Value
                    value={res.mitigated.mean}
                    uncertainty={res.mitigated.stdErr}
                    size="sm"
                    tone="mitigated"
                  />
                ) : (
                  "—"
                )}
              </TD>
              <TD>
                {v ? (
                  <Badge
                    tone={
                      v.kind === "suspicious"
                        ? "danger"
                        : v.kind === "unavailable"
                          ? "neutral"
                          : "ok"
                    }
                  >
                    {v.kind === "unavailable" ? "exact only" : v.kind}
                    {v.z !== null ? ` · z ${formatFixed(v.z, 1)}` : ""}
                  </Badge>
                ) : null}
              </TD>
              <TD numeric>
                {res && first ? (
                  <Value value={res.exact.value - first.result!.exact.value} size="sm" />
                ) : (
                  "—"
                )}
              </TD>
              <TD>
                <Button
                  variant="ghost"
                  size="sm"
                  aria-label={`Remove ${r.name} from the comparison`}
                  onClick={() => onRemove(r.id)}
                >
                  Remove
                </Button>
              </TD>
            </TR>
          );
        })}
      </TBody>
    </Table>
  );
}

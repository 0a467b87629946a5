"use client";
/**
 * Sweep results of a run: a line chart for one swept parameter, a heat map for two, the
 * minimum marked; the points as a table and a CSV download.
 */
import { useState } from "react";
import { SweepHeatmap } from "@/components/charts/sweep-heatmap";
import { SweepLineChart } from "@/components/charts/sweep-line-chart";
import { argMin, metricOf, type SweepMetric } from "@/components/charts/sweep-math";
import { Button } from "@/components/ui/button";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { Table, TBody, TD, TH, THead, TR } from "@/components/ui/table";
import { Value } from "@/components/ui/value";
import { Segmented } from "@/components/workspace/segmented";
import { IconDownload } from "@/components/workspace/icons";
import { MIME, downloadBlob } from "@/lib/export/download";
import { sweepCsv } from "@/lib/export/run-export";
import type { EstimateResult } from "@/lib/swr/types";

type Sweep = NonNullable<EstimateResult["sweep"]>;

export function SweepCard({
  sweep,
  noisy,
  fileStem,
}: {
  sweep: Sweep;
  noisy: boolean;
  fileStem: string;
}) {
  const [metric, setMetric] = useState<SweepMetric>("exact");
  const [table, setTable] = useState(false);
  const names = sweep.parameters;
  const hasSampled = sweep.points.some((p) => p.sampled);
  const iMin = argMin(sweep.points.map((p) => metricOf(p, names.length === 2 ? metric : "exact")));
  const min = iMin >= 0 ? sweep.points[iMin] : null;
  return (
    <Card aria-labelledby="sweep-title">
      <CardHeader
        eyebrow="Sweep"
        title={
          <span id="sweep-title">
            Landscape over {names.join(" × ")}{" "}
            <span className="figures font-normal text-ink-3">
              · {sweep.points.length.toLocaleString("en-US")} points
            </span>
          </span>
        }
        actions={
          <Button
            variant="ghost"
            size="sm"
            icon={<IconDownload />}
            onClick={() => downloadBlob(sweepCsv(sweep), `${fileStem}-sweep.csv`, MIME.csv)}
          >
            Sweep (CSV)
          </Button>
        }
      />
      <CardBody className="grid gap-4">
        {names.length === 1 ? (
          <SweepLineChart points={sweep.points} name={names[0]} noisy={noisy} />
        ) : names.length === 2 ? (
          <>
            <Segmented
              legend="Colour by"
              size="sm"
              value={metric}
              onChange={setMetric}
              options={[
                { value: "exact", label: noisy ? "Exact under noise" : "Exact" },
                ...(noisy ? [{ value: "ideal" as const, label: "Ideal" }] : []),
                ...(hasSampled ? [{ value: "sampled" as const, label: "Sampled" }] : []),
              ]}
            />
            <SweepHeatmap points={sweep.points} names={[names[0], names[1]]} metric={metric} />
          </>
        ) : null}
        {min ? (
          <p className="text-[13px] text-ink-2" data-testid="sweep-min">
            Minimum of the {names.length === 2 ? metric : "exact"} value:{" "}
            <Value
              value={metricOf(min, names.length === 2 ? metric : "exact")}
              tone="exact"
              size="sm"
            />{" "}
            at{" "}
            <span className="figures text-ink">
              {names.map((n) => `${n} = ${Number(min.params[n].toPrecision(6))}`).join(", ")}
            </span>
            {min.sampled ? (
              <>
                {" "}
                (sampled{" "}
                <Value
                  value={min.sampled.mean}
                  uncertainty={min.sampled.stdErr}
                  tone="sampled"
                  size="sm"
                />
                )
              </>
            ) : null}
          </p>
        ) : null}
        <div>
          <Button
            variant="ghost"
            size="sm"
            aria-expanded={table}
            onClick={() => setTable((v) => !v)}
          >
            {table ? "Hide the points" : "Show the points as a table"}
          </Button>
          {table ? (
            <Table className="mt-2" frameClassName="max-h-96 overflow-y-auto">
              <THead>
                <TR>
                  {names.map((n) => (
                    <TH key={n} numeric>
                      {n}
                    </TH>
                  ))}
                  {noisy ? <TH numeric>Ideal</TH> : null}
                  <TH numeric>{noisy ? "Exact (noise)" : "Exact"}</TH>
                  {hasSampled ? <TH numeric>Sampled</TH> : null}
                </TR>
              </THead>
              <TBody>
                {sweep.points.map((p, i) => (
                  <TR key={i} aria-selected={i === iMin || undefined}>
                    {names.map((n) => (
                      <TD key={n} numeric>
                        {Number(p.params[n].toPrecision(6))}
                      </TD>
                    ))}
                    {noisy ? (
                      <TD numeric>
                        <Value value={p.ideal} size="sm" />
                      </TD>
                    ) : null}
                    <TD numeric>
                      <Value value={p.exact} size="sm" tone={noisy ? "noisy" : "exact"} />
                    </TD>
                    {hasSampled ? (
                      <TD numeric>
                        {p.sampled ? (
                          <Value
                            value={p.sampled.mean}
                            uncertainty={p.sampled.stdErr}
                            size="sm"
                            tone="sampled"
                          />
                        ) : (
                          "—"
                        )}
                      </TD>
                    ) : null}
                  </TR>
                ))}
              </TBody>
            </Table>
          ) : null}
        </div>
      </CardBody>
    </Card>
  );
}

"use client";
/**
 * Parameter points of a run — a sweep grid or an explicit `points` list: for a grid, a
 * line chart for one swept parameter and a heat map for two; for a list, the values
 * against the point number (request order). The minimum is marked; the points as a
 * table (with the gradient per input when the run computed it) and a CSV download.
 */
import { useState } from "react";
import { SweepHeatmap } from "@/components/charts/sweep-heatmap";
import { SweepLineChart } from "@/components/charts/sweep-line-chart";
import { argMin, metricOf, type SweepMetric } from "@/components/charts/sweep-math";
import { Button } from "@/components/ui/button";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { Table, TBody, TD, TH, THead, TR } from "@/components/ui/table";
import { Value } from "@/components/ui/value";
import { Segmented } from "@/components/ui/segmented";
import { GradientValue } from "./gradient-card";
import { IconDownload } from "@/components/ui/icons";
import { MIME, downloadBlob } from "@/lib/export/download";
import { pointsCsv } from "@/lib/export/run-export";
import type { EstimateResult } from "@/lib/swr/types";
import { formatSignificant, plural } from "@/lib/format";

type Sweep = NonNullable<EstimateResult["sweep"]>;

/** Chart axis of a points list: the point's position in the request. */
const POINT_AXIS = "point";

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
  const isList = sweep.kind === "points";
  const gradientNames = Object.keys(sweep.points.find((p) => p.gradient)?.gradient ?? {});
  const hasSampled = sweep.points.some((p) => p.sampled);
  const heat = !isList && names.length === 2;
  const iMin = argMin(sweep.points.map((p) => metricOf(p, heat ? metric : "exact")));
  const min = iMin >= 0 ? sweep.points[iMin] : null;
  const indexed = isList
    ? sweep.points.map((p, i) => ({ ...p, params: { ...p.params, [POINT_AXIS]: i } }))
    : null;
  return (
    <Card aria-labelledby="sweep-title">
      <CardHeader
        eyebrow={isList ? "Points" : "Sweep"}
        title={
          <span id="sweep-title">
            {isList
              ? `Values at the listed bindings${names.length ? ` of ${names.join(", ")}` : ""}`
              : `Landscape over ${names.join(" × ")}`}{" "}
            <span className="figures font-normal text-ink-3">
              · {plural(sweep.points.length, "point")}
            </span>
          </span>
        }
        actions={
          <Button
            variant="ghost"
            size="sm"
            icon={<IconDownload />}
            onClick={() =>
              downloadBlob(
                pointsCsv(sweep),
                `${fileStem}-${isList ? "points" : "sweep"}.csv`,
                MIME.csv,
              )
            }
          >
            {isList ? "Points (CSV)" : "Sweep (CSV)"}
          </Button>
        }
      />
      <CardBody className="grid gap-4">
        {indexed ? (
          <SweepLineChart points={indexed} name={POINT_AXIS} noisy={noisy} />
        ) : names.length === 1 ? (
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
            Minimum of the {heat ? metric : "exact"} value:{" "}
            <Value value={metricOf(min, heat ? metric : "exact")} tone="exact" size="sm" /> at{" "}
            <span className="figures text-ink">
              {isList ? `point ${iMin}${names.length ? ": " : ""}` : ""}
              {names.map((n) => `${n} = ${formatSignificant(min.params[n], 6)}`).join(", ")}
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
                  {isList ? <TH numeric>#</TH> : null}
                  {names.map((n) => (
                    <TH key={n} numeric>
                      {n}
                    </TH>
                  ))}
                  {noisy ? <TH numeric>Ideal</TH> : null}
                  <TH numeric>{noisy ? "Exact (noise)" : "Exact"}</TH>
                  {hasSampled ? <TH numeric>Sampled</TH> : null}
                  {gradientNames.map((n) => (
                    <TH key={`d-${n}`} numeric>
                      ∂/∂{n}
                    </TH>
                  ))}
                </TR>
              </THead>
              <TBody>
                {sweep.points.map((p, i) => (
                  <TR key={i} aria-selected={i === iMin || undefined}>
                    {isList ? <TD numeric>{i}</TD> : null}
                    {names.map((n) => (
                      <TD key={n} numeric>
                        {formatSignificant(p.params[n], 6)}
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
                    {gradientNames.map((n) => (
                      <TD key={`d-${n}`} numeric>
                        <GradientValue entry={p.gradient?.[n]} />
                      </TD>
                    ))}
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

/** The compared runs' values on one shared number line, with its legend. */
import { CompareChart, type CompareRow } from "@/components/charts/compare-chart";
import { LegendKey, colors } from "@/components/charts/chart-frame";
import { Card, CardBody, CardHeader } from "@/components/ui/card";

export function CompareChartCard({ rows }: { rows: CompareRow[] }) {
  return (
    <Card>
      <CardHeader
        eyebrow="Compare"
        title="On one number line"
        actions={
          <div className="flex flex-wrap gap-3 text-xs text-ink-2">
            <LegendKey color={colors.exact} label="exact" />
            <LegendKey color={colors.ideal} kind="dash" label="ideal (if noise)" />
            <LegendKey color={colors.sampled} kind="band" label="sampled 95 %" />
            <LegendKey color={colors.mitigated} kind="band" label="mitigated 95 %" />
          </div>
        }
      />
      <CardBody>
        <CompareChart rows={rows} />
      </CardBody>
    </Card>
  );
}

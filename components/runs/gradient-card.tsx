/**
 * Gradient of a run's expectation value at its single point: one row per declared input,
 * the exact derivative (of the value under the noise model) and, when shots were drawn,
 * the parameter-shift estimate with its standard error.
 */
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { Table, TBody, TD, TH, THead, TR } from "@/components/ui/table";
import { Value } from "@/components/ui/value";
import { plural } from "@/lib/format";

type Entry = { exact: number; sampled?: { mean: number; stdErr: number } };

/** One derivative: the exact value, then the sampled one ± its standard error. */
export function GradientValue({ entry }: { entry: Entry | undefined }) {
  if (!entry) return <>—</>;
  return (
    <span className="inline-flex flex-col items-end">
      <Value value={entry.exact} size="sm" tone="exact" />
      {entry.sampled ? (
        <Value
          value={entry.sampled.mean}
          uncertainty={entry.sampled.stdErr}
          size="sm"
          tone="sampled"
        />
      ) : null}
    </span>
  );
}

export function GradientCard({
  gradient,
  shots,
  noisy,
  pointLabel,
}: {
  gradient: Record<string, Entry>;
  shots: number | undefined;
  noisy: boolean;
  pointLabel: string | null;
}) {
  const names = Object.keys(gradient);
  const sampled = names.some((n) => gradient[n].sampled);
  return (
    <Card aria-labelledby="gradient-title">
      <CardHeader
        eyebrow="Gradient"
        title={<span id="gradient-title">Derivatives with respect to the inputs</span>}
        description={
          `${noisy ? "Exact derivatives of the value under the noise model" : "Exact derivatives (adjoint method)"}` +
          (sampled
            ? `; sampled by parameter-shift rules from ${plural(shots ?? 0, "extra shot")}, ± one standard error`
            : "") +
          (pointLabel ? ` — at ${pointLabel}` : "") +
          "."
        }
      />
      <CardBody>
        <Table data-testid="gradient-table">
          <THead>
            <TR>
              <TH>Input</TH>
              <TH numeric>Exact ∂⟨A⟩/∂input</TH>
              {sampled ? <TH numeric>Sampled</TH> : null}
            </TR>
          </THead>
          <TBody>
            {names.map((n) => (
              <TR key={n}>
                <TD>
                  <span className="figures">{n}</span>
                </TD>
                <TD numeric>
                  <Value value={gradient[n].exact} size="sm" tone="exact" />
                </TD>
                {sampled ? (
                  <TD numeric>
                    {gradient[n].sampled ? (
                      <Value
                        value={gradient[n].sampled!.mean}
                        uncertainty={gradient[n].sampled!.stdErr}
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
      </CardBody>
    </Card>
  );
}

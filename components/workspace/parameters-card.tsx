"use client";
/**
 * Values of the circuit's OpenQASM 3 inputs, and the sweep: up to two inputs can each
 * take evenly spaced values over a range (a line for one, a grid for two). Angles are in
 * radians; "pi" may be typed as a number only (e.g. 3.14159), the range fields accept the
 * same plain numbers. Or an explicit list of points (JSON), and the gradient toggle.
 */
import { Controller, useFormContext } from "react-hook-form";
import { Checkbox } from "@/components/ui/checkbox";
import { Textarea } from "@/components/ui/textarea";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { Field } from "@/components/ui/field";
import { Input } from "@/components/ui/input";
import { linspace, parseNumber, type RunBuilderValues } from "./run-builder-model";
import { formatSignificant, plural } from "@/lib/format";

const MAX_AXES = 2;

function sweepSummary(a: RunBuilderValues["sweepAxes"][number]): string | null {
  const from = parseNumber(a.from);
  const to = parseNumber(a.to);
  const n = parseNumber(a.points);
  if (from === null || to === null || n === null || [from, to, n].some(Number.isNaN) || n < 1)
    return null;
  const values = linspace(from, to, Math.round(n));
  const step = values.length > 1 ? values[1] - values[0] : 0;
  return `${plural(values.length, "value")}${values.length > 1 ? `, step ${formatSignificant(step, 4)}` : ""}`;
}

export function ParametersCard({
  inputs,
  readOnly,
}: {
  inputs: { name: string; type: string }[];
  readOnly?: boolean;
}) {
  const { register, watch, setValue, formState, control } = useFormContext<RunBuilderValues>();
  const axes = watch("sweepAxes");
  const errors = formState.errors;
  const sweptIndex = (name: string) => axes.findIndex((a) => a.name === name);

  const startSweep = (name: string) => {
    if (axes.length >= MAX_AXES) return;
    const cur = parseNumber(watch(`parameters.${name}`) ?? "");
    const from = cur !== null && !Number.isNaN(cur) ? cur : 0;
    setValue(
      "sweepAxes",
      [
        ...axes,
        {
          name,
          from: String(from),
          to: String(Number((from + Math.PI).toFixed(5))),
          points: axes.length ? "11" : "21",
        },
      ],
      { shouldDirty: true },
    );
  };
  const stopSweep = (name: string) =>
    setValue(
      "sweepAxes",
      axes.filter((a) => a.name !== name),
      { shouldDirty: true },
    );

  return (
    <Card>
      <CardHeader
        title="Parameters"
        description={
          <>
            Values of the circuit’s <code className="font-mono text-[12px]">input</code>{" "}
            declarations, in radians. Sweep one input for a line chart, two for a heat map of the
            landscape.
          </>
        }
      />
      <CardBody>
        <ul className="grid gap-3">
          {inputs.map((input) => {
            const i = sweptIndex(input.name);
            const swept = i >= 0;
            const axisErr = swept ? errors.sweepAxes?.[i] : undefined;
            const summary = swept ? sweepSummary(axes[i]) : null;
            return (
              <li
                key={input.name}
                className="grid gap-3 rounded-md border border-line p-3 sm:grid-cols-[10rem_minmax(0,1fr)_auto] sm:items-start"
              >
                <div className="flex items-center gap-2 pt-1.5">
                  <span className="font-mono text-sm font-semibold text-ink">{input.name}</span>
                  <Badge>{input.type}</Badge>
                  {swept ? <Badge tone="accent">sweep</Badge> : null}
                </div>
                {swept ? (
                  <div className="grid gap-2">
                    <div className="grid grid-cols-3 gap-2">
                      <Field label="From" error={axisErr?.from?.message}>
                        <Input
                          mono
                          size="sm"
                          inputMode="decimal"
                          readOnly={readOnly}
                          {...register(`sweepAxes.${i}.from`)}
                        />
                      </Field>
                      <Field label="To" error={axisErr?.to?.message}>
                        <Input
                          mono
                          size="sm"
                          inputMode="decimal"
                          readOnly={readOnly}
                          {...register(`sweepAxes.${i}.to`)}
                        />
                      </Field>
                      <Field
                        label="Points"
                        error={axisErr?.points?.message ?? axisErr?.name?.message}
                      >
                        <Input
                          mono
                          size="sm"
                          inputMode="numeric"
                          readOnly={readOnly}
                          {...register(`sweepAxes.${i}.points`)}
                        />
                      </Field>
                    </div>
                    {summary ? <p className="figures text-xs text-ink-3">{summary}</p> : null}
                  </div>
                ) : (
                  <Field
                    label={`Value of ${input.name}`}
                    error={errors.parameters?.[input.name]?.message}
                  >
                    <Input
                      mono
                      size="sm"
                      inputMode="decimal"
                      readOnly={readOnly}
                      {...register(`parameters.${input.name}`)}
                    />
                  </Field>
                )}
                {readOnly ? null : swept ? (
                  <Button
                    variant="ghost"
                    size="sm"
                    className="sm:mt-6"
                    onClick={() => stopSweep(input.name)}
                  >
                    Fixed value
                  </Button>
                ) : (
                  <Button
                    variant="secondary"
                    size="sm"
                    className="sm:mt-6"
                    disabled={axes.length >= MAX_AXES}
                    title={axes.length >= MAX_AXES ? "At most two inputs can be swept" : undefined}
                    onClick={() => startSweep(input.name)}
                  >
                    Sweep
                  </Button>
                )}
              </li>
            );
          })}
        </ul>
        {typeof errors.sweepAxes?.message === "string" ? (
          <p className="mt-2 text-[12.5px] text-danger">{errors.sweepAxes.message}</p>
        ) : null}
        <div className="mt-4 grid gap-3">
          <Field
            label="Points"
            optional
            hint='Instead of a sweep: a JSON list of bindings evaluated in order, e.g. [{"theta": 0.1}, {"theta": 0.4}] (up to 10,000; inputs left out take the values above).'
            error={errors.pointsText?.message}
          >
            <Textarea
              mono
              rows={3}
              readOnly={readOnly}
              disabled={axes.length > 0}
              placeholder={axes.length > 0 ? "not with a sweep" : "[]"}
              {...register("pointsText")}
            />
          </Field>
          <Controller
            control={control}
            name="gradient"
            render={({ field }) => (
              <Checkbox
                label="Gradient"
                description="Also compute d⟨A⟩/d(input) for every input: exact by the adjoint method, and with shots by parameter-shift rules (extra shifted circuits, counted in the shots)."
                checked={field.value}
                disabled={readOnly}
                onChange={(ev) => field.onChange(ev.target.checked)}
              />
            )}
          />
        </div>
      </CardBody>
    </Card>
  );
}

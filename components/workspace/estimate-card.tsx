"use client";
/**
 * How to estimate: simulation method, the shot budget (exact only, a number of shots, or
 * a target standard error that chooses the shots), the split over measurement settings,
 * the seed and readout mitigation.
 */
import { Controller, useFormContext } from "react-hook-form";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { Checkbox } from "@/components/ui/checkbox";
import { Field } from "@/components/ui/field";
import { Input } from "@/components/ui/input";
import { Select } from "@/components/ui/select";
import { RUN_METHOD_LABELS } from "@/lib/runs/constants";
import type { RunBuilderValues } from "./run-builder-model";
import { Segmented } from "@/components/ui/segmented";

export function EstimateCard({ readOnly }: { readOnly?: boolean }) {
  const { control, register, watch, formState } = useFormContext<RunBuilderValues>();
  const budget = watch("budget");
  const e = formState.errors;
  return (
    <Card>
      <CardHeader
        title="Estimate"
        description="Exact values are always computed; shots add the sampled estimate with its error bar."
      />
      <CardBody className="grid gap-4">
        <div className="flex flex-wrap gap-x-6 gap-y-4">
          <Controller
            control={control}
            name="method"
            render={({ field }) => (
              <Segmented
                legend="Method"
                value={field.value}
                onChange={field.onChange}
                options={[
                  {
                    value: "statevector",
                    label: RUN_METHOD_LABELS.statevector,
                    hint: "Pure state, fastest; no gate noise",
                  },
                  {
                    value: "density_matrix",
                    label: RUN_METHOD_LABELS.density_matrix,
                    hint: "Mixed state; needed for gate noise",
                  },
                ]}
              />
            )}
          />
          <Controller
            control={control}
            name="budget"
            render={({ field }) => (
              <Segmented
                legend="Shots"
                value={field.value}
                onChange={field.onChange}
                options={[
                  { value: "exact", label: "Exact only" },
                  { value: "shots", label: "Number of shots" },
                  { value: "precision", label: "Target precision" },
                ]}
              />
            )}
          />
        </div>
        {budget === "exact" ? null : (
          <div className="grid gap-4 sm:grid-cols-3">
            {budget === "shots" ? (
              <Field
                label="Total shots"
                hint="Over all measurement settings."
                error={e.shots?.message}
              >
                <Input
                  mono
                  inputMode="numeric"
                  autoComplete="off"
                  readOnly={readOnly}
                  {...register("shots")}
                />
              </Field>
            ) : (
              <Field
                label="Target standard error"
                hint="Shots are chosen to reach it (e.g. 0.0016 ≈ 1 kcal/mol in hartree)."
                error={e.targetPrecision?.message}
              >
                <Input
                  mono
                  inputMode="decimal"
                  autoComplete="off"
                  readOnly={readOnly}
                  {...register("targetPrecision")}
                />
              </Field>
            )}
            <Field label="Shot split" hint="Optimal puts shots where the variance is.">
              <Select
                disabled={readOnly}
                options={[
                  { value: "optimal", label: "Optimal (∝ √variance)" },
                  { value: "even", label: "Even per setting" },
                ]}
                {...register("shotSplit")}
              />
            </Field>
            <Field
              label="Seed"
              optional
              hint="Same seed, same numbers. Blank: one is chosen and kept."
              error={e.seed?.message}
            >
              <Input
                mono
                inputMode="numeric"
                autoComplete="off"
                placeholder="random"
                readOnly={readOnly}
                {...register("seed")}
              />
            </Field>
            <Controller
              control={control}
              name="mitigateReadout"
              render={({ field }) => (
                <div className="grid gap-1 sm:col-span-3">
                  <Checkbox
                    label="Mitigate readout error"
                    description="Also report the value corrected by inverting the readout error of the noise model (needs p1Given0 + p0Given1 < 1)."
                    checked={field.value}
                    disabled={readOnly}
                    aria-invalid={!!e.mitigateReadout}
                    onChange={(ev) => field.onChange(ev.target.checked)}
                  />
                  {e.mitigateReadout?.message ? (
                    <p role="alert" className="pl-6.5 text-[13px] leading-5 text-danger">
                      {e.mitigateReadout.message}
                    </p>
                  ) : null}
                </div>
              )}
            />
          </div>
        )}
      </CardBody>
    </Card>
  );
}

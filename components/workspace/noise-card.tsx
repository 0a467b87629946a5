"use client";
/**
 * Noise model of the run: the six probabilities with plain-language help, starting
 * profiles, and the organisation's saved profiles (when `profiles` is given).
 */
import { Controller, useFormContext } from "react-hook-form";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { Checkbox } from "@/components/ui/checkbox";
import { Field } from "@/components/ui/field";
import { Input } from "@/components/ui/input";
import { Select } from "@/components/ui/select";
import type { RunBuilderValues } from "./run-builder-model";
import { NoiseAdvanced } from "./noise-advanced";
import { advancedStateNoise, EMPTY_ADVANCED_NOISE } from "./noise-advanced-model";
import {
  BUILT_IN_PROFILES,
  NOISE_FIELDS,
  type NoiseKey,
  type NoiseProfile,
  type NoiseProfileValues,
} from "./noise-help";

const path = (k: NoiseKey) =>
  (k === "p1Given0" || k === "p0Given1" ? `noise.readout.${k}` : `noise.${k}`) as
    "noise.depolarizing1q" | "noise.readout.p1Given0";

export function currentNoiseValues(v: RunBuilderValues["noise"]): NoiseProfileValues {
  return {
    depolarizing1q: v.depolarizing1q,
    depolarizing2q: v.depolarizing2q,
    amplitudeDamping: v.amplitudeDamping,
    phaseDamping: v.phaseDamping,
    p1Given0: v.readout.p1Given0,
    p0Given1: v.readout.p0Given1,
  };
}

export function NoiseCard({
  readOnly,
  profiles = [],
  profilesSlot,
}: {
  readOnly?: boolean;
  /** The organisation's saved profiles, listed after the built-in ones. */
  profiles?: NoiseProfile[];
  /** Save / manage controls for saved profiles. */
  profilesSlot?: React.ReactNode;
}) {
  const { control, register, watch, setValue, formState } = useFormContext<RunBuilderValues>();
  const enabled = watch("noiseEnabled");
  const method = watch("method");
  const noise = watch("noise");
  const errors = formState.errors.noise;
  const gateNoise =
    NOISE_FIELDS.some((f) => f.gate && Number(noise[f.key as "depolarizing1q"]) > 0) ||
    advancedStateNoise(noise);
  const all = [...BUILT_IN_PROFILES, ...profiles];

  const apply = (id: string) => {
    const p = all.find((x) => x.id === id);
    if (!p) return;
    for (const f of NOISE_FIELDS) setValue(path(f.key), p.values[f.key], { shouldDirty: true });
    const advanced = p.advanced ?? EMPTY_ADVANCED_NOISE;
    setValue("noise.perQubit", advanced.perQubit, { shouldDirty: true });
    setValue("noise.gates", advanced.gates, { shouldDirty: true });
    setValue("noise.idle", advanced.idle, { shouldDirty: true });
    const hasGate =
      NOISE_FIELDS.some((f) => f.gate && Number(p.values[f.key]) > 0) ||
      advancedStateNoise(advanced);
    if (hasGate) setValue("method", "density_matrix", { shouldDirty: true });
  };

  return (
    <Card>
      <CardHeader
        title="Noise model"
        description="What a noisy device might report. Probabilities between 0 and 1; blank means none."
      />
      <CardBody className="grid gap-4">
        <Controller
          control={control}
          name="noiseEnabled"
          render={({ field }) => (
            <Checkbox
              label="Add a noise model"
              description="Gate noise needs the density-matrix method; readout error works with both."
              checked={field.value}
              disabled={readOnly}
              onChange={(e) => field.onChange(e.target.checked)}
            />
          )}
        />
        {enabled ? (
          <>
            <div className="flex flex-wrap items-end gap-3">
              <Field label="Start from a profile" className="min-w-64 flex-1">
                <Select
                  placeholder="Choose a profile…"
                  defaultValue=""
                  disabled={readOnly}
                  onChange={(e) => apply(e.target.value)}
                >
                  <optgroup label="Starting points">
                    {BUILT_IN_PROFILES.map((p) => (
                      <option key={p.id} value={p.id}>
                        {p.name}
                      </option>
                    ))}
                  </optgroup>
                  {profiles.length ? (
                    <optgroup label="Saved in this organisation">
                      {profiles.map((p) => (
                        <option key={p.id} value={p.id}>
                          {p.name}
                        </option>
                      ))}
                    </optgroup>
                  ) : null}
                </Select>
              </Field>
              {profilesSlot}
            </div>
            <div className="grid gap-4 sm:grid-cols-2">
              {NOISE_FIELDS.map((f) => {
                const err =
                  f.key === "p1Given0" || f.key === "p0Given1"
                    ? errors?.readout?.[f.key]?.message
                    : errors?.[f.key as "depolarizing1q"]?.message;
                return (
                  <Field
                    key={f.key}
                    label={
                      <>
                        {f.label} <span className="figures font-normal text-ink-3">{f.symbol}</span>
                      </>
                    }
                    hint={f.help}
                    error={err}
                  >
                    <Input
                      mono
                      inputMode="decimal"
                      autoComplete="off"
                      placeholder="0"
                      readOnly={readOnly}
                      {...register(path(f.key))}
                    />
                  </Field>
                );
              })}
            </div>
            <NoiseAdvanced readOnly={readOnly} />
            {gateNoise && method === "statevector" ? (
              <Alert
                tone="warning"
                compact
                title="Gate noise needs the density-matrix method"
                actions={
                  <Button
                    size="sm"
                    variant="secondary"
                    onClick={() => setValue("method", "density_matrix", { shouldDirty: true })}
                  >
                    Use density matrix
                  </Button>
                }
              >
                A statevector holds a pure state; depolarizing and damping channels make it mixed.
              </Alert>
            ) : null}
          </>
        ) : null}
      </CardBody>
    </Card>
  );
}

"use client";
/**
 * The per-qubit and per-gate part of the noise card: readout rates of single qubits,
 * rate overrides by gate name, and idle noise (off unless set). Form ⇄ request in
 * noise-advanced-model.ts; help texts in noise-help.ts.
 */
import { useFieldArray, useFormContext } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { IconClose, IconPlus } from "@/components/ui/icons";
import { Input } from "@/components/ui/input";
import type { ComposerValues } from "./composer-model";
import { ADVANCED_NOISE_HELP } from "./noise-help";

type NoiseErrors = Record<string, unknown> | undefined;

/** Message of a nested rhf error, e.g. at ["gates", 0, "name"]. */
function errorAt(errors: NoiseErrors, path: (string | number)[]): string | undefined {
  let e: unknown = errors;
  for (const k of path)
    e = e && typeof e === "object" ? (e as Record<string | number, unknown>)[k] : undefined;
  const m = e && typeof e === "object" ? (e as { message?: unknown }).message : undefined;
  return typeof m === "string" ? m : undefined;
}

function Rate({
  label,
  name,
  readOnly,
  error,
}: {
  label: string;
  name: `noise.${string}`;
  readOnly?: boolean;
  error?: string;
}) {
  const { register } = useFormContext<ComposerValues>();
  return (
    <Field label={label} error={error} className="min-w-24 flex-1">
      <Input
        mono
        inputMode="decimal"
        autoComplete="off"
        placeholder="—"
        readOnly={readOnly}
        {...register(name as "noise.depolarizing1q")}
      />
    </Field>
  );
}

function RemoveButton({
  onClick,
  label,
  disabled,
}: {
  onClick: () => void;
  label: string;
  disabled?: boolean;
}) {
  return (
    <Button
      variant="ghost"
      size="icon-sm"
      aria-label={label}
      disabled={disabled}
      onClick={onClick}
      className="mb-0.5"
    >
      <IconClose className="size-4" />
    </Button>
  );
}

export function NoiseAdvanced({ readOnly }: { readOnly?: boolean }) {
  const { control, register, formState } = useFormContext<ComposerValues>();
  const errors = formState.errors.noise as NoiseErrors;
  const perQubit = useFieldArray({ control, name: "noise.perQubit" });
  const gates = useFieldArray({ control, name: "noise.gates" });

  return (
    <div className="grid gap-5 border-t border-line pt-4">
      <section className="grid gap-2" aria-label="Readout per qubit">
        <div>
          <h3 className="text-[13px] font-semibold text-ink">Readout per qubit</h3>
          <p className="text-xs text-ink-3">{ADVANCED_NOISE_HELP.perQubit}</p>
          {errorAt(errors, ["perQubit"]) ? (
            <p className="text-xs text-danger">{errorAt(errors, ["perQubit"])}</p>
          ) : null}
        </div>
        {perQubit.fields.map((f, i) => (
          <div key={f.id} className="flex flex-wrap items-end gap-2">
            <Field label="Qubit" error={errorAt(errors, ["perQubit", i, "qubit"])} className="w-20">
              <Input
                mono
                inputMode="numeric"
                autoComplete="off"
                readOnly={readOnly}
                {...register(`noise.perQubit.${i}.qubit`)}
              />
            </Field>
            <Rate
              label="Read 1 from 0"
              name={`noise.perQubit.${i}.p1Given0`}
              readOnly={readOnly}
              error={errorAt(errors, ["perQubit", i, "p1Given0"])}
            />
            <Rate
              label="Read 0 from 1"
              name={`noise.perQubit.${i}.p0Given1`}
              readOnly={readOnly}
              error={errorAt(errors, ["perQubit", i, "p0Given1"])}
            />
            <RemoveButton
              label={`Remove the readout rates of row ${i + 1}`}
              disabled={readOnly}
              onClick={() => perQubit.remove(i)}
            />
          </div>
        ))}
        <div>
          <Button
            variant="secondary"
            size="sm"
            disabled={readOnly}
            icon={<IconPlus className="size-4" />}
            onClick={() =>
              perQubit.append({ qubit: String(perQubit.fields.length), p1Given0: "", p0Given1: "" })
            }
          >
            Add a qubit
          </Button>
        </div>
      </section>

      <section className="grid gap-2" aria-label="Noise per gate">
        <div>
          <h3 className="text-[13px] font-semibold text-ink">Noise per gate</h3>
          <p className="text-xs text-ink-3">{ADVANCED_NOISE_HELP.gates}</p>
          {errorAt(errors, ["gates"]) ? (
            <p className="text-xs text-danger">{errorAt(errors, ["gates"])}</p>
          ) : null}
        </div>
        {gates.fields.map((f, i) => (
          <div key={f.id} className="flex flex-wrap items-end gap-2">
            <Field label="Gate" error={errorAt(errors, ["gates", i, "name"])} className="w-32">
              <Input
                mono
                autoComplete="off"
                placeholder="cx"
                readOnly={readOnly}
                {...register(`noise.gates.${i}.name`)}
              />
            </Field>
            <Rate
              label="Depolarizing"
              name={`noise.gates.${i}.depolarizing`}
              readOnly={readOnly}
              error={errorAt(errors, ["gates", i, "depolarizing"])}
            />
            <Rate
              label="Amplitude damping"
              name={`noise.gates.${i}.amplitudeDamping`}
              readOnly={readOnly}
              error={errorAt(errors, ["gates", i, "amplitudeDamping"])}
            />
            <Rate
              label="Phase damping"
              name={`noise.gates.${i}.phaseDamping`}
              readOnly={readOnly}
              error={errorAt(errors, ["gates", i, "phaseDamping"])}
            />
            <RemoveButton
              label={`Remove the override of row ${i + 1}`}
              disabled={readOnly}
              onClick={() => gates.remove(i)}
            />
          </div>
        ))}
        <div>
          <Button
            variant="secondary"
            size="sm"
            disabled={readOnly}
            icon={<IconPlus className="size-4" />}
            onClick={() =>
              gates.append({ name: "", depolarizing: "", amplitudeDamping: "", phaseDamping: "" })
            }
          >
            Add a gate
          </Button>
        </div>
      </section>

      <section className="grid gap-2" aria-label="Idle noise">
        <div>
          <h3 className="text-[13px] font-semibold text-ink">Idle noise</h3>
          <p className="text-xs text-ink-3">{ADVANCED_NOISE_HELP.idle}</p>
        </div>
        <div className="flex flex-wrap items-end gap-2">
          <Rate
            label="Depolarizing"
            name="noise.idle.depolarizing"
            readOnly={readOnly}
            error={errorAt(errors, ["idle", "depolarizing"])}
          />
          <Rate
            label="Amplitude damping"
            name="noise.idle.amplitudeDamping"
            readOnly={readOnly}
            error={errorAt(errors, ["idle", "amplitudeDamping"])}
          />
          <Rate
            label="Phase damping"
            name="noise.idle.phaseDamping"
            readOnly={readOnly}
            error={errorAt(errors, ["idle", "phaseDamping"])}
          />
        </div>
      </section>
    </div>
  );
}

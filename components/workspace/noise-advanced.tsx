"use client";
/**
 * The per-qubit and per-gate part of the noise card: readout rates of single qubits,
 * rate overrides by gate name, and idle noise (off unless set). Form ⇄ request in
 * noise-advanced-model.ts; help texts in noise-help.ts.
 */
import {
  useFieldArray,
  useFormContext,
  type FieldArray,
  type FieldArrayPath,
  type Path,
} from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { IconClose, IconPlus } from "@/components/ui/icons";
import { Input } from "@/components/ui/input";
import type { RunBuilderValues } from "./run-builder-model";
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
  const { register } = useFormContext<RunBuilderValues>();
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

/** A column of a row editor: the row's key (qubit, gate name) or one of its rates. */
type Column =
  | { field: string; label: string; kind: "rate" }
  | {
      field: string;
      label: string;
      kind: "key";
      className: string;
      inputMode?: "numeric";
      placeholder?: string;
    };

type RowList = Extract<FieldArrayPath<RunBuilderValues>, `noise.${string}`>;

/**
 * One list of noise rows (readout per qubit, overrides per gate): heading, help, the
 * list's own error, a row of inputs per entry with its remove button, and an add button.
 */
function RowEditor<N extends RowList>({
  name,
  title,
  help,
  columns,
  removeLabel,
  addLabel,
  newRow,
  readOnly,
}: {
  name: N;
  title: string;
  help: string;
  columns: Column[];
  removeLabel: (row: number) => string;
  addLabel: string;
  /** The appended row; `count` is the number of rows before it. */
  newRow: (count: number) => FieldArray<RunBuilderValues, N>;
  readOnly?: boolean;
}) {
  const { control, register, formState } = useFormContext<RunBuilderValues>();
  const errors = formState.errors.noise as NoiseErrors;
  const rows = useFieldArray<RunBuilderValues, N>({ control, name });
  const list = name.slice("noise.".length);
  return (
    <section className="grid gap-2" aria-label={title}>
      <div>
        <h3 className="text-[13px] font-semibold text-ink">{title}</h3>
        <p className="text-xs text-ink-3">{help}</p>
        {errorAt(errors, [list]) ? (
          <p className="text-xs text-danger">{errorAt(errors, [list])}</p>
        ) : null}
      </div>
      {rows.fields.map((f, i) => (
        <div key={f.id} className="flex flex-wrap items-end gap-2">
          {columns.map((c) =>
            c.kind === "key" ? (
              <Field
                key={c.field}
                label={c.label}
                error={errorAt(errors, [list, i, c.field])}
                className={c.className}
              >
                <Input
                  mono
                  inputMode={c.inputMode}
                  autoComplete="off"
                  placeholder={c.placeholder}
                  readOnly={readOnly}
                  {...register(`${name}.${i}.${c.field}` as Path<RunBuilderValues>)}
                />
              </Field>
            ) : (
              <Rate
                key={c.field}
                label={c.label}
                name={`${name}.${i}.${c.field}` as `noise.${string}`}
                readOnly={readOnly}
                error={errorAt(errors, [list, i, c.field])}
              />
            ),
          )}
          <RemoveButton
            label={removeLabel(i + 1)}
            disabled={readOnly}
            onClick={() => rows.remove(i)}
          />
        </div>
      ))}
      <div>
        <Button
          variant="secondary"
          size="sm"
          disabled={readOnly}
          icon={<IconPlus className="size-4" />}
          onClick={() => rows.append(newRow(rows.fields.length))}
        >
          {addLabel}
        </Button>
      </div>
    </section>
  );
}

export function NoiseAdvanced({ readOnly }: { readOnly?: boolean }) {
  const { formState } = useFormContext<RunBuilderValues>();
  const errors = formState.errors.noise as NoiseErrors;

  return (
    <div className="grid gap-5 border-t border-line pt-4">
      <RowEditor
        name="noise.perQubit"
        title="Readout per qubit"
        help={ADVANCED_NOISE_HELP.perQubit}
        columns={[
          { field: "qubit", label: "Qubit", kind: "key", className: "w-20", inputMode: "numeric" },
          { field: "p1Given0", label: "Read 1 from 0", kind: "rate" },
          { field: "p0Given1", label: "Read 0 from 1", kind: "rate" },
        ]}
        removeLabel={(row) => `Remove the readout rates of row ${row}`}
        addLabel="Add a qubit"
        newRow={(count) => ({ qubit: String(count), p1Given0: "", p0Given1: "" })}
        readOnly={readOnly}
      />
      <RowEditor
        name="noise.gates"
        title="Noise per gate"
        help={ADVANCED_NOISE_HELP.gates}
        columns={[
          { field: "name", label: "Gate", kind: "key", className: "w-32", placeholder: "cx" },
          { field: "depolarizing", label: "Depolarizing", kind: "rate" },
          { field: "amplitudeDamping", label: "Amplitude damping", kind: "rate" },
          { field: "phaseDamping", label: "Phase damping", kind: "rate" },
        ]}
        removeLabel={(row) => `Remove the override of row ${row}`}
        addLabel="Add a gate"
        newRow={() => ({ name: "", depolarizing: "", amplitudeDamping: "", phaseDamping: "" })}
        readOnly={readOnly}
      />

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

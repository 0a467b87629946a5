"use client";
/**
 * Keeps the form in step with the circuit's inputs: a new input starts at 0 (as the diagram
 * draws it), and sweeps over inputs the circuit no longer declares are dropped.
 */
import { useEffect, useRef } from "react";
import type { UseFormReturn } from "react-hook-form";
import type { RunBuilderValues } from "./run-builder-model";
import type { RunBuilderContext, RunBuilderOutput } from "./run-builder-resolver";

export function useInputDefaults(
  outline: { inputs: readonly { name: string }[] } | null,
  form: UseFormReturn<RunBuilderValues, RunBuilderContext, RunBuilderOutput>,
) {
  const { setValue } = form;
  const seenInputs = useRef(new Set<string>());
  useEffect(() => {
    if (!outline) return;
    const names = outline.inputs.map((i) => i.name);
    for (const n of names) {
      if (seenInputs.current.has(n)) continue;
      seenInputs.current.add(n);
      // A registered but never-typed field reads "" — start it at 0 like the diagram does.
      if (!form.getValues(`parameters.${n}`)) setValue(`parameters.${n}`, "0");
    }
    const axes = form.getValues("sweepAxes");
    if (axes.some((a) => !names.includes(a.name)))
      setValue(
        "sweepAxes",
        axes.filter((a) => names.includes(a.name)),
      );
  }, [outline, form, setValue]);
}

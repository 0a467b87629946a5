/**
 * react-hook-form resolver of the run builder: form text → request (run-builder-model), then
 * the ONE shared schema of `POST /api/v1/runs` (runCreateSchema, the same zod schema the
 * API and the OpenAPI document use). Issues are put on the fields that show them.
 */
import { toNestErrors } from "@hookform/resolvers";
import type { FieldError, Resolver } from "react-hook-form";
import { runCreateSchema, type RunCreateInput } from "@/lib/runs/schemas";
import { formPath, toRequest, type RunBuilderValues, type FormIssue } from "./run-builder-model";

export type RunBuilderContext = { inputNames: readonly string[] | undefined };

export type RunBuilderOutput = { body: RunCreateInput };

/** Issues (request or form paths) → a flat `{ path: FieldError }` record, first message per field. */
export function issuesToFlat(
  issues: FormIssue[],
  swept: readonly string[],
): Record<string, FieldError> {
  const flat: Record<string, FieldError> = {};
  for (const i of issues) {
    const path = formPath(i.path, swept);
    flat[path] ??= { type: "validate", message: i.message };
  }
  return flat;
}

export const runBuilderResolver: Resolver<
  RunBuilderValues,
  RunBuilderContext,
  RunBuilderOutput
> = async (values, context, options) => {
  const { request, name, issues } = toRequest(values, context?.inputNames);
  const swept = values.sweepAxes.map((a) => a.name);
  const all: FormIssue[] = [...issues];
  const parsed = runCreateSchema.safeParse(name ? { ...request, name } : request);
  if (!parsed.success) {
    for (const i of parsed.error.issues)
      all.push({ path: i.path.map(String).join("."), message: i.message });
  }
  if (all.length || !parsed.success) {
    return {
      values: {} as Record<string, never>,
      errors: toNestErrors(issuesToFlat(all, swept), options),
    };
  }
  return { values: { body: parsed.data }, errors: {} };
};

/**
 * Parameter schemas for form-encoded requests. Every value arrives as a
 * string; these helpers coerce and validate it and turn the first problem
 * into the provider's 400 error naming the parameter in bracket form
 * (`line_items[0][quantity]`). Unknown parameters are refused rather than
 * silently ignored, so an app relying on something this fake does not do
 * finds out at once.
 */
import { z } from "zod";
import { ApiError } from "../core/errors";

export function paramName(path: PropertyKey[]): string {
  return path.map((p, i) => (i === 0 ? String(p) : `[${String(p)}]`)).join("");
}

/** Parses `input` with `schema` or throws the provider-shaped 400. */
export function parseParams<S extends z.ZodType>(schema: S, input: unknown): z.output<S> {
  const result = schema.safeParse(input, { reportInput: true });
  if (result.success) return result.data;
  const issues = result.error.issues;
  const unknown = issues.find((i) => i.code === "unrecognized_keys");
  if (unknown && unknown.code === "unrecognized_keys") {
    const name = paramName([...unknown.path, unknown.keys[0]]);
    throw new ApiError(400, "invalid_request_error", `Received unknown parameter: ${name}`, {
      code: "parameter_unknown",
      param: name,
    });
  }
  const missing = issues.find((i) => i.code === "invalid_type" && i.input === undefined);
  if (missing) {
    const name = paramName(missing.path);
    throw new ApiError(400, "invalid_request_error", `Missing required param: ${name}.`, {
      code: "parameter_missing",
      param: name,
    });
  }
  const first = issues[0];
  const name = paramName(first.path);
  const message = first.code === "custom" ? first.message : `Invalid ${name}: ${first.message}`;
  throw new ApiError(400, "invalid_request_error", message, {
    code: first.code === "invalid_type" ? "parameter_invalid_type" : undefined,
    param: name,
  });
}

/** A required, non-empty string. */
export const str = () =>
  z.string().refine((v) => v.length > 0, { message: "This value must not be empty." });

/** A string where "" means "unset" (the provider's Emptyable), returned as null. */
export const emptyable = () => z.string().transform((v) => (v === "" ? null : v));

export const int = (min = Number.MIN_SAFE_INTEGER, max = Number.MAX_SAFE_INTEGER) =>
  z.string().transform((v, ctx) => {
    if (!/^-?\d+$/.test(v)) {
      ctx.addIssue({ code: "custom", message: `Invalid integer: ${v}` });
      return z.NEVER;
    }
    const n = Number(v);
    if (n < min || n > max) {
      ctx.addIssue({
        code: "custom",
        message: `This value must be between ${min} and ${max} (got ${v}).`,
      });
      return z.NEVER;
    }
    return n;
  });

/** A non-negative decimal number with up to 12 decimal places, kept as its string. */
export const decimal = () =>
  z.string().refine((v) => /^\d+(\.\d{1,12})?$/.test(v), {
    message: "Invalid decimal: must be a non-negative number with at most 12 decimal places.",
  });

export const bool = () =>
  z.string().transform((v, ctx) => {
    if (v === "true") return true;
    if (v === "false") return false;
    ctx.addIssue({ code: "custom", message: `Invalid boolean: ${v}` });
    return z.NEVER;
  });

export const oneOf = <T extends string>(values: readonly T[]) =>
  z.string().transform((v, ctx) => {
    if ((values as readonly string[]).includes(v)) return v as T;
    ctx.addIssue({
      code: "custom",
      message: `Invalid value "${v}": must be one of ${values.join(", ")}.`,
    });
    return z.NEVER;
  });

/** Metadata: `metadata[k]=v` sets, `metadata[k]=` removes a key, `metadata=` clears all. */
export const metadata = () =>
  z.union([
    z.literal(""),
    z.record(z.string(), z.string()).refine((m) => Object.keys(m).length <= 50, {
      message: "Metadata can have at most 50 keys.",
    }),
  ]);

export type MetadataParam = z.output<ReturnType<typeof metadata>>;

/** Applies a metadata parameter to existing metadata. */
export function mergeMetadata(
  current: Record<string, string>,
  update: MetadataParam | undefined,
): Record<string, string> {
  if (update === undefined) return current;
  if (update === "") return {};
  const next = { ...current };
  for (const [k, v] of Object.entries(update)) {
    if (v === "") delete next[k];
    else next[k] = v;
  }
  return next;
}

export const expand = () => z.array(z.string()).max(50).optional();

/** Pagination parameters shared by every list endpoint. */
export const listShape = {
  limit: int(1, 100).optional(),
  starting_after: z.string().optional(),
  ending_before: z.string().optional(),
  expand: expand(),
};

/** `created[gte]=…` style range filters, or an exact `created=…`. */
export const rangeFilter = () =>
  z.union([
    int(0),
    z.strictObject({
      gt: int(0).optional(),
      gte: int(0).optional(),
      lt: int(0).optional(),
      lte: int(0).optional(),
    }),
  ]);

export function inRange(
  value: number,
  range: z.output<ReturnType<typeof rangeFilter>> | undefined,
): boolean {
  if (range === undefined) return true;
  if (typeof range === "number") return value === range;
  if (range.gt !== undefined && !(value > range.gt)) return false;
  if (range.gte !== undefined && !(value >= range.gte)) return false;
  if (range.lt !== undefined && !(value < range.lt)) return false;
  if (range.lte !== undefined && !(value <= range.lte)) return false;
  return true;
}

/** An http(s) URL (the provider refuses anything else for redirect URLs). */
export const url = () =>
  z.string().refine((v) => /^https?:\/\/[^\s]+$/.test(v), { message: "Not a valid URL" });

/**
 * Schemas every API v1 resource shares: the RFC 9457 problem document and the
 * cursor-paginated list envelope. Plain zod; lib/openapi registers them.
 */
import { z } from "zod";

export const problemFieldErrorSchema = z.object({
  path: z
    .string()
    .describe(
      'Dotted path into the request, e.g. "observable.terms" ("(root)" for the whole body)',
    ),
  message: z.string(),
  line: z.int().optional().describe("1-based line in the circuit or observable text"),
  column: z.int().optional().describe("1-based column in the circuit or observable text"),
});

export const problemSchema = z
  .object({
    type: z
      .string()
      .describe("Relative URI naming the kind of problem, e.g. /problems/quota-exceeded"),
    title: z.string(),
    status: z.int(),
    detail: z.string(),
    errors: z.array(problemFieldErrorSchema).optional(),
  })
  .meta({ id: "Problem", description: "RFC 9457 problem details" });

export type ProblemDocument = z.infer<typeof problemSchema>;

/** Opaque cursor from a previous page's `nextCursor`. */
export const cursorParamSchema = z
  .string()
  .min(1)
  .max(200)
  .describe("Opaque cursor from the previous page's nextCursor");

export const limitParamSchema = z.coerce
  .number()
  .int()
  .min(1)
  .max(100)
  .default(20)
  .describe("Page size, 1–100 (default 20)");

export function pageSchema<T extends z.ZodType>(item: T) {
  return z.object({
    data: z.array(item),
    nextCursor: z
      .string()
      .nullable()
      .describe("Pass as `cursor` for the next page; null on the last page"),
  });
}

export const timestampSchema = z.iso
  .datetime({ offset: true })
  .describe("ISO 8601 timestamp (UTC)");

/**
 * The RFC 9457 problem document — `{ type, title, status, detail, errors? }`, media
 * type `application/problem+json` — as ONE zod schema. Everything else derives from
 * it: the server's `Problem` (lib/api/problem.ts), the OpenAPI component `Problem`,
 * the error stored on a failed run (db/schema/runs.ts, a type-only import) and the
 * browser client's parsing of failed answers (lib/swr/api-client.ts).
 *
 * Imports nothing but zod, so db/schema, client code and the OpenAPI build can all
 * import it without pulling in server code.
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

const problemShape = {
  type: z
    .string()
    .describe("Relative URI naming the kind of problem, e.g. /problems/quota-exceeded"),
  title: z.string(),
  status: z.int(),
  detail: z.string(),
  errors: z.array(problemFieldErrorSchema).optional(),
};

export const problemSchema = z
  .object(problemShape)
  .meta({ id: "Problem", description: "RFC 9457 problem details" });

/** One field error of a problem: the path as `formatFieldPath` writes it, line/column for texts. */
export type ProblemFieldError = z.infer<typeof problemFieldErrorSchema>;
/** The problem document as sent in a body and stored with a failed run. */
export type ProblemDocument = z.infer<typeof problemSchema>;

/**
 * A problem with extension members (RFC 9457 §3.2) of the given shape — an operation
 * whose failures carry more than the common fields (e.g. the preview's `outline`).
 */
export function problemWith<E extends z.ZodRawShape>(extension: E) {
  return z.object({ ...problemShape, ...extension });
}

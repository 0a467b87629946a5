/**
 * Zod schemas of the saved library (circuits and observables per
 * organisation), shared by the REST API, the forms and the OpenAPI document.
 * A saved item is the engine's own input shape (lib/quantum/schemas.ts) plus
 * name, description and tags, so it can be pasted into a run request as is.
 */
import { z } from "zod";
import {
  circuitInputSchema,
  matrixObservableSchema,
  pauliObservableSchema,
  termsObservableSchema,
} from "@/lib/quantum/schemas";
import { nameSchema } from "@/lib/validation/names";
import {
  cursorParamSchema,
  limitParamSchema,
  pageSchema,
  timestampSchema,
} from "@/lib/openapi/common-schemas";

export const tagSchema = z
  .string()
  .trim()
  .toLowerCase()
  .min(1)
  .max(32)
  .regex(
    /^[a-z0-9][a-z0-9 ._-]*$/,
    "letters, digits, space, dot, underscore and hyphen; starting with a letter or digit",
  );

const meta = {
  name: nameSchema({ max: 120, empty: "the name is empty" }).describe(
    "Unique within the organisation",
  ),
  description: z.string().trim().max(2000).default(""),
  tags: z.array(tagSchema).max(10).default([]).describe("Up to 10 lower-case labels"),
};

export const circuitCreateSchema = circuitInputSchema
  .extend(meta)
  .describe("A circuit to save in the library");
export type CircuitCreateInput = z.infer<typeof circuitCreateSchema>;

export const observableCreateSchema = z
  .discriminatedUnion("format", [
    pauliObservableSchema.extend(meta),
    matrixObservableSchema.extend(meta),
    termsObservableSchema.extend(meta),
  ])
  .describe(
    'An observable to save in the library (a "terms" list is saved as the equivalent Pauli-sum text)',
  );
export type ObservableCreateInput = z.infer<typeof observableCreateSchema>;

const stored = {
  id: z.uuid(),
  name: z.string(),
  description: z.string(),
  tags: z.array(z.string()),
  qubits: z.int().describe("Qubits the item acts on"),
  createdBy: z
    .string()
    .nullable()
    .describe("User id of the author (null for API keys without a user)"),
  createdAt: timestampSchema,
  updatedAt: timestampSchema,
};

export const circuitSchema = z
  .object({ ...stored, format: circuitInputSchema.shape.format, source: z.string() })
  .meta({ id: "Circuit", description: "A saved circuit" });
export const circuitSummarySchema = z
  .object({ ...stored, format: circuitInputSchema.shape.format })
  .describe("A saved circuit without its source");

export const observableSchema = z
  .discriminatedUnion("format", [
    z.object({ ...stored, ...pauliObservableSchema.shape }),
    z.object({ ...stored, ...matrixObservableSchema.shape }),
  ])
  .meta({ id: "Observable", description: "A saved observable" });
export const observableSummarySchema = z
  .object({ ...stored, format: z.enum(["pauli", "matrix"]) })
  .describe("A saved observable without its terms or matrix");

export const libraryListQuerySchema = z.strictObject({
  tag: tagSchema.optional().describe("Only items with this tag"),
  cursor: cursorParamSchema.optional(),
  limit: limitParamSchema,
});
export type LibraryListQuery = z.infer<typeof libraryListQuerySchema>;

export const circuitPageSchema = pageSchema(circuitSummarySchema).describe(
  "Saved circuits, newest first",
);
export const observablePageSchema = pageSchema(observableSummarySchema).describe(
  "Saved observables, newest first",
);

export type CircuitView = z.infer<typeof circuitSchema>;
export type ObservableView = z.infer<typeof observableSchema>;

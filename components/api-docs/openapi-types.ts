/**
 * The parts of an OpenAPI 3.1 document the API reference renders, and the helpers that
 * list its operations.
 */
import type { JsonSchema } from "./schema-fields";

export type Parameter = {
  name: string;
  in: string;
  required?: boolean;
  description?: string;
  schema?: JsonSchema;
};
export type MediaType = { schema?: JsonSchema; example?: unknown };
export type Operation = {
  operationId?: string;
  summary?: string;
  description?: string;
  tags?: string[];
  parameters?: Parameter[];
  requestBody?: { required?: boolean; content: Record<string, MediaType> };
  responses: Record<string, { description?: string; content?: Record<string, MediaType> }>;
  security?: Record<string, string[]>[];
};
export type OpenApiDoc = {
  info: { title: string; version: string; description?: string };
  servers?: { url: string }[];
  paths: Record<string, Record<string, Operation>>;
  components?: { schemas?: Record<string, JsonSchema> };
};

/** Whether the 200 answer is a file (CSV, zip) rather than JSON. */
export const isFileAnswer = (op: Operation) =>
  Object.keys(op.responses["200"]?.content ?? {}).some((type) => !type.includes("json"));

export const anchor = (method: string, path: string) =>
  `${method}-${path.replace(/[^a-z0-9]+/gi, "-")}`.replace(/-+$/, "");

export type ListedOperation = { path: string; method: string; op: Operation };

/** Every operation of the document, in document order. */
export function listOperations(doc: OpenApiDoc): ListedOperation[] {
  return Object.entries(doc.paths).flatMap(([path, methods]) =>
    Object.entries(methods)
      .filter(([m]) => ["get", "post", "put", "patch", "delete"].includes(m))
      .map(([method, op]) => ({ path, method, op })),
  );
}

/** An operation's group: its first tag. */
export const groupOf = (o: ListedOperation) => o.op.tags?.[0] ?? "Other";

/**
 * The parts of the generated OpenAPI 3.1 document the API reference renders — types
 * taken from the generator's own document type (lib/openapi/document.ts), never retyped —
 * and the helpers that list its operations.
 */
import type { OpenApiDocument } from "@/lib/openapi/document";

type PathItem = NonNullable<OpenApiDocument["paths"]>[string];
type Components = NonNullable<OpenApiDocument["components"]>;

/** One operation (method of a path). */
export type Operation = NonNullable<PathItem["get"]>;
type ParameterOrRef = NonNullable<Operation["parameters"]>[number];
/** An inline parameter (the generator writes every parameter inline). */
export type Parameter = Extract<ParameterOrRef, { in: unknown }>;
/** A JSON Schema as the document holds it (a `$ref` or an inline schema). */
export type JsonSchema = NonNullable<Components["schemas"]>[string];
/** The schemas of `#/components/schemas`, by name. */
export type SchemaComponents = NonNullable<Components["schemas"]>;
/** One answer of an operation. */
export type Response = Extract<
  NonNullable<Components["responses"]>[string],
  { description: string }
>;
type RequestBody = Extract<NonNullable<Operation["requestBody"]>, { content: unknown }>;
/** One media type of a request or an answer: its schema and example. */
export type MediaType = RequestBody["content"][string];

/** The request body of an operation, when it is written inline. */
export const requestBody = (op: Operation): RequestBody | undefined =>
  op.requestBody && "content" in op.requestBody ? op.requestBody : undefined;

/** The answers of an operation by status code. */
export const responsesOf = (op: Operation): [string, Response][] =>
  Object.entries((op.responses ?? {}) as Record<string, Response>);

/** The inline parameters of an operation. */
export const parametersOf = (op: Operation): Parameter[] =>
  (op.parameters ?? []).filter((p): p is Parameter => "in" in p);

/** Whether the 200 answer is a file (CSV, zip) rather than JSON. */
export const isFileAnswer = (op: Operation) =>
  Object.keys((op.responses?.["200"] as Response | undefined)?.content ?? {}).some(
    (type) => !type.includes("json"),
  );

export const anchor = (method: string, path: string) =>
  `${method}-${path.replace(/[^a-z0-9]+/gi, "-")}`.replace(/-+$/, "");

export type ListedOperation = { path: string; method: string; op: Operation };

const METHODS = ["get", "post", "put", "patch", "delete"] as const;

/** Every operation of the document, in document order. */
export function listOperations(doc: OpenApiDocument): ListedOperation[] {
  return Object.entries(doc.paths ?? {}).flatMap(([path, item]) =>
    Object.keys(item)
      .filter((m): m is (typeof METHODS)[number] => (METHODS as readonly string[]).includes(m))
      .map((method) => ({ path, method, op: item[method]! })),
  );
}

/** An operation's group: its first tag. */
export const groupOf = (o: ListedOperation) => o.op.tags?.[0] ?? "Other";

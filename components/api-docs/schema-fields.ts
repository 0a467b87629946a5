/**
 * Flattens a JSON Schema (as found in an OpenAPI 3.1 document) into rows for a field
 * table: dotted path (arrays as `[]`, maps as `{key}`), type, required, description,
 * allowed values. `$ref`s into `#/components/schemas` are followed once per branch (a
 * cycle prints the component's name instead); alternatives (oneOf/anyOf) are listed
 * with their discriminating constant when they have one.
 */
import { formatCount, withMinus } from "@/lib/format";
import type { JsonSchema, SchemaComponents } from "./openapi-types";

/** A schema read through one shape: a reference carries only `$ref` and a description. */
type Schema = Exclude<JsonSchema, { $ref: string }>;
export const view = (s: JsonSchema): Schema => s as Schema;

export type FieldRow = {
  path: string;
  type: string;
  required: boolean;
  description: string;
  values?: string;
  depth: number;
};

type Components = SchemaComponents;

export function refName(ref: string): string {
  return ref.replace(/^#\/components\/schemas\//, "");
}

/** An alternative of a oneOf: its discriminating constant (e.g. "pauli") when it has one. */
function alternativeLabel(alt: JsonSchema, components: Components): string {
  const resolved = view(alt.$ref ? (components[refName(alt.$ref)] ?? alt) : alt);
  const tag = Object.values(resolved.properties ?? {})
    .map(view)
    .find((p) => p.const !== undefined || p.enum?.length === 1);
  return tag ? JSON.stringify(tag.const ?? tag.enum![0]) : typeLabel(alt, components);
}

function typeLabel(schema: JsonSchema, components: Components): string {
  const s = view(schema);
  if (s.$ref) return refName(s.$ref);
  if (s.const !== undefined) return JSON.stringify(s.const);
  if (s.enum) return "enum";
  if (s.oneOf || s.anyOf)
    return (s.oneOf ?? s.anyOf)!.map((x) => alternativeLabel(x, components)).join(" | ");
  if (s.prefixItems) return `[${s.prefixItems.map((x) => typeLabel(x, components)).join(", ")}]`;
  const t = Array.isArray(s.type) ? s.type.join(" | ") : s.type;
  if (t === "array" && s.items) return `${typeLabel(s.items, components)}[]`;
  if (t === "object" && s.additionalProperties && typeof s.additionalProperties === "object") {
    return `map of ${typeLabel(s.additionalProperties, components)}`;
  }
  return t ?? "any";
}

/** A schema bound: whole numbers with thousands separators, others exactly (1e-12), true minus. */
const bound = (x: number) => (Number.isInteger(x) ? formatCount(x) : withMinus(String(x)));

function bounds(s: Schema): string | undefined {
  const parts: string[] = [];
  if (s.minimum !== undefined) parts.push(`≥ ${bound(s.minimum)}`);
  if (s.maximum !== undefined) parts.push(`≤ ${bound(s.maximum)}`);
  if (s.minLength !== undefined && s.minLength > 0) parts.push(`length ≥ ${s.minLength}`);
  if (s.maxLength !== undefined) parts.push(`length ≤ ${formatCount(s.maxLength)}`);
  return parts.length ? parts.join(", ") : undefined;
}

function valuesOf(s: Schema): string | undefined {
  if (s.enum) return s.enum.map((v) => JSON.stringify(v)).join(", ");
  return bounds(s);
}

export function schemaFields(root: JsonSchema, components: Components, maxDepth = 6): FieldRow[] {
  const rows: FieldRow[] = [];
  const walk = (
    s: JsonSchema,
    path: string,
    required: boolean,
    depth: number,
    seen: Set<string>,
  ) => {
    let node = view(s);
    let nextSeen = seen;
    if (node.$ref) {
      const name = refName(node.$ref);
      if (seen.has(name) || !components[name] || depth > maxDepth) {
        if (path)
          rows.push({ path, type: name, required, description: node.description ?? "", depth });
        return;
      }
      nextSeen = new Set(seen).add(name);
      node = {
        ...view(components[name]),
        description: s.description ?? components[name].description,
      };
    }
    if (path) {
      rows.push({
        path,
        type: typeLabel(node, components),
        required,
        description: node.description ?? "",
        values: valuesOf(node),
        depth,
      });
    }
    if (depth > maxDepth) return;
    const alternatives = node.oneOf ?? node.anyOf;
    if (alternatives) {
      alternatives.forEach((alt) => {
        const resolved = view(alt.$ref ? (components[refName(alt.$ref)] ?? alt) : alt);
        const tag = Object.entries(resolved.properties ?? {})
          .map(([k, p]) => [k, view(p)] as const)
          .find(([, p]) => p.const !== undefined || p.enum?.length === 1);
        const label = tag
          ? `${tag[0]}=${JSON.stringify(tag[1].const ?? tag[1].enum![0])}`
          : typeLabel(alt, components);
        if (resolved.properties)
          walk(alt, path ? `${path} (${label})` : `(${label})`, required, depth + 1, nextSeen);
      });
      return;
    }
    for (const part of node.allOf ?? []) walk(part, path, required, depth, nextSeen);
    if (node.properties) {
      const req = new Set(node.required ?? []);
      for (const [k, v] of Object.entries(node.properties))
        walk(v, path ? `${path}.${k}` : k, req.has(k), depth + 1, nextSeen);
    }
    const items = node.items && view(node.items);
    if (items && (items.properties || items.$ref || items.oneOf)) {
      walk({ ...items, description: undefined }, `${path}[]`, true, depth + 1, nextSeen);
      // The row just added repeats the array's own line; drop it when it carries nothing new.
      const last = rows.findIndex((r) => r.path === `${path}[]`);
      if (last >= 0 && !rows[last].description) rows.splice(last, 1);
    }
    const extra =
      node.additionalProperties && typeof node.additionalProperties === "object"
        ? view(node.additionalProperties)
        : undefined;
    if (extra && (extra.properties || extra.$ref)) {
      walk(extra, `${path}{key}`, true, depth + 1, nextSeen);
    }
  };
  walk(root, "", true, 0, new Set());
  return rows;
}

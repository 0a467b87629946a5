/**
 * `expand[]=a.b.c`: replaces object ids along a dotted path with the objects
 * themselves. Lists expand through `data` (e.g. `data.customer`). A path may
 * be at most four levels deep; a field that cannot be expanded is a 400, as
 * with the provider.
 */
import { invalidRequest } from "../core/errors";

export interface Expander {
  /** The rendered object for an id, or undefined if the id is unknown to the fake. */
  resolve(id: string): Record<string, unknown> | undefined;
  /** Fields that only appear when expanded (e.g. a checkout session's `line_items`). */
  include(owner: Record<string, unknown>, field: string): unknown;
}

export function applyExpand(
  value: unknown,
  paths: string[] | undefined,
  expander: Expander,
): unknown {
  if (!paths || paths.length === 0) return value;
  let out = value;
  for (const path of paths) {
    const parts = path.split(".");
    if (parts.length > 4 || parts.some((p) => p === "")) {
      throw invalidRequest(
        `You cannot expand more than 4 levels of a property, or an empty one (${path}).`,
        "expand",
      );
    }
    out = expandPath(out, parts, path, expander);
  }
  return out;
}

function expandPath(value: unknown, parts: string[], full: string, expander: Expander): unknown {
  if (parts.length === 0 || value === null || value === undefined) return value;
  if (Array.isArray(value)) return value.map((v) => expandPath(v, parts, full, expander));
  if (typeof value !== "object") throw cannotExpand(full);
  const obj = value as Record<string, unknown>;
  const [head, ...rest] = parts;
  let field: unknown;
  if (head in obj) {
    field = obj[head];
    if (typeof field === "string") {
      const resolved = expander.resolve(field);
      if (!resolved) throw cannotExpand(full);
      field = resolved;
    } else if (
      rest.length === 0 &&
      field !== null &&
      (typeof field !== "object" || Array.isArray(field))
    ) {
      throw cannotExpand(full);
    }
  } else {
    field = expander.include(obj, head);
    if (field === undefined) throw cannotExpand(full);
  }
  return { ...obj, [head]: expandPath(field, rest, full, expander) };
}

function cannotExpand(path: string) {
  return invalidRequest(`This property cannot be expanded (${path}).`, "expand");
}

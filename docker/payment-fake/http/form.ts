/**
 * Parses `application/x-www-form-urlencoded` text (and query strings) the way
 * the provider reads what the SDK sends: bracketed keys build nested values,
 * `a[b][0][c]=x` → `{ a: { b: [ { c: "x" } ] } }`, and `a[]=x` appends.
 * An object whose keys are all array indices becomes an array (in index
 * order). Values stay strings; each endpoint's schema coerces them.
 */
export type FormValue = string | FormValue[] | { [key: string]: FormValue };
export type FormObject = { [key: string]: FormValue };

export class FormError extends Error {}

const MAX_DEPTH = 8;

export function parseForm(text: string): FormObject {
  const root: Node = {};
  if (!text) return {};
  for (const pair of text.split("&")) {
    if (!pair) continue;
    const eq = pair.indexOf("=");
    const rawKey = eq < 0 ? pair : pair.slice(0, eq);
    const rawValue = eq < 0 ? "" : pair.slice(eq + 1);
    const key = decode(rawKey);
    const value = decode(rawValue);
    assign(root, splitKey(key), value);
  }
  return arrayify(root) as FormObject;
}

function decode(s: string): string {
  try {
    return decodeURIComponent(s.replace(/\+/g, " "));
  } catch {
    throw new FormError(`Malformed percent-encoding in form data near "${s.slice(0, 40)}"`);
  }
}

/** "a[b][0][]" → ["a", "b", "0", ""] */
export function splitKey(key: string): string[] {
  const first = key.indexOf("[");
  if (first < 0) return [key];
  const parts = [key.slice(0, first)];
  const re = /\[([^\]]*)\]/g;
  let m: RegExpExecArray | null;
  let consumed = first;
  while ((m = re.exec(key)) !== null) {
    if (m.index !== consumed) throw new FormError(`Malformed parameter name "${key}"`);
    parts.push(m[1]);
    consumed = m.index + m[0].length;
  }
  if (consumed !== key.length || parts[0] === "")
    throw new FormError(`Malformed parameter name "${key}"`);
  if (parts.length > MAX_DEPTH) throw new FormError(`Parameter "${key}" is nested too deeply`);
  return parts;
}

type Node = { [key: string]: Node | string };

function assign(target: Node, path: string[], value: string): void {
  let node = target;
  for (let i = 0; i < path.length; i++) {
    let part = path[i];
    if (part === "") part = String(nextIndex(node));
    if (part === "__proto__" || part === "constructor" || part === "prototype") {
      throw new FormError(`Parameter name part "${part}" is not allowed`);
    }
    if (i === path.length - 1) {
      if (typeof node[part] === "object")
        throw new FormError(`Parameter "${path.join(".")}" given both as a value and a hash`);
      node[part] = value;
      return;
    }
    const next = node[part];
    if (next === undefined) node[part] = {};
    else if (typeof next === "string")
      throw new FormError(
        `Parameter "${path.slice(0, i + 1).join(".")}" given both as a value and a hash`,
      );
    node = node[part] as Node;
  }
}

function nextIndex(node: Node): number {
  const indices = Object.keys(node)
    .filter((k) => /^\d+$/.test(k))
    .map(Number);
  return indices.length ? Math.max(...indices) + 1 : 0;
}

function arrayify(node: Node | string): FormValue {
  if (typeof node === "string") return node;
  const keys = Object.keys(node);
  const out: FormObject = Object.create(null) as FormObject;
  for (const k of keys) out[k] = arrayify(node[k]);
  if (keys.length > 0 && keys.every((k) => /^\d+$/.test(k))) {
    return keys
      .map(Number)
      .sort((a, b) => a - b)
      .map((k) => out[String(k)]);
  }
  return { ...out };
}

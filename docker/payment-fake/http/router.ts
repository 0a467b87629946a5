/**
 * A tiny method + path router: patterns like `/v1/customers/:id` with named
 * segments. The first matching route wins.
 */
export interface Match<H> {
  handler: H;
  params: Record<string, string>;
}

interface Route<H> {
  method: string;
  parts: string[];
  handler: H;
}

export class Router<H> {
  private routes: Route<H>[] = [];

  add(method: string, pattern: string, handler: H): this {
    this.routes.push({ method, parts: pattern.split("/").filter(Boolean), handler });
    return this;
  }

  /** The matching route, or "method" if only the method is wrong, or null. */
  match(method: string, path: string): Match<H> | "method" | null {
    const parts = path.split("/").filter(Boolean);
    let pathMatched = false;
    for (const route of this.routes) {
      const params = matchParts(route.parts, parts);
      if (!params) continue;
      if (route.method === method) return { handler: route.handler, params };
      pathMatched = true;
    }
    return pathMatched ? "method" : null;
  }
}

function matchParts(pattern: string[], parts: string[]): Record<string, string> | null {
  if (pattern.length !== parts.length) return null;
  const params: Record<string, string> = {};
  for (let i = 0; i < pattern.length; i++) {
    const p = pattern[i];
    if (p.startsWith(":")) {
      let value: string;
      try {
        value = decodeURIComponent(parts[i]);
      } catch {
        return null;
      }
      params[p.slice(1)] = value;
    } else if (p !== parts[i]) return null;
  }
  return params;
}

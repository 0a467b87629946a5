/**
 * A stand-in for the request context Next.js gives server actions
 * (`headers()`, `cookies()` of next/headers), so the tests can call the real
 * exported actions as a given browser: `asBrowser({ cookie })` sets what the
 * next call sees; cookies the action sets are kept in the same jar.
 *
 *   vi.mock("next/headers", async () => (await import("./support/next-context")).nextHeadersModule);
 */
type Jar = Map<string, string>;

const state: { jar: Jar; extra: Record<string, string>; set: Jar } = {
  jar: new Map(),
  extra: {},
  set: new Map(),
};

function parseCookies(header: string): Jar {
  const jar: Jar = new Map();
  for (const part of header.split(";")) {
    const [name, ...rest] = part.trim().split("=");
    if (name) jar.set(name, rest.join("="));
  }
  return jar;
}

/** The browser the next server-action call comes from. */
export function asBrowser(
  options: { cookie?: string; headers?: Record<string, string> } = {},
): void {
  state.jar = parseCookies(options.cookie ?? "");
  state.extra = options.headers ?? {};
  state.set = new Map();
}

/** The value the last call SET for a cookie (undefined when it set none). */
export function cookieSet(name: string): string | undefined {
  return state.set.get(name);
}

function currentHeaders(): Headers {
  const headers = new Headers({
    host: "localhost:3000",
    "x-forwarded-proto": "http",
    origin: "http://localhost:3000",
    ...state.extra,
  });
  const cookie = [...state.jar].map(([k, v]) => `${k}=${v}`).join("; ");
  if (cookie) headers.set("cookie", cookie);
  return headers;
}

const cookieStore = {
  get: (name: string) => (state.jar.has(name) ? { name, value: state.jar.get(name)! } : undefined),
  getAll: () => [...state.jar].map(([name, value]) => ({ name, value })),
  has: (name: string) => state.jar.has(name),
  set: (nameOrCookie: string | { name: string; value: string }, value?: string) => {
    const [name, v] =
      typeof nameOrCookie === "string"
        ? [nameOrCookie, value ?? ""]
        : [nameOrCookie.name, nameOrCookie.value];
    state.jar.set(name, v);
    state.set.set(name, v);
  },
  delete: (name: string) => state.jar.delete(name),
};

export const nextHeadersModule = {
  headers: async () => currentHeaders(),
  cookies: async () => cookieStore,
  draftMode: async () => ({ isEnabled: false }),
};

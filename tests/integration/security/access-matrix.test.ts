/**
 * The access matrix, generated from one table (./support/access-table.ts):
 * every route handler under app/api and every exported server action ×
 * every role × own / other organisation × session / personal key /
 * organisation key. Routes and actions are discovered from the filesystem; a
 * test fails when one is missing from the table.
 *
 * Expectations: allowed → neither 401 / 403 nor the "not a member" 404 (the
 * call then reaches its body); too weak → 403; another organisation → 404
 * (never 403: no existence leak) or no trace of it; no credentials → 401.
 * A key acts with the lower of its role and its creator's (keys top out at admin).
 */
import { readdirSync, readFileSync } from "node:fs";
import { join, relative, resolve } from "node:path";
import { NextRequest } from "next/server";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { closeDb } from "@/db";
import { isProblemError } from "@/lib/api/problem";
import { listNoiseProfiles } from "@/lib/noise-profiles/queries";
import { saveNoiseProfile } from "@/lib/noise-profiles/mutations";
import { ROLES, roleAtLeast, type Role } from "@/lib/orgs/roles";
import { closeRedis } from "@/lib/rate-limit/redis";
import { api } from "../runs/support/api";
import {
  addMember,
  createTestApiKey,
  createTestUser,
  createUserWithOrg,
  sessionCookie,
} from "../../support/factories";
import { ACTION_TABLE, ROUTE_TABLE, type Access, type Fixtures } from "./support/access-table";
import { asBrowser, cookieSet } from "./support/next-context";

vi.mock("next/headers", async () => (await import("./support/next-context")).nextHeadersModule);
vi.mock("next/cache", () => ({ revalidatePath: () => undefined, revalidateTag: () => undefined }));

const ROOT = resolve(__dirname, "../../..");
const HTTP_METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE", "HEAD", "OPTIONS"];
const NOT_MEMBER =
  /No such organisation, or you are not a member of it|don't belong to any organisation/;
const NEEDS_ROLE = /role or higher/;

function walk(dir: string, keep: (file: string) => boolean): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const full = join(dir, e.name);
    if (e.isDirectory()) return e.name === "node_modules" ? [] : walk(full, keep);
    return keep(full) ? [relative(ROOT, full)] : [];
  });
}

const routeFiles = walk(join(ROOT, "app/api"), (f) => /\/route\.tsx?$/.test(f));
const sourceFiles = [
  ...walk(join(ROOT, "app"), (f) => /\.tsx?$/.test(f)),
  ...walk(join(ROOT, "components"), (f) => /\.tsx?$/.test(f)),
];
const TOP_DIRECTIVE = /^(?:\s*(?:\/\/[^\n]*\n|\/\*[\s\S]*?\*\/))*\s*["']use server["']/;
const actionFiles = sourceFiles.filter((f) =>
  TOP_DIRECTIVE.test(readFileSync(join(ROOT, f), "utf8")),
);
const inlineActionFiles = sourceFiles.filter((f) => {
  const code = readFileSync(join(ROOT, f), "utf8").replace(/\/\*[\s\S]*?\*\/|\/\/[^\n]*/g, "");
  return !TOP_DIRECTIVE.test(code) && /["']use server["']/.test(code);
});

const load = (file: string) =>
  import(/* @vite-ignore */ join(ROOT, file)) as Promise<Record<string, unknown>>;

// ---------------------------------------------------------------- fixtures
const fx = {} as Fixtures;
const usersA = {} as Record<Role, string>;
let ownerB: string;
type Credential = {
  label: "session" | "personal key" | "org key";
  headers: () => Promise<Record<string, string>>;
  role: Role;
};
const credentials = {} as Record<Role, Credential[]>;
let keysOfB: string[] = [];

beforeAll(async () => {
  const a = await createUserWithOrg("matrix-a");
  const b = await createUserWithOrg("matrix-b");
  fx.orgA = a.orgId;
  fx.orgB = b.orgId;
  usersA.owner = a.user.id;
  ownerB = b.user.id;
  for (const role of ["admin", "member", "viewer"] as const) {
    const u = await createTestUser(`matrix-a-${role}`);
    await addMember(a.orgId, u.id, role);
    usersA[role] = u.id;
  }
  const keyA = (await createTestApiKey(a.orgId, "admin")).key;
  const keyB = (await createTestApiKey(b.orgId, "admin")).key;
  keysOfB = [keyB, (await createTestApiKey(b.orgId, "admin", ownerB, "organization")).key];
  const make = async (key: string, path: string, body: unknown) => {
    const res = await api("POST", path, { key, body });
    if (res.status >= 300)
      throw new Error(`fixture ${path}: ${res.status} ${JSON.stringify(res.body)}`);
    return res.body.id as string;
  };
  const bell = {
    format: "qasm2",
    source: 'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[2];\nh q[0];\ncx q[0],q[1];\n',
  };
  const run = { circuit: bell, observable: { format: "pauli", terms: "ZZ" } };
  fx.runA = await make(keyA, "/api/v1/runs", run);
  fx.runB = await make(keyB, "/api/v1/runs", run);
  fx.circuitA = await make(keyA, "/api/v1/circuits", { ...bell, name: "fixture a" });
  fx.circuitB = await make(keyB, "/api/v1/circuits", { ...bell, name: "fixture b" });
  fx.observableA = await make(keyA, "/api/v1/observables", {
    format: "pauli",
    terms: "Z0",
    name: "fixture a",
  });
  fx.observableB = await make(keyB, "/api/v1/observables", {
    format: "pauli",
    terms: "Z0",
    name: "fixture b",
  });
  await saveNoiseProfile(b.orgId, ownerB, { name: "fixture b", noise: {} });
  fx.profileB = (await listNoiseProfiles(b.orgId))[0].id;
  let n = 0;
  fx.fresh = async (kind) => {
    n += 1;
    if (kind === "circuit") return make(keyA, "/api/v1/circuits", { ...bell, name: `fresh ${n}` });
    if (kind === "observable")
      return make(keyA, "/api/v1/observables", {
        format: "pauli",
        terms: "Z0",
        name: `fresh ${n}`,
      });
    await saveNoiseProfile(a.orgId, usersA.owner, { name: `fresh ${n}`, noise: {} });
    return (await listNoiseProfiles(a.orgId)).find((p) => p.name === `fresh ${n}`)!.id;
  };
  for (const role of ROLES) {
    const keyRole: Role = role === "owner" ? "admin" : role;
    const personal = (await createTestApiKey(a.orgId, keyRole, usersA[role])).key;
    const orgKey = (await createTestApiKey(a.orgId, keyRole, usersA.owner, "organization")).key;
    credentials[role] = [
      {
        label: "session",
        role,
        headers: async () => ({ cookie: await sessionCookie(usersA[role]) }),
      },
      {
        label: "personal key",
        role: keyRole,
        headers: async () => ({ authorization: `Bearer ${personal}` }),
      },
      {
        label: "org key",
        role: keyRole,
        headers: async () => ({ authorization: `Bearer ${orgKey}` }),
      },
    ];
  }
}, 120_000);

afterAll(async () => {
  await closeRedis();
  await closeDb();
});

// ---------------------------------------------------------------- routes
function urlOf(file: string, id?: string): string {
  const path = file
    .replace(/^app/, "")
    .replace(/\/route\.tsx?$/, "")
    .replace("[...nextauth]", "csrf")
    .replace("[id]", id ?? "x");
  return `http://localhost:3000${path}`;
}

async function callRoute(
  file: string,
  method: string,
  headers: Record<string, string>,
  id?: string,
  body?: unknown,
) {
  const handler = (await load(file))[method] as (req: Request, ctx: unknown) => Promise<Response>;
  const init: RequestInit = { method, headers: { ...headers } };
  if (body !== undefined) {
    init.body = JSON.stringify(body);
    (init.headers as Record<string, string>)["content-type"] = "application/json";
  }
  const res = await handler(
    new NextRequest(urlOf(file, id), init as ConstructorParameters<typeof NextRequest>[1]),
    { params: Promise.resolve(id ? { id } : {}) },
  );
  const text = await res.text();
  return { status: res.status, text };
}

const isMin = (a: Access): a is { min: Role } => "min" in a;

describe("every route file and method is in the access table", () => {
  it("discovers the routes on disk and finds each in the table (and nothing extra)", async () => {
    const onDisk: string[] = [];
    for (const file of routeFiles) {
      const mod = await load(file);
      for (const m of HTTP_METHODS) if (typeof mod[m] === "function") onDisk.push(`${m} ${file}`);
    }
    const inTable = ROUTE_TABLE.map((r) => `${r.method} ${r.file}`);
    expect(
      onDisk.filter((r) => !inTable.includes(r)),
      "routes missing from the access table",
    ).toEqual([]);
    expect(
      inTable.filter((r) => !onDisk.includes(r)),
      "table rows without a route",
    ).toEqual([]);
  });
});

describe.each(ROUTE_TABLE)("$method $file", (row) => {
  const idA = () =>
    row.id ? { run: fx.runA, circuit: fx.circuitA, observable: fx.observableA }[row.id] : undefined;
  const idB = () =>
    row.id ? { run: fx.runB, circuit: fx.circuitB, observable: fx.observableB }[row.id] : undefined;

  if (!isMin(row.access)) {
    const why = "public" in row.access ? row.access.public : "any signed-in person";
    it(`public (${why}): answers without credentials, never 5xx`, async () => {
      const res = await callRoute(
        row.file,
        row.method,
        {},
        undefined,
        row.method === "POST" ? { junk: true } : undefined,
      );
      expect(res.status, res.text).toBeLessThan(500);
      expect(res.status).not.toBe(401);
    });
    return;
  }
  const min = row.access.min;

  it("401 without credentials", async () => {
    expect((await callRoute(row.file, row.method, {}, idA(), row.body)).status).toBe(401);
  });

  for (const role of ROLES) {
    it(`${role}: session, personal key and organisation key in the own organisation`, async () => {
      for (const cred of credentials[role]) {
        const id = row.fresh ? await fx.fresh(row.fresh) : idA();
        const res = await callRoute(row.file, row.method, await cred.headers(), id, row.body);
        const where = `${role} ${cred.label} → ${res.status} ${res.text.slice(0, 200)}`;
        expect(res.status, where).toBeLessThan(500);
        if (roleAtLeast(cred.role, min)) {
          expect([401, 403], where).not.toContain(res.status);
          // The resource exists in this organisation: no "not found" (a body's own 404, e.g. no export yet, is fine).
          if (row.id) expect(res.text, where).not.toContain('"type":"/problems/not-found"');
          expect(res.text, where).not.toMatch(NOT_MEMBER);
        } else {
          expect(res.status, where).toBe(403);
          expect(res.text, where).toMatch(NEEDS_ROLE);
        }
      }
    });

    it(`${role}: another organisation answers 404 (session naming it; its resources by id)`, async () => {
      const session = await credentials[role][0].headers();
      const res = await callRoute(
        row.file,
        row.method,
        { ...session, "x-ketwise-org": fx.orgB },
        idB(),
        row.body,
      );
      expect(res.status, res.text).toBe(404);
      if (row.id) {
        for (const cred of credentials[role].slice(1)) {
          const viaKey = await callRoute(
            row.file,
            row.method,
            await cred.headers(),
            idB(),
            row.body,
          );
          expect([403, 404], `${cred.label}: ${viaKey.text}`).toContain(viaKey.status);
          if (roleAtLeast(cred.role, min)) expect(viaKey.status).toBe(404);
        }
      }
    });
  }

  it("the other organisation's keys never reach this organisation's data", async () => {
    for (const key of keysOfB) {
      const res = await callRoute(
        row.file,
        row.method,
        { authorization: `Bearer ${key}` },
        idA(),
        row.body,
      );
      expect(res.status, res.text).toBeLessThan(500);
      if (row.id) expect(res.status, res.text).toBe(404);
      for (const id of [fx.runA, fx.circuitA, fx.observableA]) expect(res.text).not.toContain(id);
    }
  });
});

// ---------------------------------------------------------------- server actions
type Verdict = 200 | 401 | 403 | 404 | "body" | 500;

function verdictOf(result: unknown, thrown: unknown): Verdict {
  if (thrown !== undefined) {
    if (isProblemError(thrown)) return thrown.status as Verdict;
    const digest = (thrown as { digest?: string })?.digest ?? "";
    if (digest.startsWith("NEXT_REDIRECT"))
      return /;\/sign-in/.test(digest) && /SessionExpired|callbackUrl/.test(digest) ? 401 : 200;
    if (digest === "NEXT_NOT_FOUND" || digest.startsWith("NEXT_HTTP_ERROR_FALLBACK;404"))
      return 404;
    return 500;
  }
  // Every action answers ActionState (lib/api/action-state.ts), FormData and JSON ones alike.
  const r = result as { status?: string; code?: number; message?: string } | undefined;
  if (r?.status === "error") {
    if (r.code === 401 || r.code === 403 || r.code === 500) return r.code;
    return NOT_MEMBER.test(r.message ?? "") ? 404 : "body";
  }
  return 200;
}

async function invoke(
  row: (typeof ACTION_TABLE)[number],
  orgId: string,
  cookie?: string,
): Promise<{ verdict: Verdict; result: unknown }> {
  const action = (await load(row.file))[row.name] as (...args: never[]) => unknown;
  asBrowser({ cookie });
  let result: unknown;
  let thrown: unknown;
  try {
    result = await row.call(action, fx, orgId);
  } catch (error) {
    thrown = error;
  }
  const verdict = verdictOf(result, thrown);
  if (verdict === 500) console.error(`${row.name} failed`, thrown ?? result);
  return { verdict, result };
}

const allowed = (v: Verdict) => v === 200 || v === "body";

describe("every exported server action is in the access table", () => {
  it("discovers action files on disk; every export is a row, every row an export", async () => {
    const onDisk: string[] = [];
    for (const file of actionFiles) {
      const mod = await load(file);
      for (const [name, value] of Object.entries(mod))
        if (typeof value === "function") onDisk.push(`${file}#${name}`);
    }
    const inTable = ACTION_TABLE.map((r) => `${r.file}#${r.name}`);
    expect(
      onDisk.filter((a) => !inTable.includes(a)),
      "server actions missing from the access table",
    ).toEqual([]);
    expect(
      inTable.filter((a) => !onDisk.includes(a)),
      "table rows without an action",
    ).toEqual([]);
  });

  it('has no inline server actions (they would escape the table): actions live in "use server" files', () => {
    expect(inlineActionFiles).toEqual([]);
  });
});

describe.each(ACTION_TABLE)("action $name ($file)", (row) => {
  if ("public" in row.access) {
    it(`public (${row.access.public}): the same validation answer signed out and signed in`, async () => {
      const out = await invoke(row, fx.orgA);
      const inn = await invoke(row, fx.orgA, await sessionCookie(usersA.viewer));
      expect(out.verdict).toBe("body");
      expect(inn.verdict).toBe("body");
    });
    return;
  }

  it(
    row.whenSignedOut === "no-op"
      ? "signed out: a harmless no-op"
      : "401 (or the sign-in page) without a session",
    async () => {
      const { verdict } = await invoke(row, fx.orgA);
      if (row.whenSignedOut === "no-op") expect(allowed(verdict)).toBe(true);
      else expect(verdict).toBe(401);
    },
  );

  for (const role of ROLES) {
    it(`${role}: own organisation`, async () => {
      const { verdict, result } = await invoke(row, fx.orgA, await sessionCookie(usersA[role]));
      const where = `${role}: ${JSON.stringify(result)}`;
      if (!isMin(row.access) || roleAtLeast(role, row.access.min))
        expect(allowed(verdict), where).toBe(true);
      else expect(verdict, where).toBe(403);
    });

    it(`${role}: another organisation is not reachable`, async () => {
      const before = (await listNoiseProfiles(fx.orgB)).length;
      const cookie = `${await sessionCookie(usersA[role])}; kw_org=${fx.orgB}`;
      const { verdict, result } = await invoke(row, fx.orgB, cookie);
      const text = JSON.stringify(result ?? null);
      for (const id of [fx.runB, fx.circuitB, fx.observableB, fx.profileB])
        expect(text).not.toContain(id);
      expect((await listNoiseProfiles(fx.orgB)).length).toBe(before);
      expect(
        cookieSet("kw_org"),
        "the current-organisation cookie never names a foreign organisation",
      ).not.toBe(fx.orgB);
      if ("min" in row.access && row.call.length >= 3 && verdict !== 404) {
        // Actions that take the organisation from the request act in the user's own organisation.
        expect(allowed(verdict) || verdict === 403, `${role}: ${text}`).toBe(true);
      }
    });
  }
});

/**
 * Sign-out ends the session on the server: the reported hole was a copied
 * session cookie that kept working for its full 7 days after sign-out.
 * Each JWT carries a session id whose row must still exist on every request.
 */
import { getToken, type JWT } from "next-auth/jwt";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db";
import { withOrg } from "@/lib/api/with-org";
import { authConfig } from "@/lib/auth/config";
import { endAllServerSessions } from "@/lib/auth/server-sessions";
import { closeRedis } from "@/lib/rate-limit/redis";
import { createUserWithOrg, sessionCookie } from "../../support/factories";

const route = withOrg(async (_req, ctx) => Response.json({ org: ctx.org.id }));
const get = (cookie: string) =>
  route(new Request("http://localhost/api/v1/x", { headers: { cookie } }));

async function tokenOf(cookie: string): Promise<JWT> {
  const token = await getToken({
    req: { headers: { cookie } },
    secret: process.env.AUTH_SECRET!,
    secureCookie: false,
  });
  if (!token) throw new Error("cookie does not decode");
  return token;
}

let owner: Awaited<ReturnType<typeof createUserWithOrg>>;

beforeAll(async () => {
  owner = await createUserWithOrg("sessions");
});

afterAll(async () => {
  await closeRedis();
  await closeDb();
});

describe("server-side sessions", () => {
  it("after sign-out a copied cookie answers 401 session-expired, and Auth.js drops it too", async () => {
    const cookie = await sessionCookie(owner.user.id);
    expect((await get(cookie)).status).toBe(200);
    const token = await tokenOf(cookie);
    expect(typeof token.sid).toBe("string");

    const config = authConfig();
    // What Auth.js does on sign-out with a JWT session.
    await config.events!.signOut!({ token });

    const res = await get(cookie);
    expect(res.status).toBe(401);
    expect(await res.json()).toMatchObject({ type: "/problems/session-expired" });
    // The same check runs where pages and server actions read the session.
    const jwt = config.callbacks!.jwt!;
    expect(await jwt({ token, account: null } as Parameters<typeof jwt>[0])).toBeNull();
  });

  it("sign-out ends only its own session; sign out everywhere ends them all", async () => {
    const laptop = await sessionCookie(owner.user.id);
    const phone = await sessionCookie(owner.user.id);
    await authConfig().events!.signOut!({ token: await tokenOf(laptop) });
    expect((await get(laptop)).status).toBe(401);
    expect((await get(phone)).status).toBe(200);

    const tablet = await sessionCookie(owner.user.id);
    expect(await endAllServerSessions(owner.user.id)).toBeGreaterThanOrEqual(2);
    expect((await get(phone)).status).toBe(401);
    expect((await get(tablet)).status).toBe(401);
  });

  it("a token from before server-side sessions (no session id) is not accepted", async () => {
    const { encode } = await import("next-auth/jwt");
    const value = await encode({
      token: { sub: owner.user.id },
      secret: process.env.AUTH_SECRET!,
      salt: "authjs.session-token",
      maxAge: 3600,
    });
    expect((await get(`authjs.session-token=${value}`)).status).toBe(401);
  });

  it("signing in records a new session id in the token", async () => {
    const jwt = authConfig().callbacks!.jwt!;
    const token = await jwt({
      token: { sub: owner.user.id },
      user: { id: owner.user.id },
      account: null,
    } as Parameters<typeof jwt>[0]);
    expect(token).toMatchObject({ sub: owner.user.id, sid: expect.any(String) });
  });
});

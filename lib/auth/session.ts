/**
 * Who is signed in. Server components and actions use `getSessionUser()`
 * (Auth.js `auth()`); route handlers use `getSessionUserFromRequest(req)`, which
 * decodes the session JWT from the request's cookie and needs no Next context.
 * A session cookie that no longer decodes (expired, or signed with an old
 * secret) is reported as an expired session, not as "never signed in".
 */
import "server-only";
import { cookies } from "next/headers";
import { redirect } from "next/navigation";
import { getToken } from "next-auth/jwt";
import { sessionExpired, unauthorized } from "@/lib/api/problem";
import { env } from "@/lib/env";
import { SESSION_MAX_AGE_SECONDS } from "./config";
import { auth } from "./index";
import { isServerSessionLive } from "./server-sessions";

export type SessionUser = { id: string; email: string | null; name: string | null };

export const SESSION_COOKIE_NAMES = [
  "authjs.session-token",
  "__Secure-authjs.session-token",
] as const;

function secureCookies(): boolean {
  return env.AUTH_URL.startsWith("https://");
}

export async function getSessionUser(): Promise<SessionUser | null> {
  const session = await auth();
  const id = session?.user?.id;
  if (!id) return null;
  return { id, email: session.user?.email ?? null, name: session.user?.name ?? null };
}

async function hasSessionCookie(): Promise<boolean> {
  const jar = await cookies();
  return SESSION_COOKIE_NAMES.some((name) => jar.has(name) || jar.has(`${name}.0`));
}

/** For server actions: the user, or a 401 problem (expired vs not signed in). */
export async function requireUser(): Promise<SessionUser> {
  const user = await getSessionUser();
  if (user) return user;
  throw (await hasSessionCookie()) ? sessionExpired() : unauthorized("Sign in to continue.");
}

/** For pages: the user, or a redirect to the sign-in page (saying when the session expired). */
export async function requireUserOrRedirect(callbackPath = "/app"): Promise<SessionUser> {
  const user = await getSessionUser();
  if (user) return user;
  const params = new URLSearchParams({ callbackUrl: callbackPath });
  if (await hasSessionCookie()) params.set("error", "SessionExpired");
  redirect(`/sign-in?${params}`);
}

/** For route handlers: decodes the session cookie of `req`; `expired` when a cookie exists but is no longer valid. */
export async function getSessionUserFromRequest(
  req: Request,
): Promise<{ user: SessionUser | null; expired: boolean }> {
  const secureCookie = secureCookies();
  const token = await getToken({ req, secret: env.AUTH_SECRET, secureCookie });
  if (token?.sub && (await isServerSessionLive(token.sid, token.sub, SESSION_MAX_AGE_SECONDS))) {
    const user = {
      id: token.sub,
      email: typeof token.email === "string" ? token.email : null,
      name: typeof token.name === "string" ? token.name : null,
    };
    return { user, expired: false };
  }
  const cookieHeader = req.headers.get("cookie") ?? "";
  const expired = SESSION_COOKIE_NAMES.some(
    (name) => cookieHeader.includes(`${name}=`) || cookieHeader.includes(`${name}.0=`),
  );
  return { user: null, expired };
}

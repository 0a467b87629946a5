/**
 * Auth.js configuration: JWT sessions (needed by Credentials) over the Drizzle
 * adapter (needed by the magic-link provider to store verification tokens and
 * create users). The JWT's `sub` is the user id; the current organisation is
 * not in the token — it is a cookie checked against memberships per request.
 * Each token carries a session id (`sid`) whose row in `sessions` must still
 * exist (lib/auth/server-sessions.ts): sign-out ends the session server-side.
 */
import "server-only";
import type { NextAuthConfig } from "next-auth";
import { DrizzleAdapter } from "@auth/drizzle-adapter";
import Credentials from "next-auth/providers/credentials";
import Nodemailer from "next-auth/providers/nodemailer";
import { getDb } from "@/db";
import { accounts, sessions, users, verificationTokens } from "@/db/schema";
import { isProblemError } from "@/lib/api/problem";
import { env } from "@/lib/env";
import { magicLinkMail } from "@/lib/mail/templates";
import { sendMail, smtpServerOptions } from "@/lib/mail/transport";
import { createOrganization } from "@/lib/orgs/mutations";
import { clientIp, consumeSignInIp } from "@/lib/rate-limit";
import { RateLimitedSignIn, UnverifiedEmailSignIn } from "./errors";
import { safeCallbackPath } from "./redirects";
import {
  assertSignInAllowed,
  clearSignInFailures,
  recordSignInFailure,
  signInSource,
} from "./sign-in-throttle";
import { endServerSession, isServerSessionLive, startServerSession } from "./server-sessions";
import { verifyPassword } from "./password";
import { findUserByEmail } from "./queries";
import { signInSchema } from "./schemas";
import { personalOrgName } from "./sign-up";

/** Auth.js errors that are ordinary user outcomes (wrong password, dead link, stale cookie): one log line, no stack. */
const EXPECTED_AUTH_ERRORS = new Set(["CredentialsSignin", "Verification", "JWTSessionError"]);

export const SESSION_MAX_AGE_SECONDS = 7 * 24 * 60 * 60;
export const MAGIC_LINK_MAX_AGE_SECONDS = 15 * 60;

/**
 * Credentials check: the per-IP budget, then the account's progressive delay
 * for this source (browser / IP), then bcrypt; null for any mismatch. A
 * failure slows only its own source; a success clears it. Exported for tests.
 */
export async function authorizeWithPassword(
  raw: Partial<Record<string, unknown>>,
  request: Request,
) {
  const parsed = signInSchema.safeParse(raw);
  if (!parsed.success) return null;
  const { email, password } = parsed.data;
  const ip = clientIp(request.headers);
  const source = signInSource(request.headers, email, ip);
  try {
    await consumeSignInIp(ip);
    await assertSignInAllowed(email, source);
  } catch (error) {
    if (isProblemError(error))
      throw new RateLimitedSignIn(error.problem.detail, error.problem.retryAfter ?? 900);
    throw error;
  }
  const user = await findUserByEmail(email);
  // Always run bcrypt, so an unknown e-mail takes as long as a wrong password.
  if (!(await verifyPassword(password, user?.passwordHash))) {
    await recordSignInFailure(email, source);
    return null;
  }
  await clearSignInFailures(email, source);
  if (!user!.emailVerified) throw new UnverifiedEmailSignIn();
  return { id: user!.id, email: user!.email, name: user!.name };
}

export function authConfig(): NextAuthConfig {
  return {
    adapter: DrizzleAdapter(getDb(), {
      usersTable: users,
      accountsTable: accounts,
      sessionsTable: sessions,
      verificationTokensTable: verificationTokens,
    }),
    secret: env.AUTH_SECRET,
    trustHost: true,
    logger: {
      error(error) {
        const type = (error as { type?: string }).type;
        if (type && EXPECTED_AUTH_ERRORS.has(type)) console.warn(`[auth] ${type}`);
        else console.error("[auth]", error);
      },
    },
    session: { strategy: "jwt", maxAge: SESSION_MAX_AGE_SECONDS },
    pages: { signIn: "/sign-in", error: "/sign-in", verifyRequest: "/check-email" },
    providers: [
      Credentials({
        credentials: { email: { type: "email" }, password: { type: "password" } },
        authorize: authorizeWithPassword,
      }),
      Nodemailer({
        server: smtpServerOptions(),
        from: env.MAIL_FROM,
        maxAge: MAGIC_LINK_MAX_AGE_SECONDS,
        async sendVerificationRequest({ identifier, url }) {
          const mail = magicLinkMail(url, MAGIC_LINK_MAX_AGE_SECONDS / 60);
          await sendMail({ to: identifier, ...mail });
        },
      }),
    ],
    callbacks: {
      // Sign-in starts a server-side session record; every later read checks it is still live
      // (sign-out deletes it), so a copied cookie dies with the session. Null ends the session.
      async jwt({ token, user }) {
        if (user?.id) {
          token.sid = await startServerSession(user.id, SESSION_MAX_AGE_SECONDS);
          return token;
        }
        return (await isServerSessionLive(token.sid, token.sub, SESSION_MAX_AGE_SECONDS))
          ? token
          : null;
      },
      redirect({ url, baseUrl }) {
        const origin = new URL(baseUrl).origin;
        return `${origin}${safeCallbackPath(url, "/app", origin)}`;
      },
      session({ session, token }) {
        if (token.sub && session.user) session.user.id = token.sub;
        return session;
      },
    },
    events: {
      async signOut(message) {
        if ("token" in message) await endServerSession(message.token?.sid);
      },
      // Users created by the magic-link flow get their personal organisation here;
      // password sign-ups create theirs in lib/auth/sign-up.ts.
      async createUser({ user }) {
        if (!user.id || !user.email) return;
        await createOrganization({
          name: personalOrgName(user.name, user.email),
          ownerUserId: user.id,
        });
      },
    },
  };
}

/**
 * Server-side session records behind the JWT cookie. Each sign-in gets a
 * random session id (`sid` in the JWT) and a row in `sessions`; every request
 * that reads the session checks the row still exists. Signing out deletes the
 * row, so a copied cookie stops working at once; "sign out everywhere"
 * deletes every row of the user. A token without a live row is treated as an
 * ended session (the user is asked to sign in again).
 */
import "server-only";
import { and, eq, lt } from "drizzle-orm";
import { getDb } from "@/db";
import { sessions } from "@/db/schema";

/** Rows are extended when less than this is left (the cookie itself rolls on use). */
const EXTEND_WHEN_LEFT_MS = 3 * 24 * 60 * 60 * 1000;

/** Records a new session for `userId`; returns its id for the JWT. */
export async function startServerSession(userId: string, maxAgeSeconds: number): Promise<string> {
  const sid = crypto.randomUUID();
  const now = Date.now();
  const db = getDb();
  // Forget this user's sessions that ran out long ago, then record the new one.
  await db
    .delete(sessions)
    .where(and(eq(sessions.userId, userId), lt(sessions.expires, new Date(now))));
  await db
    .insert(sessions)
    .values({ sessionToken: sid, userId, expires: new Date(now + maxAgeSeconds * 1000) });
  return sid;
}

/** True when the session `sid` of `userId` has not been ended; extends it when it is getting old. */
export async function isServerSessionLive(
  sid: unknown,
  userId: unknown,
  maxAgeSeconds: number,
): Promise<boolean> {
  if (typeof sid !== "string" || typeof userId !== "string" || !sid || !userId) return false;
  const db = getDb();
  const rows = await db
    .select({ expires: sessions.expires })
    .from(sessions)
    .where(and(eq(sessions.sessionToken, sid), eq(sessions.userId, userId)))
    .limit(1);
  const row = rows[0];
  if (!row) return false;
  const now = Date.now();
  if (row.expires.getTime() <= now) return false;
  if (row.expires.getTime() - now < EXTEND_WHEN_LEFT_MS) {
    await db
      .update(sessions)
      .set({ expires: new Date(now + maxAgeSeconds * 1000) })
      .where(eq(sessions.sessionToken, sid));
  }
  return true;
}

/** Ends one session (sign-out). */
export async function endServerSession(sid: unknown): Promise<void> {
  if (typeof sid !== "string" || !sid) return;
  await getDb().delete(sessions).where(eq(sessions.sessionToken, sid));
}

/** Ends every session of the user (sign out everywhere); returns how many were live. */
export async function endAllServerSessions(userId: string): Promise<number> {
  const [result] = await getDb().delete(sessions).where(eq(sessions.userId, userId));
  return result.affectedRows;
}

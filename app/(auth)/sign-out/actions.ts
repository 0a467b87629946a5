"use server";

import { signOut } from "@/lib/auth";
import { clearCurrentOrgCookie } from "@/lib/auth/org-cookie";
import { endAllServerSessions } from "@/lib/auth/server-sessions";
import { getSessionUser } from "@/lib/auth/session";

/** Ends this session on the server (the cookie stops working everywhere it was copied), forgets the chosen organisation, and lands on the sign-in page. */
export async function signOutAction(): Promise<void> {
  await clearCurrentOrgCookie();
  await signOut({ redirectTo: "/sign-in?signedOut=1" });
}

/** Ends every session of the signed-in user — all browsers and devices — then this one. */
export async function signOutEverywhereAction(): Promise<void> {
  const user = await getSessionUser();
  if (user) await endAllServerSessions(user.id);
  await clearCurrentOrgCookie();
  await signOut({ redirectTo: "/sign-in?signedOut=everywhere" });
}

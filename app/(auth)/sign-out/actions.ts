"use server";

import { z } from "zod";
import { formAction } from "@/lib/api/action";
import { signOut } from "@/lib/auth";
import { clearCurrentOrgCookie } from "@/lib/auth/org-cookie";
import { endAllServerSessions } from "@/lib/auth/server-sessions";
import { getSessionUser } from "@/lib/auth/session";

/** Sign-out forms carry no fields; signing out without a session is a harmless no-op, so anyone may call them. */
const noFields = z.object({});

/** Ends this session on the server (the cookie stops working everywhere it was copied), forgets the chosen organisation, and lands on the sign-in page. */
export const signOutAction = formAction(noFields, async () => {
  await clearCurrentOrgCookie();
  await signOut({ redirectTo: "/sign-in?signedOut=1" });
});

/** Ends every session of the signed-in user — all browsers and devices — then this one. */
export const signOutEverywhereAction = formAction(noFields, async () => {
  const user = await getSessionUser();
  if (user) await endAllServerSessions(user.id);
  await clearCurrentOrgCookie();
  await signOut({ redirectTo: "/sign-in?signedOut=everywhere" });
});

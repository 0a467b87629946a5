"use server";

import { signOut } from "@/lib/auth";
import { clearCurrentOrgCookie } from "@/lib/auth/org-cookie";

/** Ends the session, forgets the chosen organisation, and lands on the sign-in page. */
export async function signOutAction(): Promise<void> {
  await clearCurrentOrgCookie();
  await signOut({ redirectTo: "/sign-in?signedOut=1" });
}

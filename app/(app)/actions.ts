"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { requireMembership } from "@/lib/auth/guards";
import { setCurrentOrgCookie } from "@/lib/auth/org-cookie";
import { isProblemError } from "@/lib/api/problem";

/** Org switcher: makes `orgId` the current organisation if the user belongs to it, then opens its dashboard. */
export async function switchOrgAction(formData: FormData): Promise<void> {
  const orgId = formData.get("orgId");
  if (typeof orgId === "string" && orgId) {
    try {
      const access = await requireMembership(orgId);
      await setCurrentOrgCookie(access.org.id);
    } catch (error) {
      if (!isProblemError(error)) throw error;
      if (error.status === 401) redirect("/sign-in?error=SessionExpired");
      // Not a member: stay on the current organisation.
    }
  }
  revalidatePath("/app", "layout");
  redirect("/app");
}

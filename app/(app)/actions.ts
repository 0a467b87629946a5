"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { z } from "zod";
import { userAction } from "@/lib/api/action";
import { isProblemError } from "@/lib/api/problem";
import { authorizeMember } from "@/lib/auth/guards";
import { setCurrentOrgCookie } from "@/lib/auth/org-cookie";

const switchOrgSchema = z.object({ orgId: z.string().max(64).optional() });

/** Org switcher: makes `orgId` the current organisation if the user belongs to it, then opens its dashboard. */
export const switchOrgAction = userAction(switchOrgSchema, async ({ orgId }, { userId }) => {
  if (orgId) {
    try {
      const access = await authorizeMember(userId, orgId, "viewer");
      await setCurrentOrgCookie(access.org.id);
    } catch (error) {
      if (!isProblemError(error)) throw error;
      // Not a member: stay on the current organisation.
    }
  }
  revalidatePath("/app", "layout");
  redirect("/app");
});

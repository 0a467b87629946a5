"use server";

import { redirect } from "next/navigation";
import { formAction } from "@/lib/api/action";
import { signIn } from "@/lib/auth";
import { signUpSchema } from "@/lib/auth/schemas";
import { signUp } from "@/lib/auth/sign-up";
import { setCurrentOrgCookie } from "@/lib/auth/org-cookie";

/** Creates the account and its personal organisation, signs in, opens the dashboard. */
export const signUpAction = formAction(signUpSchema, async (input) => {
  const { orgId } = await signUp(input);
  await signIn("credentials", { email: input.email, password: input.password, redirect: false });
  await setCurrentOrgCookie(orgId);
  redirect("/app?welcome=1");
});

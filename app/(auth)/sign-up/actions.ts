"use server";

import { headers } from "next/headers";
import { redirect } from "next/navigation";
import { AuthError } from "next-auth";
import { formAction } from "@/lib/api/action";
import { signIn } from "@/lib/auth";
import { registerAccount } from "@/lib/auth/register";
import { signUpSchema } from "@/lib/auth/schemas";
import { clientIp, consumeSignUp } from "@/lib/rate-limit";

/**
 * Creates the account and its personal organisation and e-mails a sign-in
 * link — or, when the address already has an account, e-mails its owner
 * instead. Both end on the same "check your e-mail" page.
 */
export const signUpAction = formAction(signUpSchema, async (input) => {
  await consumeSignUp(input.email, clientIp(await headers()));
  const outcome = await registerAccount(input);
  if (outcome === "created") {
    try {
      await signIn("nodemailer", {
        email: input.email,
        redirect: false,
        redirectTo: "/app?welcome=1",
      });
    } catch (error) {
      if (!(error instanceof AuthError)) throw error;
      console.error("[ketwise] sign-up link e-mail failed", error);
    }
  }
  redirect(`/check-email?${new URLSearchParams({ email: input.email, for: "sign-up" })}`);
});

"use server";

import { AuthError } from "next-auth";
import { headers } from "next/headers";
import { redirect } from "next/navigation";
import { z } from "zod";
import { formAction } from "@/lib/api/action";
import { signIn } from "@/lib/auth";
import {
  RateLimitedSignIn,
  UNVERIFIED_EMAIL_MESSAGE,
  UnverifiedEmailSignIn,
  WRONG_CREDENTIALS_MESSAGE,
} from "@/lib/auth/errors";
import { setDeviceCookie } from "@/lib/auth/device-cookie";
import { safeCallbackPath } from "@/lib/auth/redirects";
import { magicLinkSchema, signInSchema } from "@/lib/auth/schemas";
import { clientIp, consumeMagicLink } from "@/lib/rate-limit";

const callback = { callbackUrl: z.string().optional() };

/** E-mail + password. Unknown e-mail and wrong password get the same message. */
export const signInWithPasswordAction = formAction(signInSchema.extend(callback), async (input) => {
  try {
    await signIn("credentials", { email: input.email, password: input.password, redirect: false });
  } catch (error) {
    if (error instanceof RateLimitedSignIn)
      return { status: "error", message: error.detail, code: 429 };
    if (error instanceof UnverifiedEmailSignIn)
      return { status: "error", message: UNVERIFIED_EMAIL_MESSAGE, code: 403 };
    if (error instanceof AuthError)
      return { status: "error", message: WRONG_CREDENTIALS_MESSAGE, code: 401 };
    throw error;
  }
  // This browser now counts as the account's own: other sources' failures never slow it down.
  await setDeviceCookie(input.email);
  redirect(safeCallbackPath(input.callbackUrl));
});

/** Sends a one-time sign-in link; the same answer whether or not the e-mail has an account. */
export const requestMagicLinkAction = formAction(
  magicLinkSchema.extend(callback),
  async (input) => {
    await consumeMagicLink(input.email, clientIp(await headers()));
    try {
      await signIn("nodemailer", {
        email: input.email,
        redirect: false,
        redirectTo: safeCallbackPath(input.callbackUrl),
      });
    } catch (error) {
      if (error instanceof AuthError) {
        console.error("[ketwise] magic-link e-mail failed", error);
        return {
          status: "error",
          message: "We couldn't send the e-mail just now. Try again in a minute.",
          code: 503,
        };
      }
      throw error;
    }
    redirect(`/check-email?email=${encodeURIComponent(input.email)}`);
  },
);

/**
 * Public sign-up without account enumeration: the answer is the same whether
 * or not the address already has an account ("check your e-mail"), and the
 * work is alike (one bcrypt hash, one mail). A new address gets its account
 * and personal organisation, and a sign-in link; an existing one gets a note
 * that it already has an account. (Joining by invitation keeps signUp's 409:
 * the invitation link already proves the address.)
 */
import "server-only";
import { isProblemError } from "@/lib/api/problem";
import { env } from "@/lib/env";
import { accountExistsMail } from "@/lib/mail/templates";
import { sendMail } from "@/lib/mail/transport";
import { hashPassword } from "./password";
import { findUserByEmail } from "./queries";
import type { SignUpInput } from "./schemas";
import { signUp } from "./sign-up";

export type Registration = "created" | "exists";

async function tellOwner(email: string): Promise<void> {
  try {
    await sendMail({
      to: email,
      ...accountExistsMail(new URL("/sign-in", env.APP_URL).toString()),
    });
  } catch (error) {
    // The answer must not differ from a new account's; the failure is only logged.
    console.error("[ketwise] account-exists e-mail failed", error);
  }
}

export async function registerAccount(input: SignUpInput): Promise<Registration> {
  if (await findUserByEmail(input.email)) {
    await hashPassword(input.password); // the cost a new account pays, so timing tells nothing
    await tellOwner(input.email);
    return "exists";
  }
  try {
    await signUp(input);
    return "created";
  } catch (error) {
    // Two sign-ups racing for one address: the loser is told like any existing owner.
    if (isProblemError(error) && error.status === 409) {
      await tellOwner(input.email);
      return "exists";
    }
    throw error;
  }
}

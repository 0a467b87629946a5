/**
 * Sign-up: creates the user (bcrypt hash) and their personal organisation with
 * them as owner, in one transaction. A taken e-mail is a 409 with a field error.
 */
import "server-only";
import { db } from "@/db";
import { users } from "@/db/schema";
import { conflict } from "@/lib/api/problem";
import { createOrganization } from "@/lib/orgs/mutations";
import { hashPassword } from "./password";
import { findUserByEmail } from "./queries";
import type { SignUpInput } from "./schemas";

export const TAKEN_EMAIL_MESSAGE = "An account with this e-mail already exists. Sign in instead.";

/** Name of a new user's personal organisation. */
export function personalOrgName(name: string | null | undefined, email: string): string {
  const label = name?.trim() || email.split("@")[0];
  return `${label}'s organisation`.slice(0, 120);
}

function isDuplicateKey(error: unknown): boolean {
  const code =
    (error as { code?: string; cause?: { code?: string } })?.code ??
    (error as { cause?: { code?: string } })?.cause?.code;
  return code === "ER_DUP_ENTRY";
}

/**
 * `verified`: the address is already proven (an invitation link reached it); otherwise the
 * password works only after the sign-up link has been used (see authorizeWithPassword).
 */
export async function signUp(
  input: SignUpInput,
  options: { verified?: boolean } = {},
): Promise<{ userId: string; orgId: string }> {
  if (await findUserByEmail(input.email)) {
    throw conflict(TAKEN_EMAIL_MESSAGE, [{ path: "email", message: TAKEN_EMAIL_MESSAGE }]);
  }
  const passwordHash = await hashPassword(input.password);
  const userId = crypto.randomUUID();
  try {
    return await db.transaction(async (tx) => {
      await tx.insert(users).values({
        id: userId,
        name: input.name,
        email: input.email,
        passwordHash,
        emailVerified: options.verified ? new Date() : null,
      });
      const org = await createOrganization(
        { name: personalOrgName(input.name, input.email), ownerUserId: userId },
        tx,
      );
      return { userId, orgId: org.id };
    });
  } catch (error) {
    // Two sign-ups racing for one e-mail: the unique index decides.
    if (isDuplicateKey(error)) {
      throw conflict(TAKEN_EMAIL_MESSAGE, [{ path: "email", message: TAKEN_EMAIL_MESSAGE }]);
    }
    throw error;
  }
}

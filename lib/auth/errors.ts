/**
 * Sign-in failures Auth.js passes through to our server actions. Codes end up
 * in `?code=` of redirect URLs, so they never hint whether an e-mail exists.
 */
import { CredentialsSignin } from "next-auth";

export class RateLimitedSignIn extends CredentialsSignin {
  code = "rate_limited";
  constructor(
    readonly detail: string,
    readonly retryAfter: number,
  ) {
    super(detail);
  }
}

/**
 * The right password for an account whose address was never confirmed (its sign-up link never
 * used): refused, so nobody can use an account opened in someone else's name before the owner of
 * the address has confirmed it. Only someone who knows the password sees this message.
 */
export class UnverifiedEmailSignIn extends CredentialsSignin {
  code = "unverified";
}

export const UNVERIFIED_EMAIL_MESSAGE =
  "Confirm your e-mail address first: open the sign-in link we sent to it, or ask for a new link below. Your password works once the address is confirmed.";

/** The single message for an unknown e-mail and a wrong password alike. */
export const WRONG_CREDENTIALS_MESSAGE =
  "That e-mail and password don't match an account. Check both and try again.";

/** Messages for Auth.js error codes that land on the sign-in page as `?error=`. */
export const AUTH_ERROR_MESSAGES: Record<string, string> = {
  Verification: "That sign-in link has expired or was already used. Request a new one below.",
  CredentialsSignin: WRONG_CREDENTIALS_MESSAGE,
  AccessDenied: "You can't sign in with that account.",
  Configuration: "Sign-in is misconfigured on the server. Try again later.",
  SessionExpired: "Your session has expired. Sign in again to continue.",
};

export function authErrorMessage(code: string | undefined): string | null {
  if (!code) return null;
  return AUTH_ERROR_MESSAGES[code] ?? "Sign-in failed. Try again.";
}

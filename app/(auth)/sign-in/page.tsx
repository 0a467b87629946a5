import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { Alert } from "@/components/ui/alert";
import { cn } from "@/components/ui/cn";
import { authErrorMessage } from "@/lib/auth/errors";
import { safeCallbackPath } from "@/lib/auth/redirects";
import { getSessionUser } from "@/lib/auth/session";
import { MagicLinkForm } from "./magic-link-form";
import { PasswordForm } from "./password-form";

export const metadata: Metadata = { title: "Sign in" };

type Search = Record<string, string | string[] | undefined>;
const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);

export default async function SignInPage({ searchParams }: { searchParams: Promise<Search> }) {
  const params = await searchParams;
  const callbackUrl = safeCallbackPath(one(params.callbackUrl));
  const error = authErrorMessage(one(params.error));
  if (!error && (await getSessionUser())) redirect(callbackUrl);

  // A dead magic link lands here: offer a new link first.
  const tabParam = one(params.tab) ?? (one(params.error) === "Verification" ? "link" : undefined);
  const tab = tabParam === "link" ? "link" : "password";
  const email = one(params.email);
  const tabHref = (t: string) => `/sign-in?${new URLSearchParams({ tab: t, callbackUrl })}`;

  return (
    <div className="grid gap-6">
      <div className="grid gap-1.5">
        <h1 className="text-[22px] leading-8 font-semibold tracking-[-0.015em] text-ink">
          Sign in to Ketwise
        </h1>
        <p className="text-sm text-ink-2">
          New here?{" "}
          <Link href="/sign-up" className="font-medium text-accent-ink hover:underline">
            Create an account
          </Link>
        </p>
      </div>

      {error ? (
        <Alert tone={one(params.error) === "SessionExpired" ? "warning" : "error"} role="alert">
          {error}
        </Alert>
      ) : null}
      {one(params.signedOut) ? (
        <Alert tone="success" role="status">
          {one(params.signedOut) === "everywhere"
            ? "You have signed out on every browser and device."
            : "You have signed out."}
        </Alert>
      ) : null}

      <nav
        aria-label="Sign-in method"
        className="grid grid-cols-2 rounded-lg border border-line bg-surface-2 p-1"
      >
        {(
          [
            ["password", "Password"],
            ["link", "E-mail link"],
          ] as const
        ).map(([value, label]) => (
          <Link
            key={value}
            href={tabHref(value)}
            aria-current={tab === value ? "page" : undefined}
            className={cn(
              "rounded-md px-3 py-1.5 text-center text-sm font-medium transition-colors",
              tab === value ? "bg-surface text-ink shadow-card" : "text-ink-2 hover:text-ink",
            )}
          >
            {label}
          </Link>
        ))}
      </nav>

      {tab === "password" ? (
        <PasswordForm callbackUrl={callbackUrl} email={email} />
      ) : (
        <MagicLinkForm callbackUrl={callbackUrl} email={email} />
      )}
    </div>
  );
}

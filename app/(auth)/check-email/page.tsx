import type { Metadata } from "next";
import Link from "next/link";
import { Alert } from "@/components/ui/alert";
import { buttonClasses } from "@/components/ui/button";
import { env } from "@/lib/env";

export const metadata: Metadata = { title: "Check your e-mail" };

export default async function CheckEmailPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const params = await searchParams;
  const email = typeof params.email === "string" ? params.email : null;
  const afterSignUp = params.for === "sign-up";
  const localInbox = env.NODE_ENV !== "production" || env.SMTP_HOST === "127.0.0.1";
  return (
    <div className="grid gap-6">
      <div className="grid gap-1.5">
        <h1 className="text-[22px] leading-8 font-semibold tracking-[-0.015em] text-ink">
          Check your e-mail
        </h1>
        {afterSignUp ? (
          <p className="text-sm leading-6 text-ink-2">
            We sent a message to{" "}
            {email ? <strong className="font-medium text-ink">{email}</strong> : "that address"}.
            For a new account it holds a sign-in link (it works once and expires in 15 minutes) that
            confirms the address: your password works from then on. If the address already has an
            account, the message tells you how to sign in.
          </p>
        ) : (
          <p className="text-sm leading-6 text-ink-2">
            If {email ? <strong className="font-medium text-ink">{email}</strong> : "that address"}{" "}
            can sign in, a link is on its way. It works once and expires in 15 minutes.
          </p>
        )}
      </div>
      {localInbox ? (
        <Alert tone="info" title="Running locally?">
          Mail goes to the local inbox at{" "}
          <a href={`http://localhost:${env.MAIL_WEB_PORT}`}>localhost:{env.MAIL_WEB_PORT}</a>.
        </Alert>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <Link href="/sign-in?tab=link" className={buttonClasses({ variant: "secondary" })}>
          Send another link
        </Link>
        <Link href="/sign-in" className={buttonClasses({ variant: "ghost" })}>
          Sign in with a password
        </Link>
      </div>
    </div>
  );
}

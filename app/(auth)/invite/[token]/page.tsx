import type { Metadata } from "next";
import Link from "next/link";
import { Alert } from "@/components/ui/alert";
import { buttonClasses } from "@/components/ui/button";
import { findUserByEmail } from "@/lib/auth/queries";
import { getSessionUser } from "@/lib/auth/session";
import { previewInvitation } from "@/lib/invitations/queries";
import { ROLE_DESCRIPTIONS, ROLE_LABELS } from "@/lib/orgs/roles";
import { AcceptForm, SignUpAndJoinForm } from "./join-forms";
import { formatLongDate } from "@/lib/format";

export const metadata: Metadata = { title: "Invitation" };
export const dynamic = "force-dynamic";

function Heading({ title, children }: { title: string; children?: React.ReactNode }) {
  return (
    <div className="grid gap-1.5">
      <h1 className="text-[22px] leading-8 font-semibold tracking-[-0.015em] text-ink">{title}</h1>
      {children ? <p className="text-sm leading-6 text-ink-2">{children}</p> : null}
    </div>
  );
}

/** "Creates runs … API keys." → "creates runs … API keys." (acronyms keep their case). */
const lowerFirst = (text: string) => text.charAt(0).toLowerCase() + text.slice(1);

/** Where an invitation link lands: join, sign in first, create an account, or why the link can't be used. */
export default async function InvitePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const invitation = await previewInvitation(decodeURIComponent(token));
  if (!invitation.ok) {
    return (
      <div className="grid gap-6">
        <Heading title="This invitation can't be used" />
        <Alert tone={invitation.problem === "used" ? "info" : "error"} role="alert">
          {invitation.detail}
        </Alert>
        <Link href="/sign-in" className={buttonClasses({ variant: "secondary" })}>
          Go to sign-in
        </Link>
      </div>
    );
  }
  const user = await getSessionUser();
  const inviter = invitation.inviterName
    ? `${invitation.inviterName} invited you`
    : "You are invited";
  const intro = (
    <Heading title={`Join ${invitation.orgName}`}>
      {inviter} to join <strong className="font-medium text-ink">{invitation.orgName}</strong> on
      Ketwise as <strong className="font-medium text-ink">{ROLE_LABELS[invitation.role]}</strong>:{" "}
      {lowerFirst(ROLE_DESCRIPTIONS[invitation.role])}
    </Heading>
  );
  const callback = `/invite/${token}`;

  if (user) {
    if ((user.email ?? "").toLowerCase() !== invitation.email.toLowerCase()) {
      return (
        <div className="grid gap-6">
          {intro}
          <Alert tone="warning" role="alert" title="Signed in as someone else">
            This invitation is for <strong>{invitation.email}</strong>, but you are signed in as{" "}
            {user.email}. Sign out, then open the link again.
          </Alert>
          <Link
            href={`/sign-out?callbackUrl=${encodeURIComponent(callback)}`}
            className={buttonClasses({ variant: "secondary" })}
          >
            Sign out
          </Link>
        </div>
      );
    }
    return (
      <div className="grid gap-6">
        {intro}
        <AcceptForm token={token} orgName={invitation.orgName} />
      </div>
    );
  }

  const existing = await findUserByEmail(invitation.email);
  if (existing) {
    return (
      <div className="grid gap-6">
        {intro}
        <Alert tone="info">
          You already have a Ketwise account as <strong>{invitation.email}</strong>. Sign in and you
          come back here to join.
        </Alert>
        <Link
          href={`/sign-in?${new URLSearchParams({ callbackUrl: callback, email: invitation.email })}`}
          className={buttonClasses({ className: "w-full" })}
        >
          Sign in to accept
        </Link>
      </div>
    );
  }
  return (
    <div className="grid gap-6">
      {intro}
      <SignUpAndJoinForm token={token} email={invitation.email} orgName={invitation.orgName} />
      <p className="text-xs text-ink-3">The link expires {formatLongDate(invitation.expiresAt)}.</p>
    </div>
  );
}

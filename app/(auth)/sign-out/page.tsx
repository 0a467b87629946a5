import type { Metadata } from "next";
import Link from "next/link";
import { buttonClasses } from "@/components/ui/button";
import { SubmitButton } from "@/components/ui/submit-button";
import { getSessionUser } from "@/lib/auth/session";
import { signOutAction } from "./actions";

export const metadata: Metadata = { title: "Sign out" };

export default async function SignOutPage() {
  const user = await getSessionUser();
  if (!user) {
    return (
      <div className="grid gap-4">
        <h1 className="text-[22px] leading-8 font-semibold tracking-[-0.015em] text-ink">
          You are signed out
        </h1>
        <Link href="/sign-in" className={buttonClasses({ className: "w-fit" })}>
          Sign in
        </Link>
      </div>
    );
  }
  return (
    <div className="grid gap-6">
      <div className="grid gap-1.5">
        <h1 className="text-[22px] leading-8 font-semibold tracking-[-0.015em] text-ink">
          Sign out of Ketwise?
        </h1>
        <p className="text-sm text-ink-2">
          You are signed in as <strong className="font-medium text-ink">{user.email}</strong>.
        </p>
      </div>
      <form action={signOutAction} className="flex gap-2">
        <SubmitButton>Sign out</SubmitButton>
        <Link href="/app" className={buttonClasses({ variant: "ghost" })}>
          Cancel
        </Link>
      </form>
    </div>
  );
}

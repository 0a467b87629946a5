import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { getSessionUser } from "@/lib/auth/session";
import { SignUpForm } from "./sign-up-form";

export const metadata: Metadata = { title: "Create an account" };

export default async function SignUpPage() {
  if (await getSessionUser()) redirect("/app");
  return (
    <div className="grid gap-6">
      <div className="grid gap-1.5">
        <h1 className="text-[22px] leading-8 font-semibold tracking-[-0.015em] text-ink">
          Create your Ketwise account
        </h1>
        <p className="text-sm text-ink-2">
          You get a personal organisation on the free Sandbox plan; invite your team later.
        </p>
      </div>
      <SignUpForm />
      <p className="text-sm text-ink-2">
        Already have an account?{" "}
        <Link href="/sign-in" className="font-medium text-accent-ink hover:underline">
          Sign in
        </Link>
      </p>
    </div>
  );
}

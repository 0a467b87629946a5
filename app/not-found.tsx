import type { Metadata } from "next";
import Link from "next/link";
import { StatusPage } from "@/components/shell/status-page";
import { buttonClasses } from "@/components/ui/button";

export const metadata: Metadata = { title: "Page not found" };

/** Shown for unknown URLs and wherever a page calls notFound() (e.g. another org's run). */
export default function NotFound() {
  return (
    <StatusPage
      code="404 · not found"
      title="There is nothing at this address"
      actions={
        <>
          <Link href="/app" className={buttonClasses()}>
            Go to the dashboard
          </Link>
          <Link href="/" className={buttonClasses({ variant: "secondary" })}>
            Ketwise home
          </Link>
        </>
      }
    >
      The page may have moved, or the run, circuit or key it showed belongs to a different
      organisation from the one you have selected. Check the organisation switcher, or start again
      from the dashboard.
    </StatusPage>
  );
}

import Link from "next/link";
import { buttonClasses } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";

export default function RunNotFound() {
  return (
    <EmptyState
      title="No such run here"
      description="It may belong to another organisation, or the link is mistyped. Switch organisation if you expected to see it."
      action={
        <Link href="/app/runs" className={buttonClasses({ variant: "secondary" })}>
          All runs
        </Link>
      }
    />
  );
}

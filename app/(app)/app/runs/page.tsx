import type { Metadata } from "next";
import Link from "next/link";
import { Suspense } from "react";
import { PageHeader } from "@/components/shell/page-header";
import { RunsList } from "@/components/runs/runs-list";
import { buttonClasses } from "@/components/ui/button";
import { Skeleton } from "@/components/ui/skeleton";
import { WorkspaceFrame } from "@/components/workspace/workspace-frame";

export const metadata: Metadata = { title: "Runs" };

export default function RunsPage() {
  return (
    <WorkspaceFrame>
      <PageHeader
        title="Runs"
        description="Every run of this organisation, newest first. Select finished runs to compare them, or unfinished ones to cancel."
        actions={
          <Link href="/app/runs/new" className={buttonClasses()}>
            New run
          </Link>
        }
      />
      <Suspense fallback={<Skeleton className="h-96" />}>
        <RunsList />
      </Suspense>
    </WorkspaceFrame>
  );
}

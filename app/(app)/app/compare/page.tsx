import type { Metadata } from "next";
import { Suspense } from "react";
import { PageHeader } from "@/components/shell/page-header";
import { CompareView } from "@/components/runs/compare-view";
import { Skeleton } from "@/components/ui/skeleton";
import { WorkspaceFrame } from "@/components/workspace/workspace-frame";

export const metadata: Metadata = { title: "Compare runs" };

export default function ComparePage() {
  return (
    <WorkspaceFrame>
      <PageHeader
        title="Compare runs"
        description="Two to six runs side by side: exact, sampled and mitigated values on one scale."
      />
      <Suspense fallback={<Skeleton className="h-72" />}>
        <CompareView />
      </Suspense>
    </WorkspaceFrame>
  );
}

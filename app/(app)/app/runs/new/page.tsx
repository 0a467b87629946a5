import type { Metadata } from "next";
import { Suspense } from "react";
import { PageHeader } from "@/components/shell/page-header";
import { Skeleton } from "@/components/ui/skeleton";
import { RunBuilder } from "@/components/workspace/run-builder";
import { WorkspaceFrame } from "@/components/workspace/workspace-frame";

export const metadata: Metadata = { title: "New run" };

export default function NewRunPage() {
  return (
    <WorkspaceFrame>
      <PageHeader
        title="New run"
        description="A circuit prepares the state, an observable is measured on it. The preview updates as you type; nothing runs until you submit."
        crumbs={[{ label: "Runs", href: "/app/runs" }, { label: "New run" }]}
      />
      <Suspense fallback={<Skeleton className="h-[32rem]" />}>
        <RunBuilder />
      </Suspense>
    </WorkspaceFrame>
  );
}

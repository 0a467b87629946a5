import type { Metadata } from "next";
import { PageHeader } from "@/components/shell/page-header";
import { LibraryView } from "@/components/library/library-view";
import { WorkspaceFrame } from "@/components/workspace/workspace-frame";

export const metadata: Metadata = { title: "Library" };

export default function LibraryPage() {
  return (
    <WorkspaceFrame>
      <PageHeader
        title="Library"
        description="Circuits and observables saved by your organisation. Use one in a new run, or save your own."
      />
      <LibraryView />
    </WorkspaceFrame>
  );
}

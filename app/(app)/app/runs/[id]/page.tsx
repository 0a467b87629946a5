import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { cache } from "react";
import { PageHeader } from "@/components/shell/page-header";
import { RunView } from "@/components/runs/run-view";
import { WorkspaceFrame } from "@/components/workspace/workspace-frame";
import { getCurrentOrg } from "@/lib/auth/guards";
import { findRun } from "@/lib/runs/queries";
import { toRunView } from "@/lib/runs/serialize";

type Props = { params: Promise<{ id: string }> };

/** One lookup per request, shared by the metadata and the page. */
const loadRun = cache(async (id: string) => {
  const { current } = await getCurrentOrg();
  if (!current) return null;
  return findRun(current.org.id, id);
});

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const row = await loadRun((await params).id);
  return { title: row ? row.name : "Run not found" };
}

/** A run of the current organisation; ids of other organisations are simply not found. */
export default async function RunPage({ params }: Props) {
  const { id } = await params;
  const row = await loadRun(id);
  if (!row) notFound();
  const run = toRunView(row);
  return (
    <WorkspaceFrame>
      <PageHeader
        title={run.name}
        crumbs={[{ label: "Runs", href: "/app/runs" }, { label: run.name }]}
      />
      <RunView id={run.id} initial={run} />
    </WorkspaceFrame>
  );
}

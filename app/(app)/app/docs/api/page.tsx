import type { Metadata } from "next";
import { PageHeader } from "@/components/shell/page-header";
import { ApiDocs } from "@/components/api-docs/api-docs";
import { GateTable } from "@/components/api-docs/gate-table";

export const metadata: Metadata = { title: "API reference" };

export default function ApiDocsPage() {
  return (
    <>
      <PageHeader
        title="API reference"
        description="REST API v1, rendered from the live OpenAPI 3.1 document. Everything the app does, a script can do too."
        crumbs={[{ label: "Developers" }, { label: "API reference" }]}
      />
      <ApiDocs />
      <div className="mt-6">
        <GateTable />
      </div>
    </>
  );
}

"use client";
/**
 * The API reference page: renders the live OpenAPI 3.1 document (`GET /api/v1/openapi.json`)
 * — every operation with its parameters, request fields, responses and examples in curl,
 * Python and TypeScript — plus the conventions that hold for all of them.
 */
import useSWR from "swr";
import { useOrigin } from "@/lib/hooks/use-origin";
import { Alert } from "@/components/ui/alert";
import { Skeleton } from "@/components/ui/skeleton";
import { Conventions } from "./conventions";
import { listOperations, groupOf, type OpenApiDoc } from "./openapi-types";
import { OperationCard } from "./operation-card";
import { OperationsNav } from "./operations-nav";
import { PythonClientCard } from "./python-client-card";

export function ApiDocs() {
  const { data, error, isLoading } = useSWR<OpenApiDoc>(
    "/api/v1/openapi.json",
    async (url: string) => {
      const res = await fetch(url);
      if (!res.ok) throw new Error(`The API description answered ${res.status}.`);
      return res.json();
    },
  );
  const origin = useOrigin();
  if (error)
    return (
      <Alert tone="error" role="alert" title="The API description could not be loaded">
        {error.message}
      </Alert>
    );
  if (isLoading || !data) return <Skeleton className="h-[40rem]" />;
  const baseUrl = origin || data.servers?.[0]?.url || "http://localhost:3000";
  const ops = listOperations(data);
  const groups = [...new Set(ops.map(groupOf))];
  return (
    <div className="grid gap-6 xl:grid-cols-[14rem_minmax(0,1fr)]">
      <OperationsNav ops={ops} groups={groups} />
      <div className="grid min-w-0 gap-5">
        <Conventions baseUrl={baseUrl} />
        <PythonClientCard baseUrl={baseUrl} />
        {groups.map((g) => (
          <section key={g} className="grid gap-4" aria-labelledby={`group-${g}`}>
            <h2 id={`group-${g}`} className="text-[17px] font-semibold text-ink">
              {g}
            </h2>
            {ops
              .filter((o) => groupOf(o) === g)
              .map((o) => (
                <OperationCard
                  key={`${o.method}${o.path}`}
                  method={o.method}
                  path={o.path}
                  op={o.op}
                  doc={data}
                  baseUrl={baseUrl}
                />
              ))}
          </section>
        ))}
      </div>
    </div>
  );
}

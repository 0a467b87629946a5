/**
 * The API reference: the OpenAPI 3.1 document the API serves at `/api/v1/openapi.json`,
 * taken from its generator on the server and rendered here — every operation with its
 * parameters, request fields, responses and examples in curl, Python and TypeScript —
 * plus the conventions that hold for all of them. A server component; only the example
 * tabs and the copy buttons run in the browser. Examples address the app's public URL
 * (`APP_URL`), the same the document lists as its server.
 */
import { env } from "@/lib/env";
import { getOpenApiDocument } from "@/lib/openapi/document";
import { Conventions } from "./conventions";
import { groupOf, listOperations } from "./openapi-types";
import { OperationCard } from "./operation-card";
import { OperationsNav } from "./operations-nav";
import { PythonClientCard } from "./python-client-card";

export function ApiDocs() {
  const doc = getOpenApiDocument(env.APP_URL);
  const baseUrl = new URL(env.APP_URL).origin;
  const components = doc.components?.schemas ?? {};
  const ops = listOperations(doc);
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
                  components={components}
                  baseUrl={baseUrl}
                />
              ))}
          </section>
        ))}
      </div>
    </div>
  );
}

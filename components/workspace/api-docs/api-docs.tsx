"use client";
/**
 * The API reference page: renders the live OpenAPI 3.1 document (`GET /api/v1/openapi.json`)
 * — every operation with its parameters, request fields, responses and examples in curl,
 * Python and TypeScript — plus the conventions that hold for all of them.
 */
import useSWR from "swr";
import { useOrigin } from "@/lib/hooks/use-origin";
import { Alert } from "@/components/ui/alert";
import { Badge } from "@/components/ui/badge";
import { Card, CardBody } from "@/components/ui/card";
import { cn } from "@/components/ui/cn";
import { CodeBlock } from "@/components/ui/code-block";
import { Skeleton } from "@/components/ui/skeleton";
import { Table, TBody, TD, TH, THead, TR } from "@/components/ui/table";
import { Tabs } from "@/components/ui/tabs";
import { operationExamples } from "./examples";
import { PythonClientCard } from "./python-client-card";
import { refName, schemaFields, type JsonSchema } from "./schema-fields";

type Parameter = {
  name: string;
  in: string;
  required?: boolean;
  description?: string;
  schema?: JsonSchema;
};
type MediaType = { schema?: JsonSchema; example?: unknown };
type Operation = {
  operationId?: string;
  summary?: string;
  description?: string;
  tags?: string[];
  parameters?: Parameter[];
  requestBody?: { required?: boolean; content: Record<string, MediaType> };
  responses: Record<string, { description?: string; content?: Record<string, MediaType> }>;
  security?: Record<string, string[]>[];
};
type OpenApiDoc = {
  info: { title: string; version: string; description?: string };
  servers?: { url: string }[];
  paths: Record<string, Record<string, Operation>>;
  components?: { schemas?: Record<string, JsonSchema> };
};

const METHOD_TONE: Record<string, string> = {
  get: "border-info/30 bg-info-soft text-info",
  post: "border-ok/30 bg-ok-soft text-ok",
  delete: "border-danger/30 bg-danger-soft text-danger",
};

/** Whether the 200 answer is a file (CSV, zip) rather than JSON. */
const isFileAnswer = (op: Operation) =>
  Object.keys(op.responses["200"]?.content ?? {}).some((type) => !type.includes("json"));

const anchor = (method: string, path: string) =>
  `${method}-${path.replace(/[^a-z0-9]+/gi, "-")}`.replace(/-+$/, "");

function MethodTag({ method }: { method: string }) {
  return (
    <span
      className={cn(
        "inline-flex h-5 min-w-12 items-center justify-center rounded-[5px] border px-1.5 font-mono text-[11px] font-semibold uppercase",
        METHOD_TONE[method] ?? "border-line bg-surface-2 text-ink-2",
      )}
    >
      {method}
    </span>
  );
}

function FieldsTable({
  schema,
  components,
  label,
}: {
  schema: JsonSchema;
  components: Record<string, JsonSchema>;
  label: string;
}) {
  const rows = schemaFields(schema, components);
  if (!rows.length)
    return (
      <p className="text-[13px] text-ink-2">{schema.$ref ? refName(schema.$ref) : "No fields."}</p>
    );
  return (
    <Table aria-label={label}>
      <THead>
        <TR>
          <TH>Field</TH>
          <TH>Type</TH>
          <TH>Description</TH>
        </TR>
      </THead>
      <TBody>
        {rows.map((r, i) => (
          <TR key={`${r.path}-${i}`}>
            <TD className="align-top whitespace-nowrap">
              <span
                className="font-mono text-[12px] text-ink"
                style={{ paddingLeft: `${Math.max(0, r.path.split(".").length - 1) * 0.5}rem` }}
              >
                {r.path}
              </span>
              {r.required ? (
                <span className="ml-1.5 text-[10.5px] font-semibold text-danger">required</span>
              ) : null}
            </TD>
            <TD className="align-top font-mono text-[12px] text-ink-2">{r.type}</TD>
            <TD className="align-top text-[12.5px] leading-5 text-ink-2">
              {r.description}
              {r.values ? (
                <span className="block font-mono text-[11.5px] text-ink-3">{r.values}</span>
              ) : null}
            </TD>
          </TR>
        ))}
      </TBody>
    </Table>
  );
}

function OperationCard({
  method,
  path,
  op,
  doc,
  baseUrl,
}: {
  method: string;
  path: string;
  op: Operation;
  doc: OpenApiDoc;
  baseUrl: string;
}) {
  const components = doc.components?.schemas ?? {};
  const body = op.requestBody?.content["application/json"];
  const idem = op.parameters?.find(
    (p) => p.in === "header" && p.name.toLowerCase() === "idempotency-key",
  );
  const ex = operationExamples({
    method,
    path,
    baseUrl,
    body: body ? (body.example ?? {}) : undefined,
    headers: idem ? { "Idempotency-Key": "my-retry-key-1" } : undefined,
    download: isFileAnswer(op) ? path.split("/").pop() : undefined,
  });
  const params = (op.parameters ?? []).filter(
    (p) => p.in !== "header" || p.name.toLowerCase() === "idempotency-key",
  );
  const isPublic = Array.isArray(op.security) && op.security.length === 0;
  return (
    <Card id={anchor(method, path)} className="scroll-mt-20">
      <CardBody className="grid gap-4 pt-5">
        <div className="grid gap-1.5">
          <h3 className="flex flex-wrap items-center gap-2">
            <MethodTag method={method} />
            <span className="font-mono text-[14px] font-semibold text-ink">{path}</span>
            {isPublic ? <Badge>public</Badge> : null}
          </h3>
          {op.summary ? <p className="text-sm font-medium text-ink">{op.summary}</p> : null}
          {op.description ? (
            <p className="max-w-3xl text-[13px] leading-5 text-ink-2">{op.description}</p>
          ) : null}
        </div>
        {params.length ? (
          <section className="grid gap-2" aria-label="Parameters">
            <h4 className="text-2xs font-semibold tracking-[0.06em] text-ink-3 uppercase">
              Parameters
            </h4>
            <Table>
              <THead>
                <TR>
                  <TH>Name</TH>
                  <TH>In</TH>
                  <TH>Type</TH>
                  <TH>Description</TH>
                </TR>
              </THead>
              <TBody>
                {params.map((p) => (
                  <TR key={`${p.in}-${p.name}`}>
                    <TD className="font-mono text-[12px]">
                      {p.name}
                      {p.required ? (
                        <span className="ml-1.5 text-[10.5px] font-semibold text-danger">
                          required
                        </span>
                      ) : null}
                    </TD>
                    <TD className="text-[12.5px] text-ink-2">{p.in}</TD>
                    <TD className="font-mono text-[12px] text-ink-2">
                      {p.schema
                        ? p.schema.enum
                          ? p.schema.enum.join(" | ")
                          : ((Array.isArray(p.schema.type)
                              ? p.schema.type.join(" | ")
                              : p.schema.type) ?? "")
                        : ""}
                    </TD>
                    <TD className="text-[12.5px] text-ink-2">{p.description}</TD>
                  </TR>
                ))}
              </TBody>
            </Table>
          </section>
        ) : null}
        {body?.schema ? (
          <section className="grid gap-2" aria-label="Request body">
            <h4 className="text-2xs font-semibold tracking-[0.06em] text-ink-3 uppercase">
              Request body (JSON)
            </h4>
            <FieldsTable
              schema={body.schema}
              components={components}
              label={`Request fields of ${method.toUpperCase()} ${path}`}
            />
          </section>
        ) : null}
        <section className="grid gap-2" aria-label="Responses">
          <h4 className="text-2xs font-semibold tracking-[0.06em] text-ink-3 uppercase">
            Responses
          </h4>
          <ul className="grid gap-1 text-[13px]">
            {Object.entries(op.responses).map(([status, r]) => {
              const media = r.content ? Object.entries(r.content)[0] : undefined;
              const ref = media?.[1].schema?.$ref;
              return (
                <li key={status} className="flex flex-wrap items-baseline gap-2">
                  <span
                    className={cn(
                      "figures w-10 font-semibold",
                      status.startsWith("2") ? "text-ok" : "text-danger",
                    )}
                  >
                    {status}
                  </span>
                  <span className="text-ink-2">{r.description}</span>
                  {media ? (
                    <span className="font-mono text-[11.5px] text-ink-3">
                      {media[0]}
                      {ref ? ` · ${refName(ref)}` : ""}
                    </span>
                  ) : null}
                </li>
              );
            })}
          </ul>
        </section>
        <Tabs
          label={`Examples for ${method.toUpperCase()} ${path}`}
          variant="segmented"
          items={[
            { id: "curl", label: "curl", content: <CodeBlock code={ex.curl} maxHeight="20rem" /> },
            {
              id: "python",
              label: "Python",
              content: <CodeBlock code={ex.python} maxHeight="20rem" />,
            },
            {
              id: "ts",
              label: "TypeScript",
              content: <CodeBlock code={ex.typescript} maxHeight="20rem" />,
            },
          ]}
        />
      </CardBody>
    </Card>
  );
}

function Conventions({ baseUrl }: { baseUrl: string }) {
  return (
    <Card>
      <CardBody className="grid gap-3 pt-5 text-[13px] leading-6 text-ink-2">
        <h2 className="text-[15px] font-semibold text-ink">How the API works</h2>
        <ul className="grid list-disc gap-1.5 pl-5">
          <li>
            Base URL <code className="font-mono text-[12px] text-ink">{baseUrl}</code>. Authenticate
            with an organisation API key:{" "}
            <code className="font-mono text-[12px] text-ink">Authorization: Bearer kw_…</code>{" "}
            (create one under API keys; it is shown once).
          </li>
          <li>
            Runs are asynchronous: POST answers 202 with the queued run; then{" "}
            <code className="font-mono text-[12px] text-ink">
              GET /api/v1/runs/{"{id}"}?wait=30
            </code>{" "}
            holds the answer until the run is succeeded, failed or canceled (at most 30 s; ask again
            if it is still running) — no polling loop needed.
          </li>
          <li>
            Every answer carries{" "}
            <code className="font-mono text-[12px] text-ink">
              RateLimit-Limit, RateLimit-Remaining, RateLimit-Reset, RateLimit-Policy
            </code>{" "}
            (IETF draft-ietf-httpapi-ratelimit-headers-06); a 429 adds Retry-After. Pace yourself by
            them.
          </li>
          <li>
            A succeeded run’s files — terms.csv, counts.csv, points.csv, circuits.zip — are under{" "}
            <code className="font-mono text-[12px] text-ink">/api/v1/runs/{"{id}"}/</code>, the same
            bytes as the run page’s downloads.
          </li>
          <li>
            Send an <code className="font-mono text-[12px] text-ink">Idempotency-Key</code> header
            to make retries of a submission safe.
          </li>
          <li>
            Lists are newest first and paginated: pass the previous page’s nextCursor as cursor.
          </li>
          <li>
            Errors are RFC 9457 problem documents (
            <code className="font-mono text-[12px] text-ink">application/problem+json</code>) with
            field paths, and line/column for circuit and observable text. A run of another
            organisation answers 404.
          </li>
          <li>Qubit 0 is written first in Pauli words and bitstrings; angles are in radians.</li>
        </ul>
      </CardBody>
    </Card>
  );
}

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
  const ops = Object.entries(data.paths).flatMap(([path, methods]) =>
    Object.entries(methods)
      .filter(([m]) => ["get", "post", "put", "patch", "delete"].includes(m))
      .map(([method, op]) => ({ path, method, op })),
  );
  const groups = [...new Set(ops.map((o) => o.op.tags?.[0] ?? "Other"))];
  return (
    <div className="grid gap-6 xl:grid-cols-[14rem_minmax(0,1fr)]">
      <nav aria-label="Operations" className="xl:sticky xl:top-4 xl:self-start">
        <ul className="grid gap-3 text-[13px]">
          {groups.map((g) => (
            <li key={g}>
              <p className="mb-1 text-2xs font-semibold tracking-[0.06em] text-ink-3 uppercase">
                {g}
              </p>
              <ul className="grid gap-0.5">
                {ops
                  .filter((o) => (o.op.tags?.[0] ?? "Other") === g)
                  .map((o) => (
                    <li key={`${o.method}${o.path}`}>
                      <a
                        href={`#${anchor(o.method, o.path)}`}
                        className="flex items-center gap-2 rounded px-1 py-0.5 hover:bg-surface-2"
                      >
                        <span className="w-12 font-mono text-[10.5px] font-semibold text-ink-3 uppercase">
                          {o.method}
                        </span>
                        <span className="truncate font-mono text-[11.5px] text-ink-2">
                          {o.path.replace("/api/v1", "")}
                        </span>
                      </a>
                    </li>
                  ))}
              </ul>
            </li>
          ))}
          <li>
            <a
              href="/api/v1/openapi.json"
              className="text-[12.5px] font-medium text-accent-ink underline"
            >
              openapi.json
            </a>
          </li>
          <li>
            <a
              href="/clients/ketwise.py"
              download
              className="text-[12.5px] font-medium text-accent-ink underline"
            >
              ketwise.py (Python client)
            </a>
          </li>
        </ul>
      </nav>
      <div className="grid min-w-0 gap-5">
        <Conventions baseUrl={baseUrl} />
        <PythonClientCard baseUrl={baseUrl} />
        {groups.map((g) => (
          <section key={g} className="grid gap-4" aria-labelledby={`group-${g}`}>
            <h2 id={`group-${g}`} className="text-[17px] font-semibold text-ink">
              {g}
            </h2>
            {ops
              .filter((o) => (o.op.tags?.[0] ?? "Other") === g)
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

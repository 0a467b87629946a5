/**
 * One operation of the API reference: method and path, summary, parameters, request
 * fields, responses and examples in curl, Python and TypeScript.
 */
import { Badge } from "@/components/ui/badge";
import { Card, CardBody } from "@/components/ui/card";
import { CodeBlock } from "@/components/ui/code-block";
import { Tabs } from "@/components/ui/tabs";
import { operationExamples } from "./examples";
import { FieldsTable } from "./fields-table";
import { MethodTag } from "./method-tag";
import {
  anchor,
  isFileAnswer,
  parametersOf,
  requestBody,
  responsesOf,
  type Operation,
  type SchemaComponents,
} from "./openapi-types";
import { ParametersTable } from "./parameters-table";
import { ResponsesList } from "./responses-list";

export function OperationCard({
  method,
  path,
  op,
  components,
  baseUrl,
}: {
  method: string;
  path: string;
  op: Operation;
  components: SchemaComponents;
  baseUrl: string;
}) {
  const body = requestBody(op)?.content["application/json"];
  const idem = parametersOf(op).find(
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
  const params = parametersOf(op).filter(
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
        {params.length ? <ParametersTable params={params} /> : null}
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
        <ResponsesList responses={responsesOf(op)} />
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

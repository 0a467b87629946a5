import type { Metadata } from "next";
import { RowAction } from "@/components/admin/row-action";
import { PageHeader } from "@/components/shell/page-header";
import { Alert } from "@/components/ui/alert";
import { Badge } from "@/components/ui/badge";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { CodeBlock } from "@/components/ui/code-block";
import { EmptyState } from "@/components/ui/empty-state";
import { Table, TBody, TD, TH, THead, TR } from "@/components/ui/table";
import { requireCurrentOrg } from "@/lib/auth/guards";
import { roleAtLeast } from "@/lib/orgs/roles";
import { MAX_ENDPOINTS_PER_ORG } from "@/lib/webhooks/mutations";
import { listEndpoints, listRecentDeliveries } from "@/lib/webhooks/queries";
import { deleteWebhookAction, setWebhookEnabledAction } from "./actions";
import { CreateWebhookForm } from "./create-webhook-form";
import { VERIFY_EXAMPLE } from "./verify-example";
import { formatDateTime, plural } from "@/lib/format";

export const metadata: Metadata = { title: "Webhooks" };

const when = (d: Date) => formatDateTime(d, { seconds: true });

type Delivery = {
  status: "pending" | "delivered" | "failed";
  attempts: number;
  lastResponseStatus: number | null;
  lastError: string | null;
};

function DeliveryBadge({ d }: { d: Delivery }) {
  const answer =
    d.lastResponseStatus !== null ? `HTTP ${d.lastResponseStatus}` : d.lastError ? "no answer" : "";
  const tone = d.status === "delivered" ? "ok" : d.status === "failed" ? "danger" : "warn";
  const label =
    d.status === "pending"
      ? d.attempts
        ? "Retrying"
        : "Pending"
      : d.status === "delivered"
        ? "Delivered"
        : "Failed";
  return (
    <span className="inline-flex flex-wrap items-center gap-1.5" title={d.lastError ?? undefined}>
      <Badge tone={tone}>{label}</Badge>
      <span className="text-[12px] text-ink-3">
        {answer}
        {d.attempts ? ` · ${plural(d.attempts, "attempt")}` : ""}
      </span>
    </span>
  );
}

export default async function WebhooksPage() {
  const access = await requireCurrentOrg("viewer");
  const isAdmin = roleAtLeast(access.role, "admin");
  const [endpoints, deliveries] = isAdmin
    ? await Promise.all([listEndpoints(access.org.id), listRecentDeliveries(access.org.id)])
    : [[], []];

  return (
    <>
      <PageHeader
        title="Webhooks"
        description={
          <>
            Ketwise POSTs a signed JSON event (
            <code className="font-mono text-[13px]">run.finished</code>) to each enabled endpoint
            when a run of this organisation succeeds, fails or is canceled, and retries with growing
            pauses until the endpoint answers 2xx.
          </>
        }
      />
      {!isAdmin ? (
        <Alert tone="info" title="Only admins manage webhooks">
          Ask an admin of {access.org.name} to add an endpoint for you.
        </Alert>
      ) : (
        <div className="grid gap-6">
          <Card>
            <CardHeader
              title="New endpoint"
              description={`At most ${MAX_ENDPOINTS_PER_ORG} per organisation. Private, loopback, link-local and cloud-metadata addresses are refused; use https.`}
            />
            <CardBody>
              <CreateWebhookForm />
            </CardBody>
          </Card>
          {endpoints.length === 0 ? (
            <EmptyState
              title="No endpoints yet"
              description="Add one above; its signing secret is shown once."
            />
          ) : (
            <Table aria-label="Webhook endpoints">
              <THead>
                <TR>
                  <TH>Endpoint</TH>
                  <TH>Secret</TH>
                  <TH>Added</TH>
                  <TH>Last delivery</TH>
                  <TH className="text-right">Actions</TH>
                </TR>
              </THead>
              <TBody>
                {endpoints.map((e) => (
                  <TR key={e.id} className={e.enabled ? undefined : "text-ink-3"}>
                    <TD className="max-w-[28rem]">
                      <span className="font-mono text-[12.5px] break-all">{e.url}</span>
                      {e.description ? (
                        <span className="block text-[12px] text-ink-3">{e.description}</span>
                      ) : null}
                      {e.enabled ? null : (
                        <Badge tone="neutral" className="mt-1">
                          Disabled
                        </Badge>
                      )}
                    </TD>
                    <TD>
                      <code className="font-mono text-[12.5px]">{e.secretPrefix}…</code>
                    </TD>
                    <TD className="text-ink-2">{when(e.createdAt)}</TD>
                    <TD>
                      {e.lastDelivery ? (
                        <div className="grid gap-0.5">
                          <DeliveryBadge d={e.lastDelivery} />
                          <span className="text-[12px] text-ink-3">
                            {when(e.lastDelivery.lastAttemptAt ?? e.lastDelivery.createdAt)}
                          </span>
                        </div>
                      ) : (
                        <span className="text-ink-3">None yet</span>
                      )}
                    </TD>
                    <TD>
                      <div className="flex justify-end gap-2">
                        <RowAction
                          action={setWebhookEnabledAction}
                          fields={{ endpointId: e.id, enabled: e.enabled ? "false" : "true" }}
                          label={e.enabled ? "Disable" : "Enable"}
                        />
                        <RowAction
                          action={deleteWebhookAction}
                          fields={{ endpointId: e.id }}
                          label="Delete"
                          variant="danger"
                          confirm={{
                            title: `Delete ${e.url}?`,
                            body: "It receives nothing from now on, and its delivery history is deleted. This cannot be undone.",
                          }}
                        />
                      </div>
                    </TD>
                  </TR>
                ))}
              </TBody>
            </Table>
          )}
          {deliveries.length ? (
            <Card>
              <CardHeader
                title="Recent deliveries"
                description="The last 20 across endpoints; every attempt is recorded."
              />
              <CardBody>
                <Table aria-label="Recent deliveries">
                  <THead>
                    <TR>
                      <TH>When</TH>
                      <TH>Run</TH>
                      <TH>Endpoint</TH>
                      <TH>Status</TH>
                    </TR>
                  </THead>
                  <TBody>
                    {deliveries.map((d) => (
                      <TR key={d.id}>
                        <TD className="text-ink-2">{when(d.createdAt)}</TD>
                        <TD>
                          <a
                            href={`/app/runs/${d.runId}`}
                            className="font-mono text-[12px] text-accent-ink underline"
                          >
                            {d.runId.slice(0, 8)}
                          </a>
                        </TD>
                        <TD className="max-w-[20rem] font-mono text-[12px] break-all">{d.url}</TD>
                        <TD>
                          <DeliveryBadge d={d} />
                          {d.lastError ? (
                            <span className="block text-[12px] text-ink-3">{d.lastError}</span>
                          ) : null}
                        </TD>
                      </TR>
                    ))}
                  </TBody>
                </Table>
              </CardBody>
            </Card>
          ) : null}
          <Card>
            <CardHeader
              title="Checking a delivery"
              description="Every POST carries Ketwise-Webhook-Id (the same on every retry: deduplicate by it), Ketwise-Webhook-Timestamp (Unix seconds) and Ketwise-Webhook-Signature: v1=<hex HMAC-SHA256 of “timestamp.body” with the secret>. Redirects are not followed; answer 2xx within 10 seconds."
            />
            <CardBody>
              <CodeBlock code={VERIFY_EXAMPLE} title="Python" />
            </CardBody>
          </Card>
        </div>
      )}
    </>
  );
}

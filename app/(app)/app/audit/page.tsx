import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/shell/page-header";
import { Alert } from "@/components/ui/alert";
import { Badge } from "@/components/ui/badge";
import { buttonClasses } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { Field } from "@/components/ui/field";
import { Input } from "@/components/ui/input";
import { Select } from "@/components/ui/select";
import { Table, TBody, TD, TH, THead, TR } from "@/components/ui/table";
import { requireCurrentOrg } from "@/lib/auth/guards";
import { AUDIT_GROUPS, auditLabel } from "@/lib/audit/catalog";
import { describeAuditEvent } from "@/lib/audit/describe";
import { listAuditLog } from "@/lib/audit/queries";
import { auditFilterSchema } from "@/lib/audit/schemas";
import { listMembers } from "@/lib/orgs/queries";
import { roleAtLeast } from "@/lib/orgs/roles";
import { formatDateTime } from "@/lib/format";

export const metadata: Metadata = { title: "Audit log" };

type Search = Record<string, string | string[] | undefined>;
const when = (d: Date) => formatDateTime(d, { seconds: true });

export default async function AuditPage({ searchParams }: { searchParams: Promise<Search> }) {
  const access = await requireCurrentOrg("viewer");
  if (!roleAtLeast(access.role, "admin")) {
    return (
      <>
        <PageHeader title="Audit log" />
        <Alert tone="warning" title="Not allowed">
          The audit log is for admins and owners of {access.org.name}.
        </Alert>
      </>
    );
  }
  const raw = Object.fromEntries(
    Object.entries(await searchParams).map(([k, v]) => [k, Array.isArray(v) ? v[0] : v]),
  );
  const parsed = auditFilterSchema.safeParse(raw);
  const filter = parsed.success ? parsed.data : {};
  const [{ events, nextBefore }, members] = await Promise.all([
    listAuditLog(access.org.id, filter),
    listMembers(access.org.id),
  ]);
  const next = nextBefore
    ? `?${new URLSearchParams({ ...(raw as Record<string, string>), before: String(nextBefore) })}`
    : null;

  return (
    <>
      <PageHeader
        title="Audit log"
        description="Who changed members, invitations, API keys, the plan and seats — and when (times in UTC)."
      />
      <form
        method="get"
        className="mb-5 grid gap-3 rounded-lg border border-line bg-surface p-4 shadow-card sm:grid-cols-2 lg:grid-cols-[1fr_1fr_10rem_10rem_auto] lg:items-end"
      >
        <Field label="What">
          <Select
            name="group"
            defaultValue={filter.group ?? ""}
            placeholder="Everything"
            options={Object.entries(AUDIT_GROUPS).map(([value, label]) => ({ value, label }))}
          />
        </Field>
        <Field label="Who">
          <Select
            name="actor"
            defaultValue={filter.actor ?? ""}
            placeholder="Anyone"
            options={members.map((m) => ({
              value: m.userId,
              label: m.name ?? m.email ?? m.userId,
            }))}
          />
        </Field>
        <Field label="From">
          <Input name="from" type="date" defaultValue={filter.from ?? ""} />
        </Field>
        <Field label="To">
          <Input name="to" type="date" defaultValue={filter.to ?? ""} />
        </Field>
        <div className="flex gap-2">
          <button type="submit" className={buttonClasses({ variant: "secondary" })}>
            Filter
          </button>
          <Link href="/app/audit" className={buttonClasses({ variant: "ghost" })}>
            Clear
          </Link>
        </div>
      </form>
      {!parsed.success ? (
        <Alert tone="error" className="mb-4">
          Some filters were not understood and are ignored:{" "}
          {parsed.error.issues.map((i) => i.message).join(" ")}
        </Alert>
      ) : null}
      {events.length === 0 ? (
        <EmptyState
          title="Nothing recorded for these filters"
          description="Change or clear the filters to see more."
        />
      ) : (
        <Table>
          <THead>
            <TR>
              <TH>When (UTC)</TH>
              <TH>Who</TH>
              <TH>Event</TH>
              <TH>Details</TH>
            </TR>
          </THead>
          <TBody>
            {events.map((e) => (
              <TR key={e.id}>
                <TD className="figures text-[12.5px] whitespace-nowrap text-ink-2">
                  {when(e.createdAt)}
                </TD>
                <TD>
                  {e.actorUserId ? (
                    <span title={e.actorEmail ?? undefined}>
                      {e.actorName ?? e.actorEmail ?? "Former member"}
                    </span>
                  ) : e.apiKeyName ? (
                    <span>Key “{e.apiKeyName}”</span>
                  ) : (
                    <span className="text-ink-2">Payment provider</span>
                  )}
                </TD>
                <TD>
                  <Badge tone="neutral">{auditLabel(e.action)}</Badge>
                </TD>
                <TD className="text-ink-2">{describeAuditEvent(e.action, e.metadata)}</TD>
              </TR>
            ))}
          </TBody>
        </Table>
      )}
      {next ? (
        <div className="mt-4 flex justify-end">
          <Link href={next} className={buttonClasses({ variant: "secondary" })}>
            Older events
          </Link>
        </div>
      ) : null}
    </>
  );
}

import type { Metadata } from "next";
import { RowAction } from "@/components/admin/row-action";
import { PageHeader } from "@/components/shell/page-header";
import { Alert } from "@/components/ui/alert";
import { Badge } from "@/components/ui/badge";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { Table, TBody, TD, TH, THead, TR } from "@/components/ui/table";
import { listVisibleKeys } from "@/lib/api-keys/queries";
import { KEY_ROLES } from "@/lib/api-keys/schemas";
import { requireCurrentOrg } from "@/lib/auth/guards";
import { env } from "@/lib/env";
import { describeStanding, keyStanding, type KeyStanding } from "@/lib/api-keys/effective-role";
import { ROLE_LABELS, roleAtLeast, type Role } from "@/lib/orgs/roles";
import { revokeApiKeyAction } from "./actions";
import { CreateKeyForm } from "./create-key-form";
import { formatDateTime } from "@/lib/format";

export const metadata: Metadata = { title: "API keys" };

/** The key's role, and when its creator's role limits it, what it acts as and why. */
function KeyRole({ role, standing }: { role: Role; standing: KeyStanding | null }) {
  const why = standing ? describeStanding(standing) : null;
  if (!standing || !why) return <>{ROLE_LABELS[role]}</>;
  return (
    <div className="grid gap-1">
      <span>
        {ROLE_LABELS[role]}{" "}
        <Badge tone={standing.state === "disabled" ? "danger" : "warn"} className="ml-1">
          {standing.state === "disabled" ? "Disabled" : `Acts as ${ROLE_LABELS[standing.role]}`}
        </Badge>
      </span>
      <span className="text-[12.5px] text-ink-3">{why}</span>
    </div>
  );
}

export default async function ApiKeysPage() {
  const access = await requireCurrentOrg("viewer");
  const isAdmin = roleAtLeast(access.role, "admin");
  const canCreate = roleAtLeast(access.role, "member");
  const keys = await listVisibleKeys(access.org.id, access);
  const roles = KEY_ROLES.filter((r) => roleAtLeast(access.role, r)).map((r) => ({
    value: r,
    label: ROLE_LABELS[r],
  }));
  const scopes = [
    { value: "personal", label: "Personal" },
    ...(isAdmin ? [{ value: "organization", label: "Organisation" }] : []),
  ];

  return (
    <>
      <PageHeader
        title="API keys"
        description={
          <>
            Keys let scripts and pipelines call the REST API as{" "}
            <code className="font-mono text-[13px]">Authorization: Bearer kw_…</code>. A key never
            has more rights than the person who made it: on every request it acts with the lower of
            its own role and its creator&apos;s current role.{" "}
            {isAdmin
              ? "As an admin you see every key of the organisation."
              : "You see your own keys."}
          </>
        }
      />
      <div className="grid gap-6">
        {canCreate ? (
          <Card>
            <CardHeader
              title="New key"
              description="A key follows its creator: demoting them lowers what the key may do, and a key stops working when its creator leaves the organisation. Organisation keys (admins) are for shared automation."
            />
            <CardBody>
              <CreateKeyForm roles={roles} scopes={scopes} appUrl={env.APP_URL} />
            </CardBody>
          </Card>
        ) : (
          <Alert tone="info" title="Viewers can't create keys">
            Ask an admin for the Member role to run circuits from scripts.
          </Alert>
        )}
        {keys.length === 0 ? (
          <EmptyState
            title="No API keys yet"
            description="Create one above; the full key is shown once."
          />
        ) : (
          <Table>
            <THead>
              <TR>
                <TH>Name</TH>
                <TH>Key</TH>
                <TH>Role</TH>
                {isAdmin ? <TH>Created by</TH> : null}
                <TH>Created</TH>
                <TH>Last used</TH>
                <TH className="text-right">Status</TH>
              </TR>
            </THead>
            <TBody>
              {keys.map((k) => (
                <TR key={k.id} className={k.revokedAt ? "text-ink-3" : undefined}>
                  <TD className="font-medium">
                    {k.name}{" "}
                    {k.scope === "organization" ? (
                      <Badge tone="accent" className="ml-1">
                        Organisation
                      </Badge>
                    ) : null}
                  </TD>
                  <TD>
                    <code className="font-mono text-[12.5px]">kw_{k.prefix}_••••</code>
                  </TD>
                  <TD>
                    <KeyRole
                      role={k.role}
                      standing={k.revokedAt ? null : keyStanding(k.role, k.creatorRole)}
                    />
                  </TD>
                  {isAdmin ? (
                    <TD className="text-ink-2">{k.createdByName ?? k.createdByEmail ?? "—"}</TD>
                  ) : null}
                  <TD className="text-ink-2">{formatDateTime(k.createdAt)}</TD>
                  <TD className="text-ink-2">
                    {k.lastUsedAt ? formatDateTime(k.lastUsedAt) : "Never"}
                  </TD>
                  <TD>
                    <div className="flex justify-end">
                      {k.revokedAt ? (
                        <Badge tone="neutral">Revoked {formatDateTime(k.revokedAt)}</Badge>
                      ) : isAdmin || k.createdById === access.userId ? (
                        <RowAction
                          action={revokeApiKeyAction}
                          fields={{ keyId: k.id }}
                          label="Revoke"
                          variant="danger"
                          confirm={{
                            title: `Revoke "${k.name}"?`,
                            body: `Requests with kw_${k.prefix}_… answer 401 from now on. This cannot be undone.`,
                          }}
                        />
                      ) : (
                        <Badge tone="ok">Active</Badge>
                      )}
                    </div>
                  </TD>
                </TR>
              ))}
            </TBody>
          </Table>
        )}
      </div>
    </>
  );
}

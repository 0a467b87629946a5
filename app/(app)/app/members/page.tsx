import type { Metadata } from "next";
import { RowAction } from "@/components/admin/row-action";
import { PageHeader } from "@/components/shell/page-header";
import { Badge } from "@/components/ui/badge";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { Meter } from "@/components/ui/meter";
import { Table, TBody, TD, TH, THead, TR } from "@/components/ui/table";
import { requireCurrentOrg } from "@/lib/auth/guards";
import { getPlan } from "@/lib/billing/plans";
import { listOpenInvitations } from "@/lib/invitations/queries";
import { getSeatUsage } from "@/lib/members/seats";
import { getOrganization, listMembers } from "@/lib/orgs/queries";
import { ROLE_LABELS, roleAtLeast } from "@/lib/orgs/roles";
import { removeMemberAction, resendInvitationAction, revokeInvitationAction } from "./actions";
import { InviteForm } from "./invite-form";
import { RoleForm } from "./role-form";
import { TransferOwnership } from "./transfer-ownership";
import { formatDate, plural } from "@/lib/format";

export const metadata: Metadata = { title: "Members" };

export default async function MembersPage() {
  const access = await requireCurrentOrg("viewer");
  const org = (await getOrganization(access.org.id))!;
  const [members, invitations, seats] = await Promise.all([
    listMembers(org.id),
    listOpenInvitations(org.id),
    getSeatUsage(org),
  ]);
  const isAdmin = roleAtLeast(access.role, "admin");
  const isOwner = access.role === "owner";
  const plan = getPlan(org.plan);
  // A Server Component renders once per request, so reading the clock here is safe.
  // eslint-disable-next-line react-hooks/purity
  const now = Date.now();
  // The last owner can be neither removed nor leave (transfer ownership first), so no button for them.
  const owners = members.filter((m) => m.role === "owner").length;

  return (
    <>
      <PageHeader
        title="Members"
        description={`People in ${org.name} and what they may do. Each member and each pending invitation uses a seat.`}
      />
      <div className="grid gap-6">
        <Card>
          <CardHeader
            title="Seats"
            description={
              seats.paid
                ? `${plan.name} plan: you pay for ${plural(seats.limit, "seat")}.`
                : `${plan.name} plan: up to ${plural(seats.limit, "person", "people")}, free.`
            }
            actions={
              isAdmin ? (
                <a
                  href="/app/billing#seats"
                  className="text-[13px] font-medium text-accent-ink hover:underline"
                >
                  {seats.paid ? "Change seats" : "Upgrade"}
                </a>
              ) : null
            }
          />
          <CardBody className="grid gap-4">
            <Meter
              label="Seats in use"
              used={seats.used}
              limit={seats.limit}
              format={(n) => String(n)}
              hint={`${plural(seats.members, "member")} and ${seats.pending === 0 ? "no pending invitations" : plural(seats.pending, "pending invitation")}`}
            />
            {isAdmin ? <InviteForm seatsLeft={Math.max(0, seats.limit - seats.used)} /> : null}
          </CardBody>
        </Card>

        <section aria-labelledby="members-heading" className="grid gap-3">
          <h2 id="members-heading" className="text-[15px] font-semibold text-ink">
            {plural(members.length, "member")}
          </h2>
          <Table>
            <THead>
              <TR>
                <TH>Person</TH>
                <TH>Role</TH>
                <TH>Joined</TH>
                {isAdmin ? <TH className="text-right">Manage</TH> : null}
              </TR>
            </THead>
            <TBody>
              {members.map((m) => {
                const name = m.name ?? m.email ?? "Unnamed";
                const self = m.userId === access.userId;
                const canTouch = isAdmin && (m.role !== "owner" || (isOwner && owners > 1));
                return (
                  <TR key={m.userId}>
                    <TD>
                      <div className="grid">
                        <span className="font-medium">
                          {name}{" "}
                          {self ? <span className="font-normal text-ink-3">(you)</span> : null}
                        </span>
                        <span className="text-xs text-ink-2">{m.email}</span>
                      </div>
                    </TD>
                    <TD>
                      {canTouch && m.role !== "owner" ? (
                        <RoleForm userId={m.userId} role={m.role} name={name} />
                      ) : (
                        <Badge
                          tone={
                            m.role === "owner" ? "accent" : m.role === "admin" ? "info" : "neutral"
                          }
                        >
                          {ROLE_LABELS[m.role]}
                        </Badge>
                      )}
                    </TD>
                    <TD className="text-ink-2">{formatDate(m.joinedAt)}</TD>
                    {isAdmin ? (
                      <TD>
                        <div className="flex flex-wrap items-start justify-end gap-2">
                          {isOwner && !self && m.role !== "owner" ? (
                            <TransferOwnership userId={m.userId} name={name} orgName={org.name} />
                          ) : null}
                          {canTouch ? (
                            <RowAction
                              action={removeMemberAction}
                              fields={{ userId: m.userId }}
                              label={self ? "Leave" : "Remove"}
                              variant="ghost"
                              confirmLabel={self ? "Leave" : "Remove"}
                              confirm={{
                                title: self ? `Leave ${org.name}?` : `Remove ${name}?`,
                                body: `${self ? "You lose" : `${name} loses`} access to ${org.name} at once; personal API keys are revoked. Runs and library items stay.`,
                              }}
                            />
                          ) : null}
                        </div>
                      </TD>
                    ) : null}
                  </TR>
                );
              })}
            </TBody>
          </Table>
        </section>

        <section aria-labelledby="invitations-heading" className="grid gap-3">
          <h2 id="invitations-heading" className="text-[15px] font-semibold text-ink">
            Pending invitations
          </h2>
          {invitations.length === 0 ? (
            <EmptyState
              title="No pending invitations"
              description={
                isAdmin
                  ? "Invite colleagues by e-mail above; they join with the role you choose."
                  : "Admins invite new people."
              }
            />
          ) : (
            <Table>
              <THead>
                <TR>
                  <TH>E-mail</TH>
                  <TH>Role</TH>
                  <TH>Invited by</TH>
                  <TH>Link</TH>
                  {isAdmin ? <TH className="text-right">Manage</TH> : null}
                </TR>
              </THead>
              <TBody>
                {invitations.map((inv) => {
                  const expired = inv.expiresAt.getTime() <= now;
                  return (
                    <TR key={inv.id}>
                      <TD className="font-medium">{inv.email}</TD>
                      <TD>{ROLE_LABELS[inv.role]}</TD>
                      <TD className="text-ink-2">
                        {inv.invitedByName ?? inv.invitedByEmail ?? "—"}
                      </TD>
                      <TD>
                        {expired ? (
                          <Badge tone="warn">Expired {formatDate(inv.expiresAt)}</Badge>
                        ) : (
                          <span className="text-ink-2">Expires {formatDate(inv.expiresAt)}</span>
                        )}
                      </TD>
                      {isAdmin ? (
                        <TD>
                          <div className="flex flex-wrap items-start justify-end gap-2">
                            <RowAction
                              action={resendInvitationAction}
                              fields={{ invitationId: inv.id }}
                              label="Re-send"
                            />
                            <RowAction
                              action={revokeInvitationAction}
                              fields={{ invitationId: inv.id }}
                              label="Revoke"
                              variant="ghost"
                              confirm={{
                                title: `Revoke the invitation to ${inv.email}?`,
                                body: "The link stops working and the seat is freed.",
                              }}
                            />
                          </div>
                        </TD>
                      ) : null}
                    </TR>
                  );
                })}
              </TBody>
            </Table>
          )}
        </section>
      </div>
    </>
  );
}

/** One plain sentence per audit event, from its action and metadata. */
import { ROLE_LABELS, isRole } from "@/lib/orgs/roles";
import { isPlanId, getPlan } from "@/lib/billing/plans";
import { formatMoney, plural } from "@/lib/format";

const role = (v: unknown) => (isRole(v) ? ROLE_LABELS[v] : String(v ?? "?"));
const plan = (v: unknown) => (isPlanId(v) ? getPlan(v).name : String(v ?? "?"));
const str = (v: unknown) => (v === undefined || v === null ? "" : String(v));

export function describeAuditEvent(action: string, m: Record<string, unknown>): string {
  switch (action) {
    case "org.created":
      return "Created the organisation.";
    case "org.ownership_transferred":
      return `Made ${str(m.email)} the owner; the previous owner became ${role(m.formerOwnerNowRole)}.`;
    case "member.role_changed":
      return `${str(m.email)}: ${role(m.from)} → ${role(m.to)}.`;
    case "member.removed":
      return m.self
        ? `Left the organisation (was ${role(m.role)}).`
        : `Removed ${str(m.email)} (${role(m.role)}).${Number(m.revokedKeys) ? ` ${str(m.revokedKeys)} personal key(s) revoked.` : ""}`;
    case "invitation.created":
      return `Invited ${str(m.email)} as ${role(m.role)}.`;
    case "invitation.resent":
      return `Sent a new invitation link to ${str(m.email)}.`;
    case "invitation.revoked":
      return `Revoked the invitation to ${str(m.email)}.`;
    case "invitation.accepted":
      return `${str(m.email)} joined as ${role(m.role)}.`;
    case "api_key.created":
      return `Created ${m.scope === "organization" ? "organisation" : "personal"} key "${str(m.name)}" (kw_${str(m.prefix)}…, ${role(m.role)}).`;
    case "api_key.revoked":
      return `Revoked key${m.name ? ` "${str(m.name)}"` : ""}${m.prefix ? ` (kw_${str(m.prefix)}…)` : ""}.`;
    case "api_key.capped":
      return `Key "${str(m.name)}" (kw_${str(m.prefix)}…, ${role(m.keyRole)}) now acts as ${role(m.actsAs)}: its creator's role was lowered.`;
    case "api_key.disabled":
      return `Key "${str(m.name)}" (kw_${str(m.prefix)}…) stopped working: its creator is no longer a member.`;
    case "billing.checkout_started":
      return `Opened checkout for ${plan(m.plan)} with ${typeof m.seats === "number" ? plural(m.seats, "seat") : `${str(m.seats)} seats`}.`;
    case "billing.plan_changed":
      return `Plan ${plan(m.from)} → ${plan(m.to)}.`;
    case "billing.seats_changed":
      return `Seats ${str(m.from)} → ${str(m.to)}.`;
    case "billing.status_changed":
      return `Subscription ${str(m.from) || "none"} → ${str(m.to)}.`;
    case "billing.cancel_scheduled":
      return `Scheduled the move to Sandbox at the end of the period.`;
    case "billing.cancel_withdrawn":
      return `Withdrew the scheduled move to Sandbox.`;
    case "billing.payment_failed":
      return `A payment of ${formatMoney(Number(m.amountDue), str(m.currency) || "usd")} failed (attempt ${str(m.attempt)}).`;
    case "billing.overage_reported":
      return `Reported ${str(m.quantity)} ${m.metric === "shots" ? "shots" : "simulation-seconds"} above the included amount.`;
    default:
      return action;
  }
}

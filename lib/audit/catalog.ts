/**
 * The audit actions Ketwise records, with a label and the filter group each
 * belongs to. Names are dotted verbs (`<subject>.<what happened>`); the
 * platform records `org.created` and the API-key events with the same names.
 */
export const AUDIT_GROUPS = {
  members: "Members and roles",
  invitations: "Invitations",
  api_keys: "API keys",
  webhooks: "Webhooks",
  billing: "Plan and billing",
  organization: "Organisation",
} as const;

export type AuditGroup = keyof typeof AUDIT_GROUPS;

export const AUDIT_ACTIONS = {
  "org.created": { label: "Organisation created", group: "organization" },
  "org.renamed": { label: "Organisation renamed", group: "organization" },
  "org.ownership_transferred": { label: "Ownership transferred", group: "members" },
  "member.role_changed": { label: "Role changed", group: "members" },
  "member.removed": { label: "Member removed", group: "members" },
  "invitation.created": { label: "Invitation sent", group: "invitations" },
  "invitation.resent": { label: "Invitation re-sent", group: "invitations" },
  "invitation.revoked": { label: "Invitation revoked", group: "invitations" },
  "invitation.accepted": { label: "Invitation accepted", group: "invitations" },
  "api_key.created": { label: "API key created", group: "api_keys" },
  "api_key.revoked": { label: "API key revoked", group: "api_keys" },
  "webhook.created": { label: "Webhook endpoint added", group: "webhooks" },
  "webhook.enabled": { label: "Webhook endpoint enabled", group: "webhooks" },
  "webhook.disabled": { label: "Webhook endpoint disabled", group: "webhooks" },
  "webhook.deleted": { label: "Webhook endpoint deleted", group: "webhooks" },
  "api_key.capped": { label: "API key limited to its creator's role", group: "api_keys" },
  "api_key.disabled": { label: "API key disabled (creator left)", group: "api_keys" },
  "billing.checkout_started": { label: "Checkout started", group: "billing" },
  "billing.plan_changed": { label: "Plan changed", group: "billing" },
  "billing.seats_changed": { label: "Seats changed", group: "billing" },
  "billing.status_changed": { label: "Subscription status changed", group: "billing" },
  "billing.cancel_scheduled": { label: "Downgrade to Sandbox scheduled", group: "billing" },
  "billing.cancel_withdrawn": { label: "Scheduled downgrade withdrawn", group: "billing" },
  "billing.payment_failed": { label: "Payment failed", group: "billing" },
  "billing.overage_reported": { label: "Overage reported", group: "billing" },
} as const satisfies Record<string, { label: string; group: AuditGroup }>;

export type AuditAction = keyof typeof AUDIT_ACTIONS;

export function auditLabel(action: string): string {
  return (AUDIT_ACTIONS as Record<string, { label: string }>)[action]?.label ?? action;
}

export function actionsInGroup(group: AuditGroup): AuditAction[] {
  return (Object.keys(AUDIT_ACTIONS) as AuditAction[]).filter(
    (a) => AUDIT_ACTIONS[a].group === group,
  );
}

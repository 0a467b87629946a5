/**
 * THE access table: every route handler under app/api and every exported
 * server action, with who may call it. The matrix test walks it for every
 * role × own / other organisation × session / personal key / organisation
 * key, and fails when a route file, an HTTP method or a server action exists
 * on disk but not here — so a new endpoint cannot be forgotten.
 *
 * access: { min }    org-scoped, allowed from role `min` up;
 *         { user }   any signed-in person, outside any organisation's roles;
 *         { public } no credentials needed (the reason says why).
 */
import type { Role } from "@/lib/orgs/roles";

export type Access = { min: Role } | { user: true } | { public: string };

export type Fixtures = {
  orgA: string;
  orgB: string;
  runA: string;
  runB: string;
  circuitA: string;
  circuitB: string;
  observableA: string;
  observableB: string;
  profileB: string;
  /** A new circuit / observable / noise profile of organisation A (for deletes). */
  fresh: (kind: "circuit" | "observable" | "profile") => Promise<string>;
};

export type RouteRow = {
  /** Route file, relative to the repository root. */
  file: string;
  method: string;
  access: Access;
  /** The `[id]` of the path: which fixture (own org; the other org's twin for the cross-org check). */
  id?: "run" | "circuit" | "observable";
  /** The id must be new for each call (the call deletes it). */
  fresh?: "circuit" | "observable";
  body?: unknown;
};

const BELL = {
  format: "qasm2",
  source: 'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[2];\nh q[0];\ncx q[0],q[1];\n',
};
const RUN = { circuit: BELL, observable: { format: "pauli", terms: "ZZ" } };

export const ROUTE_TABLE: RouteRow[] = [
  {
    file: "app/api/auth/[...nextauth]/route.ts",
    method: "GET",
    access: { public: "Auth.js endpoints: sign-in pages, CSRF token, session" },
  },
  {
    file: "app/api/auth/[...nextauth]/route.ts",
    method: "POST",
    access: { public: "Auth.js endpoints: sign-in, sign-out (CSRF-checked by Auth.js)" },
  },
  {
    file: "app/api/webhooks/billing/route.ts",
    method: "POST",
    access: { public: "payment provider; authenticated by the signature" },
  },
  {
    file: "app/api/health/route.ts",
    method: "GET",
    access: { public: "liveness probe for load balancers" },
  },
  {
    file: "app/api/ready/route.ts",
    method: "GET",
    access: { public: "readiness probe: names the failing dependency, no data" },
  },
  {
    file: "app/api/metrics/route.ts",
    method: "GET",
    access: {
      public: "operator's METRICS_TOKEN, not an organisation credential (404 while unset)",
    },
  },
  {
    file: "app/api/v1/openapi.json/route.ts",
    method: "GET",
    access: { public: "the API description" },
  },
  { file: "app/api/health/route.ts", method: "GET", access: { public: "liveness probe, no data" } },
  {
    file: "app/api/ready/route.ts",
    method: "GET",
    access: { public: "readiness probe, names failing dependencies only" },
  },
  {
    file: "app/api/metrics/route.ts",
    method: "GET",
    access: { public: "operators; authenticated by METRICS_TOKEN, off when unset" },
  },
  { file: "app/api/v1/usage/route.ts", method: "GET", access: { min: "viewer" } },
  { file: "app/api/v1/runs/route.ts", method: "GET", access: { min: "viewer" } },
  { file: "app/api/v1/runs/route.ts", method: "POST", access: { min: "member" }, body: RUN },
  {
    file: "app/api/v1/runs/preview/route.ts",
    method: "POST",
    access: { min: "viewer" },
    body: RUN,
  },
  { file: "app/api/v1/runs/[id]/route.ts", method: "GET", access: { min: "viewer" }, id: "run" },
  {
    file: "app/api/v1/runs/[id]/cancel/route.ts",
    method: "POST",
    access: { min: "member" },
    id: "run",
  },
  {
    file: "app/api/v1/runs/[id]/terms.csv/route.ts",
    method: "GET",
    access: { min: "viewer" },
    id: "run",
  },
  {
    file: "app/api/v1/runs/[id]/counts.csv/route.ts",
    method: "GET",
    access: { min: "viewer" },
    id: "run",
  },
  {
    file: "app/api/v1/runs/[id]/points.csv/route.ts",
    method: "GET",
    access: { min: "viewer" },
    id: "run",
  },
  {
    file: "app/api/v1/runs/[id]/circuits.zip/route.ts",
    method: "GET",
    access: { min: "viewer" },
    id: "run",
  },
  { file: "app/api/v1/circuits/route.ts", method: "GET", access: { min: "viewer" } },
  {
    file: "app/api/v1/circuits/route.ts",
    method: "POST",
    access: { min: "member" },
    body: { ...BELL, name: "matrix circuit" },
  },
  {
    file: "app/api/v1/circuits/[id]/route.ts",
    method: "GET",
    access: { min: "viewer" },
    id: "circuit",
  },
  {
    file: "app/api/v1/circuits/[id]/route.ts",
    method: "DELETE",
    access: { min: "member" },
    id: "circuit",
    fresh: "circuit",
  },
  { file: "app/api/v1/observables/route.ts", method: "GET", access: { min: "viewer" } },
  {
    file: "app/api/v1/observables/route.ts",
    method: "POST",
    access: { min: "member" },
    body: { format: "pauli", terms: "Z0", name: "matrix observable" },
  },
  {
    file: "app/api/v1/observables/[id]/route.ts",
    method: "GET",
    access: { min: "viewer" },
    id: "observable",
  },
  {
    file: "app/api/v1/observables/[id]/route.ts",
    method: "DELETE",
    access: { min: "member" },
    id: "observable",
    fresh: "observable",
  },
];

export type ActionRow = {
  file: string;
  name: string;
  access: Access;
  /** The call, for organisation `orgId` (A = own, B = other) — FormData actions get `orgId` as a field. */
  call: (action: (...args: never[]) => unknown, fx: Fixtures, orgId: string) => Promise<unknown>;
  /** Signed out, the action does nothing harmful instead of answering 401 (signing out twice). */
  whenSignedOut?: "no-op";
};

const unknownId = "00000000-0000-4000-8000-000000000000";

function form(fields: Record<string, string>): FormData {
  const data = new FormData();
  for (const [k, v] of Object.entries(fields)) data.set(k, v);
  return data;
}

type FormActionFn = (prev: unknown, data: FormData) => Promise<unknown>;
type Fn = (...args: unknown[]) => Promise<unknown>;

/** A useActionState action, called with fields plus the organisation id. */
const viaForm =
  (fields: Record<string, string>) => (action: unknown, _fx: Fixtures, orgId: string) =>
    (action as FormActionFn)({ status: "idle" }, form({ orgId, ...fields }));

/** A JSON action (client code calls it with an object), with the organisation id in the input. */
const viaJson =
  (fields: Record<string, unknown>) => (action: unknown, _fx: Fixtures, orgId: string) =>
    (action as Fn)({ orgId, ...fields });

const ADMIN_ONLY: Access = { min: "admin" };

export const ACTION_TABLE: ActionRow[] = [
  // Anyone: they create or start a session, so they cannot require one (each validates its input first).
  {
    file: "app/(auth)/sign-up/actions.ts",
    name: "signUpAction",
    access: { public: "creates an account" },
    call: viaForm({ email: "not-an-email" }),
  },
  {
    file: "app/(auth)/sign-in/actions.ts",
    name: "signInWithPasswordAction",
    access: { public: "signs in" },
    call: viaForm({ email: "not-an-email" }),
  },
  {
    file: "app/(auth)/sign-in/actions.ts",
    name: "requestMagicLinkAction",
    access: { public: "sends a sign-in link" },
    call: viaForm({ email: "not-an-email" }),
  },
  {
    file: "app/(auth)/invite/[token]/actions.ts",
    name: "joinWithNewAccountAction",
    access: { public: "an invitation link creates the account" },
    call: viaForm({ token: "x" }),
  },
  // Any signed-in person.
  {
    file: "app/(auth)/invite/[token]/actions.ts",
    name: "acceptInvitationAction",
    access: { user: true },
    call: viaForm({ token: "not-a-real-invitation-token" }),
  },
  {
    file: "app/(auth)/sign-out/actions.ts",
    name: "signOutAction",
    access: { user: true },
    whenSignedOut: "no-op",
    call: (a) => (a as Fn)(new FormData()),
  },
  {
    file: "app/(auth)/sign-out/actions.ts",
    name: "signOutEverywhereAction",
    access: { user: true },
    whenSignedOut: "no-op",
    call: (a) => (a as Fn)(new FormData()),
  },
  {
    file: "app/(app)/actions.ts",
    name: "switchOrgAction",
    access: { user: true },
    call: (a, _fx, orgId) => (a as Fn)(form({ orgId })),
  },
  // Organisation actions.
  {
    file: "app/(app)/app/api-keys/actions.ts",
    name: "createApiKeyAction",
    access: { min: "member" },
    call: viaForm({ name: "matrix key", role: "viewer", scope: "personal" }),
  },
  {
    file: "app/(app)/app/api-keys/actions.ts",
    name: "revokeApiKeyAction",
    access: { min: "member" },
    call: viaForm({ keyId: unknownId }),
  },
  {
    file: "app/(app)/app/members/actions.ts",
    name: "changeRoleAction",
    access: ADMIN_ONLY,
    call: viaForm({ userId: unknownId, role: "viewer" }),
  },
  {
    file: "app/(app)/app/members/actions.ts",
    name: "removeMemberAction",
    access: ADMIN_ONLY,
    call: viaForm({ userId: unknownId }),
  },
  {
    file: "app/(app)/app/members/actions.ts",
    name: "transferOwnershipAction",
    access: { min: "owner" },
    call: viaForm({ userId: unknownId, confirm: "wrong name" }),
  },
  {
    file: "app/(app)/app/members/actions.ts",
    name: "inviteAction",
    access: ADMIN_ONLY,
    call: viaForm({ email: "not-an-email", role: "member" }),
  },
  {
    file: "app/(app)/app/members/actions.ts",
    name: "resendInvitationAction",
    access: ADMIN_ONLY,
    call: viaForm({ invitationId: unknownId }),
  },
  {
    file: "app/(app)/app/members/actions.ts",
    name: "revokeInvitationAction",
    access: ADMIN_ONLY,
    call: viaForm({ invitationId: unknownId }),
  },
  {
    file: "app/(app)/app/billing/actions.ts",
    name: "startCheckoutAction",
    access: ADMIN_ONLY,
    call: viaForm({}),
  },
  {
    file: "app/(app)/app/billing/actions.ts",
    name: "openPortalAction",
    access: ADMIN_ONLY,
    call: viaForm({}),
  },
  {
    file: "app/(app)/app/billing/actions.ts",
    name: "changeSeatsAction",
    access: ADMIN_ONLY,
    call: viaForm({ seats: "4" }),
  },
  {
    file: "app/(app)/app/billing/actions.ts",
    name: "changePlanAction",
    access: ADMIN_ONLY,
    call: viaForm({ plan: "institute" }),
  },
  {
    file: "app/(app)/app/billing/actions.ts",
    name: "scheduleDowngradeAction",
    access: ADMIN_ONLY,
    call: viaForm({}),
  },
  {
    file: "app/(app)/app/billing/actions.ts",
    name: "withdrawDowngradeAction",
    access: ADMIN_ONLY,
    call: viaForm({}),
  },
  {
    file: "app/(app)/app/webhooks/actions.ts",
    name: "createWebhookAction",
    access: ADMIN_ONLY,
    call: viaForm({ url: "not a url" }),
  },
  {
    file: "app/(app)/app/webhooks/actions.ts",
    name: "setWebhookEnabledAction",
    access: ADMIN_ONLY,
    call: viaForm({ endpointId: unknownId, enabled: "true" }),
  },
  {
    file: "app/(app)/app/webhooks/actions.ts",
    name: "deleteWebhookAction",
    access: ADMIN_ONLY,
    call: viaForm({ endpointId: unknownId }),
  },
  // New-run page: JSON actions, called with the organisation id like the page does (its own; the
  // other organisation's for the cross-organisation check).
  {
    file: "app/(app)/app/runs/new/noise-actions.ts",
    name: "listNoiseProfilesAction",
    access: { min: "viewer" },
    call: viaJson({}),
  },
  {
    file: "app/(app)/app/runs/new/noise-actions.ts",
    name: "saveNoiseProfileAction",
    access: { min: "member" },
    call: (a, fx, orgId) =>
      viaJson({ name: `matrix ${Math.random().toString(36).slice(2, 8)}`, noise: {} })(
        a,
        fx,
        orgId,
      ),
  },
  {
    file: "app/(app)/app/runs/new/noise-actions.ts",
    name: "deleteNoiseProfileAction",
    access: { min: "member" },
    call: async (a, fx, orgId) =>
      viaJson({ id: orgId === fx.orgA ? await fx.fresh("profile") : fx.profileB })(a, fx, orgId),
  },
];

import type { Metadata } from "next";
import { PageHeader } from "@/components/shell/page-header";
import { Alert, SimulationCaution } from "@/components/ui/alert";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { QuickStart, type QuickStartPick } from "@/components/workspace/dashboard/quick-start";
import { RecentRuns } from "@/components/workspace/dashboard/recent-runs";
import { UsageMeters } from "@/components/workspace/dashboard/usage-meters";
import { WorkspaceFrame } from "@/components/workspace/workspace-frame";
import { getCurrentOrgOrRedirect } from "@/lib/auth/guards";
import { getPlan, isPlanId } from "@/lib/billing/plans";
import { listCircuits, listObservables } from "@/lib/library/queries";
import { listMembers } from "@/lib/orgs/queries";
import { ROLE_DESCRIPTIONS, ROLE_LABELS, roleAtLeast } from "@/lib/orgs/roles";
import { formatCount } from "@/lib/format";

export const metadata: Metadata = { title: "Dashboard" };

/** The organisation's starter example: its newest circuit and observable tagged "starter". */
async function starterPick(orgId: string): Promise<QuickStartPick> {
  const [c, o] = await Promise.all([
    listCircuits(orgId, { tag: "starter", limit: 10 }),
    listObservables(orgId, { tag: "starter", limit: 10 }),
  ]);
  const circuit = c.page.find((x) => x.name === "Bell pair") ?? c.page[0];
  const observable = o.page[0];
  return circuit && observable
    ? {
        circuitId: circuit.id,
        circuitName: circuit.name,
        observableId: observable.id,
        observableName: observable.name,
      }
    : null;
}

export default async function DashboardPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const { current } = await getCurrentOrgOrRedirect("/app");
  if (!current) return null;
  const { org, role } = current;
  const [members, params, pick] = await Promise.all([
    listMembers(org.id),
    searchParams,
    starterPick(org.id),
  ]);
  const plan = isPlanId(org.plan) ? getPlan(org.plan) : null;

  return (
    <WorkspaceFrame>
      <PageHeader
        title={org.name}
        description={
          <>
            You are <strong className="font-medium text-ink">{ROLE_LABELS[role]}</strong> here
            {plan ? <> · {plan.name} plan</> : null}.
          </>
        }
      />
      {params.welcome ? (
        <Alert tone="success" title="Welcome to Ketwise" className="mb-6">
          Your organisation <strong>{org.name}</strong> is ready. You are its owner.
        </Alert>
      ) : null}
      <div className="grid gap-4">
        <div className="grid gap-4 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
          <QuickStart pick={pick} canRun={roleAtLeast(role, "member")} />
          <UsageMeters />
        </div>
        <RecentRuns />
        <div className="grid gap-4 md:grid-cols-3">
          <Card>
            <CardHeader eyebrow="Your role" title={ROLE_LABELS[role]} />
            <CardBody className="text-sm leading-6 text-ink-2">{ROLE_DESCRIPTIONS[role]}</CardBody>
          </Card>
          <Card>
            <CardHeader eyebrow="Plan" title={plan?.name ?? org.plan} />
            <CardBody className="text-sm leading-6 text-ink-2">
              {plan ? (
                <>
                  Up to <span className="figures text-ink">{plan.limits.maxStatevectorQubits}</span>{" "}
                  qubits (statevector) and{" "}
                  <span className="figures text-ink">{formatCount(plan.limits.monthlyShots)}</span>{" "}
                  shots a month.
                </>
              ) : null}
            </CardBody>
          </Card>
          <Card>
            <CardHeader
              eyebrow="Members"
              title={<span className="figures">{members.length}</span>}
            />
            <CardBody>
              <ul className="grid gap-1.5 text-sm">
                {members.slice(0, 5).map((m) => (
                  <li key={m.userId} className="flex justify-between gap-3">
                    <span className="truncate text-ink">{m.name ?? m.email}</span>
                    <span className="shrink-0 text-ink-3">{ROLE_LABELS[m.role]}</span>
                  </li>
                ))}
              </ul>
            </CardBody>
          </Card>
        </div>
        <SimulationCaution variant="inline" />
      </div>
    </WorkspaceFrame>
  );
}

import type { Metadata } from "next";
import { PageHeader } from "@/components/shell/page-header";
import { Alert } from "@/components/ui/alert";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { getCurrentOrgOrRedirect } from "@/lib/auth/guards";
import { getPlan, isPlanId } from "@/lib/billing/plans";
import { listMembers } from "@/lib/orgs/queries";
import { ROLE_DESCRIPTIONS, ROLE_LABELS } from "@/lib/orgs/roles";

export const metadata: Metadata = { title: "Dashboard" };

export default async function DashboardPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const { current } = await getCurrentOrgOrRedirect("/app");
  if (!current) return null;
  const { org, role } = current;
  const [members, params] = await Promise.all([listMembers(org.id), searchParams]);
  const plan = isPlanId(org.plan) ? getPlan(org.plan) : null;

  return (
    <>
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
                Up to <span className="figures text-ink">{plan.limits.maxStatevectorQubits}</span> qubits
                (statevector) and{" "}
                <span className="figures text-ink">{plan.limits.monthlyShots.toLocaleString("en-US")}</span> shots
                a month.
              </>
            ) : null}
          </CardBody>
        </Card>
        <Card>
          <CardHeader eyebrow="Members" title={<span className="figures">{members.length}</span>} />
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
    </>
  );
}

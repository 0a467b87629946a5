import type { Metadata } from "next";
import { PageHeader } from "@/components/shell/page-header";
import { Alert } from "@/components/ui/alert";
import { Badge } from "@/components/ui/badge";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { cn } from "@/components/ui/cn";
import { requireCurrentOrg } from "@/lib/auth/guards";
import { confirmCheckout, hasLiveSubscription } from "@/lib/billing/checkout";
import { getPlan, isPaidPlan, plans } from "@/lib/billing/plans";
import { formatLongDate, formatMoney, plural } from "@/lib/format";
import { getDailyUsage } from "@/lib/billing/queries";
import { loadProviderView } from "@/lib/billing/view";
import { getSeatUsage } from "@/lib/members/seats";
import { getOrganization } from "@/lib/orgs/queries";
import { roleAtLeast } from "@/lib/orgs/roles";
import { currentPeriod } from "@/lib/usage/period";
import { InvoicesTable } from "./invoices-table";
import { ChangePlanForm, CheckoutForm, DowngradeForm, PortalForm, SeatsForm } from "./plan-forms";
import { UsageSection } from "./usage-section";

export const metadata: Metadata = { title: "Billing" };
export const dynamic = "force-dynamic";

type Search = Record<string, string | string[] | undefined>;
const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);
const STATUS_TONE: Record<string, "ok" | "warn" | "danger" | "neutral"> = {
  active: "ok",
  past_due: "danger",
  canceled: "neutral",
  incomplete: "warn",
};

export default async function BillingPage({ searchParams }: { searchParams: Promise<Search> }) {
  const access = await requireCurrentOrg("viewer");
  const period = currentPeriod();
  const params = await searchParams;

  if (!roleAtLeast(access.role, "admin")) {
    const plan = getPlan(access.org.plan);
    return (
      <>
        <PageHeader
          title="Your usage"
          description={`Billing of ${access.org.name} is managed by its admins. Here is what your own runs used this period.`}
        />
        <UsageSection
          plan={plan}
          daily={await getDailyUsage(access.org.id, period, access.userId)}
          period={period}
          title="Your runs"
          description="Runs you submitted, in the app or with your API keys."
          showQuota={false}
        />
      </>
    );
  }

  let notice: { tone: "success" | "info" | "warning"; text: string } | null = null;
  const sessionId = one(params.session_id);
  if (one(params.checkout) === "success" && sessionId) {
    const outcome = await confirmCheckout(access.org.id, sessionId).catch(() => "pending" as const);
    notice =
      outcome === "applied"
        ? {
            tone: "success",
            text: "Payment received — your new plan is active. The first invoice is below.",
          }
        : outcome === "pending"
          ? {
              tone: "info",
              text: "Payment received; the plan switches as soon as the payment provider confirms it (usually seconds). Reload to see it.",
            }
          : null;
  } else if (one(params.checkout) === "canceled") {
    notice = {
      tone: "warning",
      text: "Checkout was canceled. Nothing was charged and your plan is unchanged.",
    };
  }

  const org = (await getOrganization(access.org.id))!;
  const plan = getPlan(org.plan);
  const [seats, daily, provider] = await Promise.all([
    getSeatUsage(org),
    getDailyUsage(org.id, period),
    loadProviderView(org),
  ]);
  const live = hasLiveSubscription(org);
  const sub = provider.ok ? provider.subscription : null;

  return (
    <>
      <PageHeader
        title="Billing"
        description={`Plan, seats, usage and invoices of ${org.name}. Payments are handled by the payment provider; Ketwise never sees card numbers.`}
      />
      <div className="grid gap-6">
        {notice ? (
          <Alert tone={notice.tone} role="status">
            {notice.text}
          </Alert>
        ) : null}
        {!provider.ok ? (
          <Alert tone="warning" role="alert" title="Payment provider unavailable">
            {provider.message} The plan and seats below are Ketwise&apos;s last known state;
            invoices, the upcoming charge and changes are unavailable until it answers again.
          </Alert>
        ) : null}
        {org.subscriptionStatus === "past_due" ? (
          <Alert tone="error" role="alert" title="Payment failed">
            The last invoice could not be paid. Pay it from the invoice list below or replace the
            card under “Card and invoices”; the provider retries automatically.
          </Alert>
        ) : null}
        {sub?.cancelAtPeriodEnd ? (
          <Alert tone="info" title="Moving to Sandbox">
            The {plan.name} plan ends on{" "}
            {sub.periodEnd ? formatLongDate(sub.periodEnd) : "the end of the period"}; after that
            the organisation is on Sandbox.
          </Alert>
        ) : null}

        <div className="grid gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
          <Card>
            <CardHeader
              eyebrow="Plan"
              title={
                <span className="flex items-center gap-2">
                  {plan.name}
                  {org.subscriptionStatus ? (
                    <Badge tone={STATUS_TONE[org.subscriptionStatus] ?? "neutral"}>
                      {org.subscriptionStatus.replace("_", " ")}
                    </Badge>
                  ) : (
                    <Badge>free</Badge>
                  )}
                </span>
              }
              description={plan.description}
              actions={live && provider.ok ? <PortalForm /> : null}
            />
            <CardBody className="grid gap-4 text-sm">
              <dl className="grid grid-cols-2 gap-x-6 gap-y-3 sm:grid-cols-3">
                <div>
                  <dt className="text-[12.5px] text-ink-2">Price</dt>
                  <dd>
                    {isPaidPlan(plan) ? (
                      <>
                        <span className="figures">{formatMoney(plan.seatPriceCents)}</span> per seat
                        / month
                      </>
                    ) : (
                      "Free"
                    )}
                  </dd>
                </div>
                <div>
                  <dt className="text-[12.5px] text-ink-2">
                    Seats used / {seats.paid ? "paid" : "allowed"}
                  </dt>
                  <dd className="figures">
                    {seats.used} / {seats.limit}
                  </dd>
                </div>
                <div>
                  <dt className="text-[12.5px] text-ink-2">Current period</dt>
                  <dd>
                    {sub?.periodStart && sub.periodEnd
                      ? `${formatLongDate(sub.periodStart)} – ${formatLongDate(sub.periodEnd)}`
                      : "Calendar month"}
                  </dd>
                </div>
              </dl>
              <div id="seats" className="scroll-mt-20 border-t border-line pt-4">
                {live ? (
                  provider.ok ? (
                    <SeatsForm
                      seats={org.seats}
                      min={Math.max(1, seats.used)}
                      max={plan.limits.seats}
                    />
                  ) : (
                    <p className="text-ink-2">
                      Seat changes are unavailable while the payment provider can&apos;t be reached.
                    </p>
                  )
                ) : (
                  <p className="text-ink-2">
                    Sandbox includes {plural(plan.limits.seats, "person", "people")}. A paid plan
                    lets you buy exactly the seats you need; more seats are charged prorated for the
                    rest of the month.
                  </p>
                )}
              </div>
            </CardBody>
          </Card>

          <Card>
            <CardHeader
              eyebrow="Next invoice"
              title={
                provider.ok && provider.upcoming
                  ? formatMoney(provider.upcoming.total, provider.upcoming.currency)
                  : "—"
              }
              description={
                provider.ok && provider.upcoming?.date
                  ? `Due ${formatLongDate(provider.upcoming.date)}`
                  : live
                    ? "No renewal scheduled."
                    : "Nothing to pay on Sandbox."
              }
            />
            <CardBody>
              {provider.ok && provider.upcoming ? (
                <ul className="grid gap-1.5 text-[13px]">
                  {provider.upcoming.lines.map((l, i) => (
                    <li key={i} className="flex justify-between gap-4">
                      <span className="text-ink-2">{l.description}</span>
                      <span className="figures">
                        {formatMoney(l.amount, provider.upcoming!.currency)}
                      </span>
                    </li>
                  ))}
                </ul>
              ) : (
                <p className="text-[13px] text-ink-2">
                  Usage above the included amounts is billed on the renewal after the month it
                  happened in.
                </p>
              )}
            </CardBody>
          </Card>
        </div>

        <UsageSection
          plan={plan}
          daily={daily}
          period={period}
          title="Usage this period"
          description="Shots and simulation time of every run in the organisation, against the plan's monthly amounts."
          showQuota
        />

        <section aria-labelledby="invoices-heading" className="grid gap-3">
          <h2 id="invoices-heading" className="text-[15px] font-semibold text-ink">
            Invoices
          </h2>
          {provider.ok ? (
            <InvoicesTable invoices={provider.invoices} />
          ) : (
            <p className="text-sm text-ink-2">
              Invoices can&apos;t be listed while the payment provider is unavailable.
            </p>
          )}
        </section>

        <section aria-labelledby="plans-heading" className="grid gap-3">
          <h2 id="plans-heading" className="text-[15px] font-semibold text-ink">
            Plans
          </h2>
          <div className="grid gap-4 md:grid-cols-3">
            {plans.map((p) => {
              const current = p.id === plan.id;
              return (
                <Card
                  key={p.id}
                  className={cn(
                    "flex flex-col",
                    current && "border-accent/60 ring-1 ring-accent/30",
                  )}
                >
                  <CardHeader
                    title={p.name}
                    eyebrow={current ? "Current plan" : undefined}
                    description={
                      isPaidPlan(p) ? `${formatMoney(p.seatPriceCents)} per seat / month` : "Free"
                    }
                  />
                  <CardBody className="flex flex-1 flex-col gap-4">
                    <ul className="grid gap-1.5 text-[13px] text-ink-2">
                      {p.features.map((f) => (
                        <li key={f}>· {f}</li>
                      ))}
                    </ul>
                    <div className="mt-auto">
                      {current || !provider.ok ? null : !live && isPaidPlan(p) ? (
                        <CheckoutForm
                          plan={p.id}
                          planName={p.name}
                          minSeats={Math.max(1, seats.used)}
                          maxSeats={p.limits.seats}
                        />
                      ) : live && isPaidPlan(p) ? (
                        <ChangePlanForm
                          plan={p.id}
                          label={`Switch to ${p.name}`}
                          primary={p.seatPriceCents > plan.seatPriceCents}
                        />
                      ) : live && !isPaidPlan(p) ? (
                        <DowngradeForm scheduled={!!sub?.cancelAtPeriodEnd} />
                      ) : null}
                    </div>
                  </CardBody>
                </Card>
              );
            })}
          </div>
          <p className="text-xs text-ink-3">
            Test mode: the local payment page accepts the provider&apos;s test card 4242 4242 4242
            4242 with any future expiry and CVC.
          </p>
        </section>
      </div>
    </>
  );
}

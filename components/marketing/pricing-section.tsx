import Link from "next/link";
import type { Plan } from "@/lib/billing/plans";
import { buttonClasses } from "@/components/ui/button";
import { cn } from "@/components/ui/cn";
import { IconCheck } from "@/components/ui/icons";
import { Section } from "./section";
import { formatCount, formatMoney, formatNumber } from "@/lib/format";

const usd = (cents: number) => formatMoney(cents, "usd", { whole: true });
const usdFine = (cents: number) => formatMoney(cents, "usd", { maxDecimals: 4 });

function hours(seconds: number): string {
  return seconds >= 3600
    ? `${formatNumber(seconds / 3600, 3)} h`
    : `${formatNumber(seconds / 60, 3)} min`;
}

function compactShots(n: number): string {
  return n >= 1e6 ? `${formatNumber(n / 1e6, 3)} M` : formatCount(n);
}

/** Pricing cards built from the plan table (lib/billing/plans.ts), passed in as props. */
export function PricingSection({
  plans,
  featuredId = "lab",
}: {
  plans: readonly Plan[];
  featuredId?: string;
}) {
  return (
    <Section
      id="pricing"
      eyebrow="Pricing"
      title="Start free, pay per seat when the group grows"
      lead="Every plan has the same engine. Plans differ in system size, monthly shots and simulation time, seats and how many runs go at once."
    >
      <div className="grid gap-5 lg:grid-cols-3">
        {plans.map((plan) => {
          const featured = plan.id === featuredId;
          const limits: [string, string][] = [
            ["Statevector", `${plan.limits.maxStatevectorQubits} qubits`],
            ["Density matrix", `${plan.limits.maxDensityMatrixQubits} qubits`],
            ["Shots / month", compactShots(plan.limits.monthlyShots)],
            ["Simulation / month", hours(plan.limits.monthlySimulationSeconds)],
            ["Runs at once", formatCount(plan.limits.concurrentRuns)],
            ["Seats", `up to ${formatCount(plan.limits.seats)}`],
          ];
          return (
            <article
              key={plan.id}
              aria-labelledby={`plan-${plan.id}`}
              className={cn(
                "relative flex flex-col rounded-xl border bg-surface p-6",
                featured
                  ? "border-accent shadow-pop ring-1 ring-accent"
                  : "border-line shadow-card",
              )}
            >
              {featured ? (
                <span className="absolute -top-2.5 left-6 rounded-full bg-accent px-2.5 py-0.5 text-2xs font-semibold text-on-accent">
                  For research groups
                </span>
              ) : null}
              <h3 id={`plan-${plan.id}`} className="text-lg font-semibold text-ink">
                {plan.name}
              </h3>
              <p className="mt-1 min-h-12 text-[13px] leading-5 text-ink-2">{plan.description}</p>
              <p className="mt-5 flex items-baseline gap-1.5">
                <span className="text-[34px] leading-none font-semibold tracking-[-0.02em] text-ink tabular-nums">
                  {plan.seatPriceCents === 0 ? "Free" : usd(plan.seatPriceCents)}
                </span>
                {plan.seatPriceCents > 0 ? (
                  <span className="text-[13px] text-ink-2">per seat / month</span>
                ) : null}
              </p>
              <Link
                href={plan.seatPriceCents === 0 ? "/sign-up" : `/sign-up?plan=${plan.id}`}
                className={buttonClasses({
                  variant: featured ? "primary" : "secondary",
                  className: "mt-5 w-full",
                })}
              >
                {plan.seatPriceCents === 0 ? "Create a free workspace" : `Start with ${plan.name}`}
              </Link>
              <dl className="mt-6 grid grid-cols-[1fr_auto] gap-x-4 gap-y-2 border-t border-line pt-5 text-[13px]">
                {limits.map(([k, v]) => (
                  <div key={k} className="contents">
                    <dt className="text-ink-2">{k}</dt>
                    <dd className="figures text-right text-[12.5px] text-ink">{v}</dd>
                  </div>
                ))}
              </dl>
              <ul className="mt-5 grid gap-2 border-t border-line pt-5">
                {plan.features.map((f) => (
                  <li
                    key={f}
                    className="grid grid-cols-[auto_1fr] gap-2 text-[13px] leading-5 text-ink-2"
                  >
                    <IconCheck className="mt-0.5 size-3.5 text-accent" />
                    {f}
                  </li>
                ))}
              </ul>
              <p className="mt-auto pt-5 text-xs leading-5 text-ink-3">
                {plan.overage
                  ? `Beyond the quota: ${usdFine(plan.overage.shotsPer1000Cents)} per 1,000 shots, ${usdFine(Number(plan.overage.simulationSecondCentsDecimal))} per simulation-second.`
                  : "Hard limits: a run that would exceed them is refused, never billed."}
              </p>
            </article>
          );
        })}
      </div>
      <p className="mt-6 text-[13px] text-ink-3">
        Prices in US dollars, billed monthly. Seats are members plus open invitations.
      </p>
    </Section>
  );
}

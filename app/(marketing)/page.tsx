import type { Metadata } from "next";
import Link from "next/link";
import { ApiSection } from "@/components/marketing/api-section";
import { Hero } from "@/components/marketing/hero";
import { PlanningSection } from "@/components/marketing/planning-section";
import { PricingSection } from "@/components/marketing/pricing-section";
import { SweepsSection } from "@/components/marketing/sweeps-section";
import { TeamsSection } from "@/components/marketing/teams-section";
import { ValuesSection } from "@/components/marketing/values-section";
import { SimulationCaution } from "@/components/ui/alert";
import { buttonClasses } from "@/components/ui/button";
import { plans } from "@/lib/billing/plans";

export const metadata: Metadata = {
  title: { absolute: "Ketwise — exact, sampled and noisy expectation values, side by side" },
};

/** The public landing page. */
export default function LandingPage() {
  return (
    <>
      <Hero />
      <ValuesSection />
      <PlanningSection />
      <SweepsSection />
      <ApiSection />
      <TeamsSection />
      <PricingSection plans={plans} />
      <section aria-labelledby="closing-title" className="mx-auto max-w-6xl px-5 py-18 sm:px-8">
        <div className="grid gap-8 rounded-2xl border border-line bg-surface p-8 shadow-card md:grid-cols-[1fr_auto] md:items-center md:p-10">
          <div className="grid gap-3">
            <h2 id="closing-title" className="text-2xl font-semibold tracking-[-0.02em] text-ink">
              Bring a circuit and a Hamiltonian.
            </h2>
            <p className="max-w-xl text-[15px] leading-7 text-ink-2">
              A free workspace takes a minute, and the preview shows qubits, measurement settings
              and the shot plan before anything runs.
            </p>
          </div>
          <div className="flex flex-wrap gap-3">
            <Link href="/sign-up" className={buttonClasses({ size: "lg" })}>
              Create a free workspace
            </Link>
            <Link href="/sign-in" className={buttonClasses({ size: "lg", variant: "secondary" })}>
              Sign in
            </Link>
          </div>
        </div>
        <SimulationCaution className="mt-6" />
      </section>
    </>
  );
}

import Link from "next/link";
import type { ReactNode } from "react";
import { Logo } from "@/components/ui/logo";
import figures from "@/lib/examples/example-figures.json";
import { formatCount, formatFixed, formatPlusMinus } from "@/lib/format";

/** The side panel's figures: the invented three-spin cluster, as the engine computes it. */
const panel = [
  { label: "exact", value: formatFixed(figures.exact, 6) },
  {
    label: `${formatCount(figures.shots, { group: "thin" })} shots`,
    value: formatPlusMinus(figures.sampled.mean, figures.sampled.stdErr),
  },
  {
    label: "noisy, mitigated",
    value: formatPlusMinus(figures.mitigated.mean, figures.mitigated.stdErr),
  },
];

/** Two-column frame for sign-in, sign-up and friends: what Ketwise does on the left, the form on the right. */
export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <div className="grid min-h-dvh lg:grid-cols-[minmax(0,5fr)_minmax(0,6fr)]">
      <aside className="relative hidden flex-col justify-between overflow-hidden border-r border-line bg-surface-2/60 p-10 lg:flex">
        <Link href="/" className="w-fit rounded-md" aria-label="Ketwise home">
          <Logo />
        </Link>
        <div className="grid max-w-md gap-6">
          <p className="text-[26px] leading-9 font-semibold tracking-[-0.02em] text-ink">
            Know what the hardware will say before you spend the shots.
          </p>
          <p className="text-[15px] leading-7 text-ink-2">
            Ketwise computes ⟨ψ|A|ψ⟩ for the state your circuit prepares — exactly, as a finite
            number of shots would estimate it, and under a noise model — and shows the three side by
            side.
          </p>
          <dl className="figures grid gap-2 rounded-lg border border-line bg-surface p-4 text-[13px] shadow-card">
            {panel.map((row) => (
              <div key={row.label} className="flex justify-between gap-4">
                <dt className="text-ink-2">{row.label}</dt>
                <dd className="text-ink">{row.value}</dd>
              </div>
            ))}
          </dl>
          <p className="text-xs text-ink-3">
            Invented example: a three-spin cluster of our own at θ = {formatFixed(figures.theta, 2)}
            , computed by Ketwise.
          </p>
        </div>
        <p className="text-xs text-ink-3">Simulated values are not device measurements.</p>
      </aside>
      <main id="main" className="flex min-h-dvh flex-col items-center justify-center px-5 py-10">
        <Link href="/" className="mb-8 rounded-md lg:hidden" aria-label="Ketwise home">
          <Logo />
        </Link>
        <div className="w-full max-w-[25rem]">{children}</div>
      </main>
    </div>
  );
}

import Link from "next/link";
import { StatusBadge } from "@/components/ui/badge";
import { buttonClasses } from "@/components/ui/button";
import { Value } from "@/components/ui/value";
import figures from "@/lib/examples/example-figures.json";
import { Z95 } from "@/lib/quantum/sampling/normal";
import { AgreementFigure, agreementAxis } from "./agreement-figure";
import { formatCount, formatFixed, formatPercent } from "@/lib/format";

/* The invented three-spin cluster (lib/examples): every figure below is the engine's. */
const example = {
  exact: figures.exact,
  sampled: figures.sampled,
  noisy: { mean: figures.noisy.mean, stdErr: figures.noisy.stdErr },
};
const zScore = (example.sampled.mean - example.exact) / example.sampled.stdErr;
/** Half-width of the shaded band around the exact value. */
const TOLERANCE = 0.02;
const axis = agreementAxis(
  [
    example.exact - TOLERANCE,
    example.exact + TOLERANCE,
    example.sampled.mean - Z95 * example.sampled.stdErr,
    example.sampled.mean + Z95 * example.sampled.stdErr,
    example.noisy.mean - Z95 * example.noisy.stdErr,
    example.noisy.mean + Z95 * example.noisy.stdErr,
  ],
  0.32,
);
const count = (n: number) => formatCount(n, { group: "thin" });

function Row({
  swatch,
  label,
  detail,
  children,
}: {
  swatch: React.ReactNode;
  label: string;
  detail: string;
  children: React.ReactNode;
}) {
  return (
    <div className="grid grid-cols-[auto_1fr_auto] items-center gap-3 py-2.5">
      <span aria-hidden className="flex w-4 justify-center">
        {swatch}
      </span>
      <div className="grid">
        <span className="text-[13px] font-medium text-ink">{label}</span>
        <span className="text-xs text-ink-3">{detail}</span>
      </div>
      <div className="text-right">{children}</div>
    </div>
  );
}

/** Landing hero: the promise in one sentence, two calls to action, and an example panel. */
export function Hero() {
  return (
    <section className="relative overflow-hidden border-b border-line">
      <div
        aria-hidden
        className="pointer-events-none absolute inset-0 bg-[linear-gradient(to_right,var(--color-line)_1px,transparent_1px),linear-gradient(to_bottom,var(--color-line)_1px,transparent_1px)] [mask-image:radial-gradient(ellipse_at_70%_30%,black,transparent_70%)] bg-[size:32px_32px] opacity-50"
      />
      <div className="relative mx-auto grid max-w-6xl items-center gap-12 px-5 pt-16 pb-20 sm:px-8 lg:grid-cols-[1fr_minmax(0,31rem)] lg:gap-12 xl:grid-cols-[1fr_minmax(0,34rem)] xl:gap-14 lg:pt-24 lg:pb-24">
        <div className="grid gap-6">
          <p className="figures text-xs font-medium tracking-wide text-accent-ink">
            ⟨ψ|A|ψ⟩ · exact · sampled · noisy
          </p>
          <h1 className="text-[40px] leading-[1.08] font-semibold tracking-[-0.03em] text-ink sm:text-5xl lg:text-[44px] xl:text-5xl">
            Know the number before you spend the hardware time.
          </h1>
          <p className="max-w-xl text-[17px] leading-7 text-ink-2">
            Ketwise computes the expectation value of your observable on the state your circuit
            prepares — the exact value, what N shots would report with an honest error bar, and what
            a noisy device would report — side by side, so you can see how far each one is from the
            truth and why.
          </p>
          <div className="flex flex-wrap items-center gap-3">
            <Link href="/sign-up" className={buttonClasses({ size: "lg" })}>
              Create a free workspace
            </Link>
            <Link href="/sign-in" className={buttonClasses({ size: "lg", variant: "secondary" })}>
              Sign in
            </Link>
          </div>
          <p className="text-[13px] text-ink-3">
            OpenQASM 2.0 and 3 · Pauli sums or Hermitian matrices · statevector and density matrix ·
            REST API
          </p>
        </div>

        <figure className="rounded-xl border border-line bg-surface shadow-pop">
          <div className="flex items-center justify-between gap-3 border-b border-line px-4 py-3">
            <div className="grid">
              <span className="text-[13px] font-semibold text-ink">
                three-spin cluster · θ = {formatFixed(figures.theta, 2)}
              </span>
              <span className="figures text-2xs text-ink-3">
                {figures.qubits} qubits · {figures.terms} terms · {figures.settings} settings ·{" "}
                {count(figures.shots)} shots
              </span>
            </div>
            <StatusBadge status="succeeded" />
          </div>
          <div className="divide-y divide-line px-4">
            <Row
              swatch={<span className="h-3.5 w-0.5 rounded bg-exact" />}
              label="Exact ⟨H⟩"
              detail="statevector, no noise"
            >
              <Value value={example.exact} tone="exact" size="lg" />
            </Row>
            <Row
              swatch={<span className="size-2.5 rounded-full bg-sampled" />}
              label="Sampled mean"
              detail={`${count(figures.shots)} shots · z = ${formatFixed(zScore, 2)} · ${
                Math.abs(zScore) <= Z95 ? "consistent" : "off by more than 1.96σ"
              }`}
            >
              <Value
                value={example.sampled.mean}
                uncertainty={example.sampled.stdErr}
                tone="sampled"
                size="lg"
              />
            </Row>
            <Row
              swatch={<span className="size-2.5 rotate-45 bg-noisy" />}
              label="Under the noise model"
              detail={`${formatPercent(figures.noise.depolarizing2q, 2, { trim: true })} depolarizing per two-qubit gate`}
            >
              <Value
                value={example.noisy.mean}
                uncertainty={example.noisy.stdErr}
                tone="noisy"
                size="lg"
              />
            </Row>
          </div>
          <div className="border-t border-line px-2 pt-3 pb-1">
            <AgreementFigure
              {...example}
              tolerance={TOLERANCE}
              domain={axis.domain}
              ticks={axis.ticks}
              className="w-full"
            />
          </div>
          <figcaption className="border-t border-line px-4 py-2.5 text-xs leading-5 text-ink-3">
            Invented example: a three-spin cluster of our own, computed by Ketwise. Shaded: ±
            {TOLERANCE} around the exact value. Simulated values, not device measurements.
          </figcaption>
        </figure>
      </div>
    </section>
  );
}

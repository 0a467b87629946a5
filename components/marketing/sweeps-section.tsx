import figures from "@/lib/examples/example-figures.json";
import { Section } from "./section";
import { SweepFigure } from "./sweep-figure";
import { formatCount } from "@/lib/format";

/** Parameter sweeps over OpenQASM 3 inputs. */
export function SweepsSection() {
  return (
    <Section
      id="sweeps"
      eyebrow="Parameter sweeps"
      title="See the landscape, not one point of it"
      lead="Declare inputs in OpenQASM 3, choose one or two of them and a range. Ketwise evaluates the grid and draws the energy as a line or a heat map, with the minimum marked and error bars wherever shots are involved."
    >
      <div className="grid items-center gap-10 lg:grid-cols-[minmax(0,34rem)_1fr]">
        <figure className="rounded-xl border border-line bg-surface p-4 shadow-card">
          <div className="mb-2 flex flex-wrap items-center gap-x-5 gap-y-1 px-1 text-xs text-ink-2">
            <span className="flex items-center gap-2">
              <span aria-hidden className="h-0.5 w-4 rounded bg-exact" /> exact ⟨H⟩(θ)
            </span>
            <span className="flex items-center gap-2">
              <span aria-hidden className="size-2 rounded-full bg-sampled" />{" "}
              {formatCount(figures.points[0].shots, { group: "thin" })} shots, 95 % bars
            </span>
            <span className="flex items-center gap-2">
              <span aria-hidden className="size-2.5 rounded-full border-[1.5px] border-accent" />{" "}
              minimum
            </span>
          </div>
          <SweepFigure className="w-full" />
          <figcaption className="sr-only">
            Sweep of the invented three-spin cluster along its one-parameter ansatz, computed by
            Ketwise.
          </figcaption>
        </figure>
        <dl className="grid gap-5 sm:grid-cols-2 lg:grid-cols-1">
          {[
            [
              "Inputs, not copies",
              "One circuit with input float[64] theta; no pasted variants to keep in sync.",
            ],
            [
              "Exact and sampled together",
              "The smooth exact curve tells you whether a dip in the samples is real.",
            ],
            [
              "Compare runs",
              "Pick up to six runs and read them side by side in one table and chart.",
            ],
          ].map(([t, d]) => (
            <div key={t} className="grid gap-1 border-l-2 border-line pl-4">
              <dt className="text-[15px] font-semibold text-ink">{t}</dt>
              <dd className="text-sm leading-6 text-ink-2">{d}</dd>
            </div>
          ))}
        </dl>
      </div>
    </Section>
  );
}

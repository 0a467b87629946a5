import { Badge } from "@/components/ui/badge";
import { Section } from "./section";
import { formatCount } from "@/lib/format";

/**
 * Shots needed for a target standard error ε when one shot of the whole estimator has
 * spread σ₁: the standard error of a mean of N shots is σ₁/√N, so N = ⌈(σ₁/ε)²⌉.
 */
function shotsFor(sigma1: number, eps: number): number {
  return Math.ceil((sigma1 / eps) ** 2 - 1e-9);
}

const SIGMA1 = 0.52; // illustrative single-shot spread, hartree
const targets = [
  { eps: 0.01, label: "10 mHa", note: "rough landscape" },
  { eps: 0.0016, label: "1.6 mHa", note: "chemical accuracy" },
  { eps: 0.0005, label: "0.5 mHa", note: "fine comparison" },
];

/** Measurement settings and shot planning to a target precision. */
export function PlanningSection() {
  return (
    <Section
      id="planning"
      eyebrow="Shot planning"
      title="Ask for a precision, get a shot budget"
      lead="Before anything runs, the preview groups your Pauli terms into measurement settings and tells you how many shots a target precision needs — and what that costs against your plan."
    >
      <div className="grid items-start gap-10 lg:grid-cols-[1fr_minmax(0,30rem)]">
        <ol className="grid gap-6">
          {[
            [
              "Group",
              "Terms that agree qubit by qubit (X with X, Z with I…) are measured together: each qubit is rotated into the Z basis of its Pauli once per setting.",
            ],
            [
              "Budget",
              "Shot noise on a ±1 outcome with mean m is √((1−m²)/N). Ketwise adds it up across terms and settings and solves for N at your target, e.g. chemical accuracy, 1.6 mHa.",
            ],
            [
              "Spend",
              "Shots are split over the settings where they reduce the error most. The plan, the settings and the expected cost are shown before you submit.",
            ],
          ].map(([t, d], i) => (
            <li key={t} className="grid grid-cols-[auto_1fr] gap-4">
              <span className="figures flex size-7 items-center justify-center rounded-full border border-line-strong text-xs text-ink-2">
                {i + 1}
              </span>
              <div className="grid gap-1">
                <h3 className="text-[15px] font-semibold text-ink">{t}</h3>
                <p className="text-sm leading-6 text-ink-2">{d}</p>
              </div>
            </li>
          ))}
        </ol>

        <figure className="rounded-xl border border-line bg-surface shadow-card">
          <div className="flex items-center justify-between border-b border-line px-4 py-3">
            <span className="text-[13px] font-semibold text-ink">Shot plan</span>
            <span className="figures text-2xs text-ink-3">σ₁ = {SIGMA1} Ha per shot</span>
          </div>
          <table className="w-full text-[13px]">
            <caption className="sr-only">Total shots needed for three target precisions</caption>
            <thead>
              <tr className="border-b border-line text-left text-2xs tracking-[0.06em] text-ink-3 uppercase">
                <th scope="col" className="px-4 py-2 font-semibold">
                  Target ε
                </th>
                <th scope="col" className="px-4 py-2 text-right font-semibold">
                  Shots N
                </th>
                <th scope="col" className="px-4 py-2 font-semibold">
                  <span className="sr-only">Note</span>
                </th>
              </tr>
            </thead>
            <tbody className="divide-y divide-line">
              {targets.map((t) => (
                <tr key={t.label}>
                  <td className="figures px-4 py-3 text-ink">± {t.label}</td>
                  <td className="figures px-4 py-3 text-right text-ink">
                    {formatCount(shotsFor(SIGMA1, t.eps))}
                  </td>
                  <td className="px-4 py-3 text-right">
                    {t.eps === 0.0016 ? (
                      <Badge tone="accent">{t.note}</Badge>
                    ) : (
                      <span className="text-xs text-ink-3">{t.note}</span>
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          <figcaption className="border-t border-line px-4 py-3 text-xs leading-5 text-ink-3">
            N = (σ₁ / ε)²: ten times the precision costs a hundred times the shots. Illustrative σ₁;
            Ketwise computes it from your state and Hamiltonian.
          </figcaption>
        </figure>
      </div>
    </Section>
  );
}

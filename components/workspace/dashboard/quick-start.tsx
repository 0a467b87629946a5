import Link from "next/link";
import { buttonClasses } from "@/components/ui/button";
import { Card, CardBody, CardHeader } from "@/components/ui/card";

export type QuickStartPick = {
  circuitId: string;
  circuitName: string;
  observableId: string;
  observableName: string;
} | null;

/**
 * Three steps from nothing to a trusted number: open a ready example (the organisation's
 * starter circuit and observable when it has them), read the agreement, compare.
 */
export function QuickStart({ pick, canRun }: { pick: QuickStartPick; canRun: boolean }) {
  const href = pick
    ? `/app/runs/new?circuit=${pick.circuitId}&observable=${pick.observableId}`
    : "/app/runs/new";
  const steps = [
    {
      n: 1,
      title: pick ? `Open “${pick.circuitName}” with “${pick.observableName}”` : "Start a new run",
      text: "The preview shows qubits, gates, measurement settings and what the run costs before anything runs.",
    },
    {
      n: 2,
      title: "Run it and read the agreement",
      text: "Exact value, sampled mean with its 95 % interval, z-score and a plain verdict.",
    },
    {
      n: 3,
      title: "Add noise, run again, compare",
      text: "Turn on a noise profile and readout mitigation, then put both runs side by side.",
    },
  ];
  return (
    <Card>
      <CardHeader eyebrow="Quick start" title="Your first trusted number in a minute" />
      <CardBody className="grid gap-4">
        <ol className="grid gap-3">
          {steps.map((s) => (
            <li key={s.n} className="flex gap-3">
              <span className="figures flex size-6 shrink-0 items-center justify-center rounded-full bg-accent-soft text-xs font-semibold text-accent-ink">
                {s.n}
              </span>
              <span className="grid gap-0.5">
                <span className="text-sm font-medium text-ink">{s.title}</span>
                <span className="text-[13px] leading-5 text-ink-2">{s.text}</span>
              </span>
            </li>
          ))}
        </ol>
        <div className="flex flex-wrap gap-2">
          <Link href={href} className={buttonClasses()}>
            {canRun ? "Start with the example" : "Look at the example"}
          </Link>
          <Link href="/app/library" className={buttonClasses({ variant: "secondary" })}>
            Browse the library
          </Link>
        </div>
      </CardBody>
    </Card>
  );
}

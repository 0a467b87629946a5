/**
 * The agreement panel: ideal (noiseless exact), exact under the noise model, the sampled
 * mean ± standard error and the readout-mitigated mean side by side in concise notation;
 * the 95 % intervals on a number line with the exact value marked; the z-score of the
 * deviation and a plain verdict (see ./verdict.ts for the rule and why readout error
 * makes the mitigated mean the fair comparison).
 */
import { AgreementLine, type AgreementLane } from "@/components/charts/agreement-line";
import { Badge } from "@/components/ui/badge";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { cn } from "@/components/ui/cn";
import { Value, type ValueTone } from "@/components/ui/value";
import type { EstimateRequest, EstimateResult } from "@/lib/swr/types";
import { FEW_SHOTS_PER_SETTING, INTERVAL_METHOD_SENTENCE } from "@/lib/quantum/sampling/interval";
import {
  agreementVerdict,
  pickComparison,
  verdictSentence,
  type Verdict,
} from "@/lib/runs/verdict";
import { formatExponential, formatFixed, plural } from "@/lib/format";

function Figure({
  label,
  hint,
  value,
  uncertainty,
  tone,
  emphasis,
}: {
  label: string;
  hint: string;
  value: number | null | undefined;
  uncertainty?: number | null;
  tone: ValueTone;
  emphasis?: boolean;
}) {
  return (
    <div
      className={cn(
        "grid content-start gap-1 rounded-md border px-3.5 py-3",
        emphasis ? "border-line-strong bg-surface" : "border-line bg-surface-2/40",
      )}
    >
      <dt className="text-2xs font-semibold tracking-[0.06em] text-ink-3 uppercase">{label}</dt>
      <dd className="grid gap-0.5">
        <Value value={value} uncertainty={uncertainty} tone={tone} size="lg" decimals={6} />
        <span className="text-xs text-ink-3">{hint}</span>
      </dd>
    </div>
  );
}

const verdictLook: Record<Verdict["kind"], { tone: "ok" | "danger" | "neutral"; label: string }> = {
  consistent: { tone: "ok", label: "Consistent" },
  exact: { tone: "ok", label: "Exact agreement" },
  suspicious: { tone: "danger", label: "Suspicious" },
  unavailable: { tone: "neutral", label: "Exact only" },
};

export function AgreementPanel({
  request,
  result,
  pointLabel,
}: {
  request: EstimateRequest;
  result: EstimateResult;
  /** For a sweep: which grid point the panel describes, e.g. "θ = 0". */
  pointLabel?: string | null;
}) {
  const { ideal, exact, sampled, mitigated } = result;
  const noisy =
    !!request.noise &&
    Math.abs(exact.value - ideal.value) > 1e-12 * Math.max(1, Math.abs(ideal.value));
  const hasNoise = !!request.noise && Object.keys(request.noise).length > 0;
  const choice = pickComparison({ readout: request.noise?.readout, hasMitigated: !!mitigated });
  const basis = choice.basis === "mitigated" && mitigated ? mitigated : sampled;
  const verdict = agreementVerdict(basis, exact.value);
  const rawVerdict = choice.basis === "mitigated" ? agreementVerdict(sampled, exact.value) : null;
  const look = verdictLook[verdict.kind];
  const thinnest = result.groups.length > 0 ? Math.min(...result.groups.map((g) => g.shots)) : 0;
  const fewShots = sampled && thinnest > 0 && thinnest < FEW_SHOTS_PER_SETTING ? thinnest : 0;

  const lanes: AgreementLane[] = [];
  if (sampled)
    lanes.push({
      label: mitigated ? "raw" : "sampled",
      mean: sampled.mean,
      ci95: sampled.ci95,
      tone: "sampled",
    });
  if (mitigated)
    lanes.push({
      label: "mitigated",
      mean: mitigated.mean,
      ci95: mitigated.ci95,
      tone: "mitigated",
    });

  return (
    <Card aria-labelledby="agreement-title">
      <CardHeader
        eyebrow="Agreement"
        title={
          <span id="agreement-title">
            ⟨A⟩ exact and sampled
            {pointLabel ? <span className="font-normal text-ink-2"> · at {pointLabel}</span> : null}
          </span>
        }
        actions={
          <Badge tone={look.tone} className="h-6 px-2 text-[12.5px]" data-testid="verdict">
            {look.label}
          </Badge>
        }
      />
      <CardBody className="grid gap-4">
        <dl className="grid gap-2 sm:grid-cols-2 xl:grid-cols-4">
          <Figure
            label={hasNoise ? "Ideal" : "Exact"}
            hint={hasNoise ? "noiseless ⟨ψ|A|ψ⟩" : "⟨ψ|A|ψ⟩, no noise"}
            value={ideal.value}
            tone="exact"
            emphasis={!hasNoise}
          />
          {hasNoise ? (
            <Figure
              label="Exact under noise"
              hint="Tr(ρA), no readout error"
              value={exact.value}
              tone="noisy"
              emphasis
            />
          ) : null}
          {sampled ? (
            <Figure
              label={mitigated ? "Sampled, raw" : "Sampled"}
              hint={`${plural(sampled.shots, "shot")}, ${plural(sampled.settings, "setting")}`}
              value={sampled.mean}
              uncertainty={sampled.stdErr}
              tone="sampled"
            />
          ) : null}
          {mitigated ? (
            <Figure
              label="Readout-mitigated"
              hint="assignment error inverted"
              value={mitigated.mean}
              uncertainty={mitigated.stdErr}
              tone="mitigated"
            />
          ) : null}
        </dl>
        {lanes.length ? (
          <AgreementLine
            exact={exact.value}
            ideal={noisy ? ideal.value : null}
            lanes={lanes}
            className="w-full"
          />
        ) : null}
        <div className="grid gap-1.5 rounded-md border border-line bg-surface-2/40 px-3.5 py-3 text-[13px] leading-5">
          <p className="text-ink" data-testid="verdict-sentence">
            {verdictSentence(verdict, choice.basis === "mitigated" ? "mitigated" : "sampled")}
          </p>
          {verdict.z !== null ? (
            <p className="figures text-xs text-ink-2">
              z = {formatFixed(verdict.z, 2)} · two-sided p ={" "}
              {verdict.p! < 1e-4 ? formatExponential(verdict.p!, 1) : formatFixed(verdict.p!, 3)} ·
              verdict threshold |z| ≤ 3
            </p>
          ) : null}
          {sampled ? (
            <p className="text-xs text-ink-2" data-testid="interval-method">
              {INTERVAL_METHOD_SENTENCE}
            </p>
          ) : null}
          {fewShots ? (
            <p className="text-xs text-warn" role="note" data-testid="few-shots">
              Only {plural(fewShots, "shot")} in the thinnest measurement setting: fewer than{" "}
              {FEW_SHOTS_PER_SETTING} per setting cannot give an honest precision, so read the bar
              as a rough range and add shots before relying on it.
            </p>
          ) : null}
          {choice.readoutBiased ? (
            <p className="text-xs text-ink-2">
              The noise model includes readout error, which the exact value leaves out, so the raw
              mean is biased by design
              {rawVerdict?.z !== null && rawVerdict?.z !== undefined ? (
                <> (raw z = {formatFixed(rawVerdict.z, 1)})</>
              ) : null}
              .{" "}
              {mitigated
                ? "The verdict compares the mitigated mean."
                : "Turn on readout mitigation to compare fairly."}
            </p>
          ) : null}
          {noisy ? (
            <p className="text-xs text-ink-2">
              Noise moves the exact value by{" "}
              <Value value={exact.value - ideal.value} decimals={6} size="sm" tone="noisy" /> from
              the ideal.
            </p>
          ) : null}
        </div>
      </CardBody>
    </Card>
  );
}

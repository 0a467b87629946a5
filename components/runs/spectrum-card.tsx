/**
 * The observable's exact extreme eigenvalues (when the engine computed them) and where
 * the run's values sit between them: every expectation value lies in [λmin, λmax]
 * (Rayleigh quotient bound, textbook fact), so ⟨A⟩ − λmin ≥ 0 is the gap to the ground
 * state level — zero only when the state lies in the ground space. Runs stored with the lowest
 * levels also show the gap λ₁ − λ₀ between distinct levels (degeneracy named) and the
 * state's weight in the whole ground space, ⟨ψ|P₀|ψ⟩ (Tr(P₀ρ) under noise).
 */
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { Value } from "@/components/ui/value";
import { linear } from "@/components/charts/scale";
import type { EstimateResult } from "@/lib/swr/types";
import { SMALL_GROUND_WEIGHT, degeneracyLabel, groundLevels } from "./spectrum-levels";
import { formatFixed, formatPercent } from "@/lib/format";

function Item({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="grid gap-0.5">
      <dt className="text-2xs font-semibold tracking-[0.06em] text-ink-3 uppercase">{label}</dt>
      <dd>{children}</dd>
    </div>
  );
}

function Marker({
  x,
  label,
  className,
  row,
}: {
  x: number;
  label: string;
  className: string;
  row: number;
}) {
  // Keep labels at the ends of the scale inside the drawing.
  const anchor = x > 320 ? "end" : x < 40 ? "start" : "middle";
  return (
    <g>
      <line x1={x} x2={x} y1={18} y2={38} className={className} strokeWidth={2} />
      <text
        x={x}
        y={row ? 54 : 12}
        textAnchor={anchor}
        className={`${className.replace("stroke-", "fill-")} font-sans`}
        fontSize={10.5}
        fontWeight={600}
      >
        {label}
      </text>
    </g>
  );
}

export function SpectrumCard({ result, hasNoise }: { result: EstimateResult; hasNoise: boolean }) {
  const s = result.spectrum;
  if (!s) return null;
  const W = 360;
  const x = linear([s.min, s.max], [16, W - 16]);
  const clampX = (v: number) => Math.min(W - 16, Math.max(16, x(v)));
  const span = s.max - s.min;
  const levels = groundLevels(s);
  const weight = s.groundWeight;
  return (
    <Card>
      <CardHeader
        eyebrow="Spectrum"
        title="Ground state and gap"
        description="Exact eigenvalues of the observable: every ⟨A⟩ lies between λ₀ and λ max."
      />
      <CardBody className="grid gap-4">
        <dl className="grid grid-cols-2 gap-2 text-[13px]">
          <div className="grid gap-0.5">
            <dt className="text-2xs font-semibold tracking-[0.06em] text-ink-3 uppercase">
              λ₀ (ground)
            </dt>
            <dd>
              <Value value={s.min} tone="exact" />
            </dd>
          </div>
          <div className="grid gap-0.5">
            <dt className="text-2xs font-semibold tracking-[0.06em] text-ink-3 uppercase">λ max</dt>
            <dd>
              <Value value={s.max} tone="exact" />
            </dd>
          </div>
          {levels ? (
            <Item label="Gap λ₁ − λ₀">
              {levels.gap !== null ? (
                <Value value={levels.gap} tone="exact" />
              ) : (
                <span className="text-xs text-ink-3">beyond the 4 lowest eigenvalues</span>
              )}
              <span className="block text-xs text-ink-3">{degeneracyLabel(levels)}</span>
            </Item>
          ) : null}
          {weight !== undefined ? (
            <Item label={hasNoise ? "Ground-space weight Tr(P₀ρ)" : "Ground-space weight ⟨ψ|P₀|ψ⟩"}>
              <Value value={weight} tone={hasNoise ? "noisy" : "exact"} />
            </Item>
          ) : null}
          <div className="grid gap-0.5">
            <dt className="text-2xs font-semibold tracking-[0.06em] text-ink-3 uppercase">
              Above ground: {hasNoise ? "ideal" : "exact"} − λ₀
            </dt>
            <dd>
              <Value value={result.ideal.value - s.min} />
            </dd>
          </div>
          {hasNoise ? (
            <div className="grid gap-0.5">
              <dt className="text-2xs font-semibold tracking-[0.06em] text-ink-3 uppercase">
                Above ground: noisy − λ₀
              </dt>
              <dd>
                <Value value={result.exact.value - s.min} tone="noisy" />
              </dd>
            </div>
          ) : result.sampled ? (
            <div className="grid gap-0.5">
              <dt className="text-2xs font-semibold tracking-[0.06em] text-ink-3 uppercase">
                Above ground: sampled − λ₀
              </dt>
              <dd>
                <Value
                  value={result.sampled.mean - s.min}
                  uncertainty={result.sampled.stdErr}
                  tone="sampled"
                />
              </dd>
            </div>
          ) : null}
        </dl>
        {weight !== undefined && weight < SMALL_GROUND_WEIGHT ? (
          <p className="text-xs text-ink-2">
            Caution: only {formatPercent(weight, 1)} of the state lies in the ground space, so it is
            far from a ground state even if its energy looks close.
          </p>
        ) : null}
        {span > 0 ? (
          <svg
            viewBox={`0 0 ${W} 60`}
            className="w-full"
            role="img"
            aria-label={`Spectrum from ${formatFixed(s.min, 6)} to ${formatFixed(s.max, 6)}; the exact value ${formatFixed(result.exact.value, 6)} sits ${formatPercent((result.exact.value - s.min) / span, 1)} of the way up.`}
          >
            <rect x={16} y={24} width={W - 32} height={8} rx={4} className="fill-surface-3" />
            {/* End labels only where no marker label below would collide with them. */}
            {!hasNoise || clampX(result.exact.value) > 60 ? (
              <text x={16} y={54} className="figures fill-ink-3" fontSize={10}>
                λmin
              </text>
            ) : null}
            {!hasNoise || clampX(result.exact.value) < W - 60 ? (
              <text x={W - 16} y={54} textAnchor="end" className="figures fill-ink-3" fontSize={10}>
                λmax
              </text>
            ) : null}
            {hasNoise ? (
              <Marker
                x={clampX(result.exact.value)}
                label="noisy"
                className="stroke-noisy"
                row={1}
              />
            ) : null}
            <Marker
              x={clampX(result.ideal.value)}
              label={hasNoise ? "ideal" : "exact"}
              className="stroke-exact"
              row={0}
            />
          </svg>
        ) : (
          <p className="text-xs text-ink-3">
            The observable is a multiple of the identity: every state gives the same value.
          </p>
        )}
      </CardBody>
    </Card>
  );
}

/**
 * How a matrix observable (≤ 6 qubits) was read: its Pauli decomposition
 * A = Σ c_P·P, c_P = Tr(P·A)/2ⁿ, largest |c_P| first. Words read qubit 0 first, so a
 * user who meant the other qubit order sees it at once (kron(Z, I) shows as Z0).
 */
import type { EstimateResult } from "@/lib/swr/types";
import { formatSignificant, MINUS } from "@/lib/format";

const fmt = (c: number) => `${c < 0 ? MINUS : "+"} ${formatSignificant(Math.abs(c), 6)}`;

export function PauliDecompositionList({
  decomposition,
  limit = 8,
}: {
  decomposition: NonNullable<EstimateResult["pauliDecomposition"]>;
  limit?: number;
}) {
  const shown = decomposition.terms.slice(0, limit);
  const more = decomposition.terms.length - shown.length + decomposition.omitted;
  return (
    <section className="grid gap-1.5" aria-label="How the matrix was read">
      <h3 className="text-2xs font-semibold tracking-[0.06em] text-ink-3 uppercase">
        Read as Pauli sum · qubit 0 = leftmost factor
      </h3>
      {shown.length ? (
        <p className="font-mono text-[12.5px] leading-5 break-words text-ink">
          {shown.map((t, i) => (
            <span key={t.pauli}>
              {i === 0 ? formatSignificant(t.coefficient, 6) : fmt(t.coefficient)} {t.label}{" "}
            </span>
          ))}
          {more > 0 ? (
            <span className="font-sans text-ink-3">… and {more} smaller terms</span>
          ) : null}
        </p>
      ) : (
        <p className="text-xs text-ink-3">The matrix is zero.</p>
      )}
    </section>
  );
}

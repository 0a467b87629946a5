/** Dependency-free (client-safe) rendering of a JSON term list as Pauli-sum text. */

/**
 * The same observable as Pauli-sum text ("0.5 X0 Z3 - 1.25 XIZY": each coefficient
 * in shortest round-trip form, so the text means exactly the same numbers).
 */
export function pauliTermsToText(terms: readonly { coefficient: number; pauli: string }[]): string {
  return terms
    .map((t, i) => {
      const c = String(t.coefficient).replace(/^-/, "");
      const sign = t.coefficient < 0 || Object.is(t.coefficient, -0) ? "- " : i === 0 ? "" : "+ ";
      return `${sign}${c} ${t.pauli.trim()}`;
    })
    .join(" ");
}

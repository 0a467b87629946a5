/**
 * Helpers of the workspace browser test.
 *
 * closedFormEnergy: the demo "Two-level ansatz (θ)" prepares, qubit 0 first,
 *   x q0 → |10⟩; ry(θ) q1 → cos(θ/2)|10⟩ + sin(θ/2)|11⟩; cx q1,q0 → cos(θ/2)|10⟩ + sin(θ/2)|01⟩.
 * For α|10⟩ + β|01⟩ (α = cos θ/2, β = sin θ/2): ⟨Z0⟩ = β² − α² = −cos θ, ⟨Z1⟩ = cos θ,
 * ⟨Z0Z1⟩ = −1, and X0X1 + Y0Y1 = 2(|01⟩⟨10| + |10⟩⟨01|) gives 4αβ = 2 sin θ (textbook
 * algebra of Pauli matrices, common practice). With the demo "Reduced two-level model"
 *   c0 + a Z0 − a Z1 + b Z0Z1 + g (X0X1 + Y0Y1),  c0 = −0.8127, a = 0.1731, b = 0.0128, g = 0.1804,
 * E(θ) = c0 − b − 2a cos θ + 2g sin θ.
 */
export function closedFormEnergy(theta: number): number {
  const c0 = -0.8127;
  const a = 0.1731;
  const b = 0.0128;
  const g = 0.1804;
  return c0 - b - 2 * a * Math.cos(theta) + 2 * g * Math.sin(theta);
}

/** Minimal RFC 4180 reader (quoted fields, doubled quotes, CRLF) for checking downloads. */
export function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let field = "";
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') {
        field += '"';
        i++;
      } else if (c === '"') quoted = false;
      else field += c;
    } else if (c === '"') quoted = true;
    else if (c === ",") {
      row.push(field);
      field = "";
    } else if (c === "\r" && text[i + 1] === "\n") {
      row.push(field);
      rows.push(row);
      row = [];
      field = "";
      i++;
    } else field += c;
  }
  if (field || row.length) rows.push([...row, field]);
  return rows;
}

/**
 * A quick, display-only reading of Pauli-sum text (grammar in DEVELOPERS.md): which qubits the terms
 * act on non-trivially. Sparse factors (X0, Y3, Z12) name their qubit; a dense word
 * (XIZY) acts on the positions of its non-I letters, qubit 0 first. The engine's parser
 * remains the judge of validity; this only labels the editor ("acts on qubits 0–3").
 */
export function pauliSupport(text: string): number[] {
  const qubits = new Set<number>();
  const clean = text.replace(/(#|\/\/)[^\n]*/g, " ");
  for (const m of clean.matchAll(/(?<![A-Za-z0-9_.])([XYZI])(\d+)/g)) {
    if (m[1] !== "I") qubits.add(Number(m[2]));
  }
  for (const m of clean.matchAll(/(?<![A-Za-z0-9_.])([IXYZ]{2,})(?![A-Za-z0-9_])/g)) {
    [...m[1]].forEach((c, i) => {
      if (c !== "I") qubits.add(i);
    });
  }
  return [...qubits].sort((a, b) => a - b);
}

/** "0, 1, 4–7" from sorted qubit indices. */
export function formatQubitSet(qubits: readonly number[]): string {
  const parts: string[] = [];
  for (let i = 0; i < qubits.length; i++) {
    let j = i;
    while (j + 1 < qubits.length && qubits[j + 1] === qubits[j] + 1) j++;
    parts.push(
      j - i >= 2
        ? `${qubits[i]}–${qubits[j]}`
        : j > i
          ? `${qubits[i]}, ${qubits[j]}`
          : `${qubits[i]}`,
    );
    i = j;
  }
  return parts.join(", ");
}

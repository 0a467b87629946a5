/**
 * OpenQASM 2.0 text of a bound program, for running a measurement setting elsewhere.
 *
 * The body is emitted from the compiled form with numeric parameters and only the gates
 * of the OpenQASM 2.0 paper's qelib1.inc (arXiv:1707.03429), so it also serves programs
 * written in OpenQASM 3; user gates are inlined. All qubits are renamed into one register
 * `q` (qubit i of the program is q[i]); the original measurements are dropped.
 *
 * - measurementCircuitQasm: rotations into each qubit's Pauli basis (X: h; Y: sdg then
 *   h, so that U·P·U† = Z) and `measure` of every non-identity qubit into a fresh `creg m`,
 *   m[j] being the j-th measured qubit in qubit order.
 * - hadamardTestQasm: the Hadamard test (common practice): an ancilla in |+⟩ (then S† for
 *   the imaginary part) controls P, is rotated back with H and measured; with the state
 *   |ψ⟩ of the circuit, ⟨Z_anc⟩ = Re⟨ψ|P|ψ⟩, or Im⟨ψ|P|ψ⟩ with the S†.
 */
import { EngineError } from "../errors";
import { compiledOf, evaluateChecked, readInputs, type ParsedProgram } from "./program";
import type { CompiledProgram } from "./program-ir";

const PAULI = /^[IXYZ]*$/;

function checkWord(p: CompiledProgram, word: unknown, field: string): string {
  if (typeof word !== "string" || word.length !== p.numQubits || !PAULI.test(word)) {
    const message = `${field} must be a string of ${p.numQubits} characters I, X, Y or Z (qubit 0 first)`;
    throw new EngineError("invalid_request", message, [{ path: [field], message }]);
  }
  return word;
}

function header(p: CompiledProgram, title: string[]): string[] {
  const lines = ["OPENQASM 2.0;", 'include "qelib1.inc";', ...title.map((t) => `// ${t}`)];
  const renamed = p.qubitLabels.some((l, i) => l !== `q[${i}]`);
  if (renamed)
    lines.push(`// qubit map: ${p.qubitLabels.map((l, i) => `q[${i}] = ${l}`).join(", ")}`);
  return lines;
}

/** Gates, resets and barriers of the bound program (measurements dropped). */
function body(p: CompiledProgram, params: Record<string, number>, purpose: string): string[] {
  if (p.hasMidCircuitMeasurement) {
    throw new EngineError(
      "unsupported",
      `${purpose} cannot be exported for a circuit with mid-circuit measurements`,
    );
  }
  const inputs = readInputs(p.inputs, params);
  const q = (i: number) => `q[${i}]`;
  const out: string[] = [];
  for (const op of p.ops) {
    if (op.kind === "reset") out.push(`reset ${q(op.qubit)};`);
    else if (op.kind === "barrier") out.push(`barrier ${op.qubits.map(q).join(",")};`);
    else if (op.kind === "gate") {
      const single = op.parts.length === 1 && op.parts[0].gate.name === op.name.toLowerCase();
      if (!single) out.push(`// ${op.name} (line ${op.line})`);
      op.parts.forEach((t, k) => {
        const values = t.params.map((c) => evaluateChecked(c, inputs));
        out.push(...t.gate.emit(values, op.partQubits[k].map(q)));
      });
    }
  }
  return out;
}

/** OpenQASM 2.0 circuit measuring every qubit whose basis is not I in its Pauli basis. */
export function measurementCircuitQasm(
  program: ParsedProgram,
  params: Record<string, number>,
  bases: string,
): string {
  return measurementCircuitsQasm(program, params, [bases])[0];
}

/**
 * One measurement circuit per bases word (as `measurementCircuitQasm`), the bound body emitted
 * once and shared by all of them. `maxChars` bounds the total text: when the circuits together
 * would be longer, nothing is built and a `too_large` EngineError names the sizes.
 */
export function measurementCircuitsQasm(
  program: ParsedProgram,
  params: Record<string, number>,
  basesList: readonly string[],
  maxChars = Number.POSITIVE_INFINITY,
): string[] {
  const p = compiledOf(program);
  basesList.forEach((b) => checkWord(p, b, "bases"));
  const tooLarge = (perSetting: number) => {
    const mb = (chars: number) => (chars / 1e6).toFixed(1);
    const total = perSetting * basesList.length;
    return new EngineError(
      "too_large",
      `the measurement circuits would be at least ${mb(total)} MB of text (${basesList.length} settings × ${mb(perSetting)} MB each), more than the ${mb(maxChars)} MB an export may hold`,
    );
  };
  // every operation emits at least one line of ≥ 8 characters: refuse before emitting anything
  const fixed = 200 + 40 * p.numQubits;
  if ((8 * p.ops.length + fixed) * basesList.length > maxChars)
    throw tooLarge(8 * p.ops.length + fixed);
  const bodyText = body(p, params, "the measurement circuit").join("\n");
  if ((bodyText.length + fixed) * basesList.length > maxChars)
    throw tooLarge(bodyText.length + fixed);
  return basesList.map((bases) => {
    const measured = [...bases].flatMap((b, i) => (b === "I" ? [] : [i]));
    const lines = header(p, [
      `Ketwise measurement circuit for bases ${bases} (qubit 0 first)`,
      measured.length > 0
        ? `m[j] holds the j-th measured qubit: ${measured.map((i, j) => `m[${j}] = q[${i}]`).join(", ")}`
        : "no qubit is measured (all bases I)",
    ]);
    lines.push(`qreg q[${p.numQubits}];`);
    if (measured.length > 0) lines.push(`creg m[${measured.length}];`);
    if (bodyText) lines.push(bodyText);
    if (measured.length > 0) {
      lines.push("barrier q;", "// rotate into the measurement bases (X: h; Y: sdg then h)");
      for (const i of measured) {
        if (bases[i] === "X") lines.push(`h q[${i}];`);
        if (bases[i] === "Y") lines.push(`sdg q[${i}];`, `h q[${i}];`);
      }
      measured.forEach((i, j) => lines.push(`measure q[${i}] -> m[${j}];`));
    }
    return `${lines.join("\n")}\n`;
  });
}

/** OpenQASM 2.0 Hadamard test whose ancilla has ⟨Z⟩ = Re⟨ψ|P|ψ⟩ ("re") or Im⟨ψ|P|ψ⟩ ("im"). */
export function hadamardTestQasm(
  program: ParsedProgram,
  params: Record<string, number>,
  word: string,
  part: "re" | "im",
): string {
  const p = compiledOf(program);
  checkWord(p, word, "word");
  if (part !== "re" && part !== "im") {
    throw new EngineError("invalid_request", `part must be "re" or "im"`, [
      { path: ["part"], message: 'expected "re" or "im"' },
    ]);
  }
  const lines = header(p, [
    `Ketwise Hadamard test for P = ${word} (qubit 0 first)`,
    part === "re"
      ? "<Z> of the ancilla (P(m=0) - P(m=1)) equals Re<psi|P|psi>, psi = the state the circuit prepares"
      : "<Z> of the ancilla (P(m=0) - P(m=1)) equals Im<psi|P|psi> (the sdg turns Re into Im), psi = the state the circuit prepares",
  ]);
  lines.push(`qreg q[${p.numQubits}];`, "qreg anc[1];", "creg m[1];");
  lines.push(...body(p, params, "the Hadamard test"));
  lines.push("barrier q,anc;", "h anc[0];");
  if (part === "im") lines.push("sdg anc[0];");
  [...word].forEach((c, i) => {
    if (c !== "I") lines.push(`c${c.toLowerCase()} anc[0],q[${i}];`);
  });
  lines.push("h anc[0];", "measure anc[0] -> m[0];");
  return `${lines.join("\n")}\n`;
}

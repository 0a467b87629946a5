/**
 * The reference table of the circuit language, generated from the gate tables the
 * compiler uses (gate-library.ts), so the documentation cannot drift from the code:
 * names, parameter and qubit counts and where each gate comes from are read from the
 * tables; only the one-line definitions below are text, and a unit test checks that
 * every library gate has exactly one. Shown on the API reference page and in README.md
 * (between the gate-table markers; `npm run docs:gates` rewrites that part).
 */
import {
  QASM2_BUILTINS,
  QASM3_BUILTINS,
  QELIB1,
  QELIB1_ADDITIONS,
  STDGATES,
  type GateTable,
} from "./gate-library";
import { MAX_GATE_QUBITS } from "./gate-definitions";
import { MAX_LOOP_ITERATIONS } from "./classical";
import { LIMITS } from "./program-ir";

/** Parameter names and the definition of each gate (radians; control qubits first). */
export const GATE_DEFINITIONS: Record<string, { params: string[]; definition: string }> = {
  U: {
    params: ["θ", "φ", "λ"],
    definition:
      "Built-in single-qubit gate: Rz(φ)·Ry(θ)·Rz(λ) in OpenQASM 2.0; [[cos θ/2, −e^{iλ} sin θ/2], [e^{iφ} sin θ/2, e^{i(φ+λ)} cos θ/2]] in OpenQASM 3",
  },
  CX: { params: [], definition: "Built-in controlled-NOT (control first)" },
  gphase: {
    params: ["γ"],
    definition: "Global phase e^{iγ} on no qubit (unobservable alone; a phase gate under ctrl @)",
  },
  u3: { params: ["θ", "φ", "λ"], definition: "Rz(φ)·Ry(θ)·Rz(λ)" },
  u2: { params: ["φ", "λ"], definition: "u3(π/2, φ, λ)" },
  u1: { params: ["λ"], definition: "diag(1, e^{iλ})" },
  u: { params: ["θ", "φ", "λ"], definition: "Alias of the built-in U" },
  p: { params: ["λ"], definition: "Phase gate diag(1, e^{iλ})" },
  phase: { params: ["λ"], definition: "Phase gate diag(1, e^{iλ}) (OpenQASM 2 name)" },
  id: { params: [], definition: "Identity (a gate: the noise model acts after it)" },
  x: { params: [], definition: "Pauli X" },
  y: { params: [], definition: "Pauli Y" },
  z: { params: [], definition: "Pauli Z" },
  h: { params: [], definition: "Hadamard" },
  s: { params: [], definition: "√Z = diag(1, i)" },
  sdg: { params: [], definition: "S† = diag(1, −i)" },
  t: { params: [], definition: "√S = diag(1, e^{iπ/4})" },
  tdg: { params: [], definition: "T† = diag(1, e^{−iπ/4})" },
  sx: { params: [], definition: "√X = ½[[1+i, 1−i], [1−i, 1+i]]" },
  sxdg: { params: [], definition: "(√X)†" },
  rx: { params: ["θ"], definition: "exp(−iθX/2)" },
  ry: { params: ["θ"], definition: "exp(−iθY/2)" },
  rz: { params: ["λ"], definition: "exp(−iλZ/2) = diag(e^{−iλ/2}, e^{iλ/2})" },
  cx: { params: [], definition: "Controlled X" },
  cy: { params: [], definition: "Controlled Y" },
  cz: { params: [], definition: "Controlled Z" },
  ch: { params: [], definition: "Controlled H" },
  cp: { params: ["λ"], definition: "Controlled phase: diag(1, 1, 1, e^{iλ})" },
  cphase: { params: ["λ"], definition: "Controlled phase (OpenQASM 2 name of cp)" },
  cu1: { params: ["λ"], definition: "Controlled u1: diag(1, 1, 1, e^{iλ})" },
  crx: { params: ["θ"], definition: "Controlled rx" },
  cry: { params: ["θ"], definition: "Controlled ry" },
  crz: { params: ["λ"], definition: "Controlled rz" },
  cu3: { params: ["θ", "φ", "λ"], definition: "Controlled u3 (= controlled Rz(φ)Ry(θ)Rz(λ))" },
  cu: {
    params: ["θ", "φ", "λ", "γ"],
    definition: "p(γ) on the control, then controlled U(θ, φ, λ) (OpenQASM 3 U)",
  },
  swap: { params: [], definition: "Exchanges two qubits" },
  rxx: { params: ["θ"], definition: "exp(−iθ X⊗X/2)" },
  rzz: { params: ["θ"], definition: "exp(−iθ Z⊗Z/2)" },
  ccx: { params: [], definition: "Toffoli: X on the third qubit controlled by the first two" },
  cswap: { params: [], definition: "Fredkin: swap of the last two qubits controlled by the first" },
};

export interface GateRow {
  name: string;
  /** e.g. "rx(θ) a", "cx a, b". */
  signature: string;
  qubits: number;
  /** Where the gate comes from in OpenQASM 2.0 / 3 (null = not available in that dialect). */
  qasm2: string | null;
  qasm3: string | null;
  definition: string;
}

const QUBIT_NAMES = "abcdefgh";

function origin(name: string, tables: [GateTable, string][]): string | null {
  return tables.find(([t]) => t.has(name))?.[1] ?? null;
}

/** Every gate of both dialects, built-ins first, then library gates by qubit count and name. */
export function gateReference(): GateRow[] {
  const names = new Set([
    ...QASM2_BUILTINS.keys(),
    ...QASM3_BUILTINS.keys(),
    ...QELIB1.keys(),
    ...QELIB1_ADDITIONS.keys(),
    ...STDGATES.keys(),
  ]);
  const rows = [...names].map((name): GateRow => {
    const gate =
      QASM2_BUILTINS.get(name) ??
      QASM3_BUILTINS.get(name) ??
      QELIB1.get(name) ??
      QELIB1_ADDITIONS.get(name) ??
      STDGATES.get(name)!;
    const def = GATE_DEFINITIONS[name];
    const params = def?.params ?? [];
    const signature = `${name}${params.length > 0 ? `(${params.join(", ")})` : ""}${gate.numQubits > 0 ? ` ${[...QUBIT_NAMES.slice(0, gate.numQubits)].join(", ")}` : ""}`;
    return {
      name,
      signature,
      qubits: gate.numQubits,
      qasm2: origin(name, [
        [QASM2_BUILTINS, "built-in"],
        [QELIB1, "qelib1.inc"],
        [QELIB1_ADDITIONS, "qelib1.inc (later addition)"],
      ]),
      qasm3: origin(name, [
        [QASM3_BUILTINS, "built-in"],
        [STDGATES, "stdgates.inc"],
      ]),
      definition: def?.definition ?? "",
    };
  });
  const builtin = (r: GateRow) => (r.qasm2 === "built-in" || r.qasm3 === "built-in" ? 0 : 1);
  return rows.sort(
    (a, b) => builtin(a) - builtin(b) || a.qubits - b.qubits || a.name.localeCompare(b.name),
  );
}

export interface StatementRow {
  statement: string;
  dialects: string;
  meaning: string;
}

/** Statements and modifiers beyond gate calls. */
export const STATEMENTS: StatementRow[] = [
  {
    statement: "OPENQASM 2.0; / OPENQASM 3.0;",
    dialects: "2, 3",
    meaning: "Version header (required first in OpenQASM 2.0)",
  },
  {
    statement: 'include "qelib1.inc"; / include "stdgates.inc";',
    dialects: "2 / 3",
    meaning: "The standard gate library of the dialect (no other file is read)",
  },
  {
    statement: "qreg q[n]; creg c[n]; / qubit[n] q; bit[n] c;",
    dialects: "2 / 3",
    meaning: `Registers; qubit 0 is the first qubit declared (at most ${LIMITS.maxQubits} qubits)`,
  },
  {
    statement: "input float θ; / input angle θ;",
    dialects: "3",
    meaning: "A run parameter (request `parameters`, `sweep`)",
  },
  {
    statement: "const int n = 4; (int, uint, float, angle)",
    dialects: "3",
    meaning: "A constant known before the run: register sizes, indices, loop bounds, angles",
  },
  {
    statement: "gate name(params) qubits { … } / opaque …;",
    dialects: "2, 3 / 2",
    meaning: "User gates are inlined; opaque gates cannot be simulated",
  },
  {
    statement: "for int i in [a:b] { … } / [a:s:b] / {v1, v2}",
    dialects: "3",
    meaning: `Unrolled when compiled; both range ends included; at most ${MAX_LOOP_ITERATIONS} iterations and ${LIMITS.maxParts} gate applications per program`,
  },
  {
    statement: "ctrl @ / ctrl(n) @ / negctrl @ g …",
    dialects: "3",
    meaning: `Controlled on |1⟩ / |0⟩ of the first operand(s); at most ${MAX_GATE_QUBITS} qubits per gate`,
  },
  { statement: "inv @ g …", dialects: "3", meaning: "The inverse g† (global phase included)" },
  {
    statement: "pow(k) @ g …",
    dialects: "3",
    meaning: "g applied k times for an integer k (g† for k < 0); other exponents are refused",
  },
  {
    statement: "barrier …;",
    dialects: "2, 3",
    meaning: "No effect on the state; not a gate for the noise model",
  },
  {
    statement: "measure q -> c; / c = measure q;",
    dialects: "2 / 3",
    meaning: "Final measurements are ignored; mid-circuit ones need the density-matrix method",
  },
  { statement: "reset q;", dialects: "2, 3", meaning: "Density-matrix method only" },
];

const cell = (s: string | null) => (s ?? "—").replace(/\|/g, "\\|");

/** The Markdown tables for README.md. */
export function gateReferenceMarkdown(): string {
  const gates = gateReference().map(
    (r) =>
      `| \`${cell(r.signature)}\` | ${cell(r.qasm2)} | ${cell(r.qasm3)} | ${cell(r.definition)} |`,
  );
  const statements = STATEMENTS.map(
    (s) => `| \`${cell(s.statement)}\` | ${s.dialects} | ${cell(s.meaning)} |`,
  );
  return [
    "| Gate | OpenQASM 2.0 | OpenQASM 3 | Definition |",
    "| --- | --- | --- | --- |",
    ...gates,
    "",
    "| Statement | Dialect | Meaning |",
    "| --- | --- | --- |",
    ...statements,
  ].join("\n");
}

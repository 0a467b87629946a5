/**
 * How a gate is drawn. Controlled gates of the OpenQASM 2.0 standard library
 * (arXiv:1707.03429, qelib1.inc) and the OpenQASM 3 stdgates.inc put their controls
 * first: `cx c,t`, `ccx c1,c2,t`, `crz(θ) c,t`, `cswap c,a,b`. Controls are dots joined
 * to the target by a vertical line (textbook notation); an X target is ⊕, a swap is
 * two crosses; any other gate is a box with the gate's name as written.
 */
export type GateRole =
  | { kind: "box" }
  | { kind: "controlled"; controls: number; target: "x" | "z" | "swap" | "box"; label: string }
  | { kind: "swap" };

const CONTROLLED: Record<
  string,
  { controls: number; target: "x" | "z" | "swap" | "box"; label: string }
> = {
  cx: { controls: 1, target: "x", label: "x" },
  cnot: { controls: 1, target: "x", label: "x" },
  ccx: { controls: 2, target: "x", label: "x" },
  toffoli: { controls: 2, target: "x", label: "x" },
  c3x: { controls: 3, target: "x", label: "x" },
  c4x: { controls: 4, target: "x", label: "x" },
  cz: { controls: 1, target: "z", label: "z" },
  cy: { controls: 1, target: "box", label: "y" },
  ch: { controls: 1, target: "box", label: "h" },
  csx: { controls: 1, target: "box", label: "sx" },
  crx: { controls: 1, target: "box", label: "rx" },
  cry: { controls: 1, target: "box", label: "ry" },
  crz: { controls: 1, target: "box", label: "rz" },
  cu1: { controls: 1, target: "box", label: "u1" },
  cp: { controls: 1, target: "box", label: "p" },
  cphase: { controls: 1, target: "box", label: "p" },
  cu3: { controls: 1, target: "box", label: "u3" },
  cu: { controls: 1, target: "box", label: "u" },
  cswap: { controls: 1, target: "swap", label: "swap" },
  fredkin: { controls: 1, target: "swap", label: "swap" },
};

export function gateRole(name: string, arity: number): GateRole {
  const key = name === "CX" ? "cx" : name;
  if (key === "swap" && arity === 2) return { kind: "swap" };
  const c = CONTROLLED[key];
  const targets = c?.target === "swap" ? 2 : 1;
  if (c && arity === c.controls + targets) return { kind: "controlled", ...c };
  return { kind: "box" };
}

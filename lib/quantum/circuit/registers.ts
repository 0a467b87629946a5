/**
 * Quantum and classical registers and the resolution of operands (`q`, `q[3]`) to
 * flat indices. Qubits are numbered in declaration order: the first register's qubits
 * first (so `qreg a[2]; qreg b[1];` gives a[0]=0, a[1]=1, b[0]=2); the same for bits.
 */
import type { Pos } from "./ast";
import { MAX_DENSITY_MATRIX_QUBITS, MAX_STATEVECTOR_QUBITS } from "../estimate/limits";

/** An operand with its index evaluated: `q` (index null) or `q[3]`. */
export interface RegisterRef {
  name: string;
  index: number | null;
  pos: Pos;
}
import { circuitError, plural, semanticError } from "./circuit-errors";
import { LIMITS } from "./program-ir";

export interface Register {
  name: string;
  quantum: boolean;
  /** First flat index. */
  offset: number;
  size: number;
  /** Declared without a size (`qubit q;`, `bit c;`): one element, no indexing. */
  scalar: boolean;
}

/** A resolved operand: its flat indices and whether it stands for a whole register. */
export interface Resolved {
  indices: number[];
  isRegister: boolean;
  registerName: string;
  pos: Pos;
}

export class RegisterTable {
  private readonly regs = new Map<string, Register>();
  numQubits = 0;
  numClbits = 0;
  readonly qubitLabels: string[] = [];

  has(name: string): boolean {
    return this.regs.has(name);
  }

  /** e.g. qreg q[1000000000000000000000000000000]: far too many, not "fewer than one". */
  private tooMany(name: string, quantum: boolean, size: number, pos: Pos): never {
    const limit = quantum ? LIMITS.maxQubits : LIMITS.maxClbits;
    const ceiling = quantum
      ? ` (simulation handles at most ${MAX_STATEVECTOR_QUBITS} qubits with the statevector method, ${MAX_DENSITY_MATRIX_QUBITS} with the density matrix)`
      : "";
    const message = `register '${name}' declares ${plural(size, quantum ? "qubit" : "classical bit")}: too many; a circuit may declare at most ${limit}${ceiling}`;
    throw circuitError("too_large", message, pos);
  }

  declare(
    name: string,
    quantum: boolean,
    size: number | null,
    pos: Pos,
    sizePos: Pos | null,
  ): void {
    if (size !== null && size > (quantum ? LIMITS.maxQubits : LIMITS.maxClbits)) {
      this.tooMany(name, quantum, size, sizePos ?? pos);
    }
    if (this.regs.has(name)) {
      throw semanticError(`register '${name}' is already declared`, pos);
    }
    const n = size ?? 1;
    if (!(n >= 1)) {
      throw semanticError(
        `register '${name}' must have at least 1 ${quantum ? "qubit" : "bit"}`,
        sizePos ?? pos,
      );
    }
    const limit = quantum ? LIMITS.maxQubits : LIMITS.maxClbits;
    const what = quantum ? "qubits" : "classical bits";
    if (!Number.isSafeInteger(n)) this.tooMany(name, quantum, n, sizePos ?? pos);
    const total = (quantum ? this.numQubits : this.numClbits) + n;
    if (total > limit) {
      throw circuitError(
        "too_large",
        `the circuit declares ${total} ${what}; at most ${limit} are accepted`,
        pos,
      );
    }
    const offset = quantum ? this.numQubits : this.numClbits;
    this.regs.set(name, { name, quantum, offset, size: n, scalar: size === null });
    if (quantum) {
      this.numQubits += n;
      for (let i = 0; i < n; i++) this.qubitLabels.push(size === null ? name : `${name}[${i}]`);
    } else {
      this.numClbits += n;
    }
  }

  /** Label of a flat qubit index, e.g. "q[2]". */
  qubitLabel(index: number): string {
    return this.qubitLabels[index];
  }

  resolveQubits(op: RegisterRef): Resolved {
    return this.resolve(op, true);
  }

  resolveBits(op: RegisterRef): Resolved {
    return this.resolve(op, false);
  }

  private resolve(op: RegisterRef, quantum: boolean): Resolved {
    const reg = this.regs.get(op.name);
    if (reg === undefined) {
      throw semanticError(
        `undefined ${quantum ? "quantum" : "classical"} register '${op.name}'`,
        op.pos,
      );
    }
    if (reg.quantum !== quantum) {
      throw semanticError(
        quantum
          ? `'${op.name}' is a classical register; a qubit or quantum register is expected here`
          : `'${op.name}' is a quantum register; a classical bit or register is expected here`,
        op.pos,
      );
    }
    if (op.index === null) {
      const indices = Array.from({ length: reg.size }, (_, i) => reg.offset + i);
      return { indices, isRegister: !reg.scalar, registerName: reg.name, pos: op.pos };
    }
    const kind = quantum ? "qubit" : "bit";
    if (reg.scalar) {
      throw semanticError(
        `'${op.name}' is a single ${kind}, not a register: write '${op.name}' without an index`,
        op.pos,
      );
    }
    if (op.index < 0 || op.index >= reg.size) {
      throw semanticError(
        `${kind} ${op.name}[${op.index}] out of range: register ${op.name} has ${plural(reg.size, kind)}`,
        op.pos,
      );
    }
    return {
      indices: [reg.offset + op.index],
      isRegister: false,
      registerName: reg.name,
      pos: op.pos,
    };
  }
}

/**
 * Broadcasting (OpenQASM 2.0 §3): registers in one statement must have equal sizes; a
 * single qubit is repeated. Returns the index tuples, one per instance.
 */
export function broadcast(args: Resolved[], what: string, unit: string): number[][] {
  let size = -1;
  let first: Resolved | null = null;
  for (const a of args) {
    if (!a.isRegister) continue;
    if (first === null) {
      first = a;
      size = a.indices.length;
    } else if (a.indices.length !== size) {
      throw semanticError(
        `registers in one ${what} must have the same size: ${first.registerName} has ${plural(size, unit)}, ${a.registerName} has ${plural(a.indices.length, unit)}`,
        a.pos,
      );
    }
  }
  const n = first === null ? 1 : size;
  const out: number[][] = [];
  for (let i = 0; i < n; i++)
    out.push(args.map((a) => (a.isRegister ? a.indices[i] : a.indices[0])));
  return out;
}

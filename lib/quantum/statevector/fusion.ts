/**
 * Gate fusion: merges gates into blocks acting on at most `maxQubits` (default 2) qubits,
 * so one memory pass applies several gates.
 *
 * Rule (exact, order-preserving): blocks keep the position where they were opened. A gate g
 * on qubits Q joins the most recently opened block B among the blocks that last touched a
 * qubit of Q, provided |B.qubits ∪ Q| ≤ maxQubits. No block opened after B touches any qubit
 * of Q (B is the latest of those), so g commutes with everything between B and g and can be
 * moved next to B: B ← U_g · B. Otherwise g opens a new block. Gates on more than maxQubits
 * qubits become blocks of their own and absorb nothing. Non-unitary operations (measure,
 * reset) are not fused across: callers flush the fuser before them.
 */
import type { GateApplication } from "../types";
import { embedMatrix, multiplyMatrices } from "./matrix-ops";

interface Block {
  qubits: number[];
  matrix: Float64Array;
  names: string[];
  fusable: boolean;
}

export class GateFuser {
  private readonly blocks: Block[] = [];
  /** Index into `blocks` of the block that last touched each qubit (−1: none). */
  private readonly latest = new Map<number, number>();

  constructor(private readonly maxQubits = 2) {}

  add(gate: GateApplication): void {
    let target = -1;
    for (const q of gate.qubits) target = Math.max(target, this.latest.get(q) ?? -1);
    const small = gate.qubits.length <= this.maxQubits;
    if (small && target >= 0 && this.blocks[target].fusable) {
      const block = this.blocks[target];
      const union = [...block.qubits];
      for (const q of gate.qubits) if (!union.includes(q)) union.push(q);
      if (union.length <= this.maxQubits) {
        const d = 1 << union.length;
        const prev = union.length === block.qubits.length ? block.matrix : embedMatrix(block.matrix, block.qubits, union);
        const g = embedMatrix(gate.matrix, gate.qubits, union);
        block.matrix = multiplyMatrices(g, prev, d);
        block.qubits = union;
        block.names.push(gate.name);
        for (const q of gate.qubits) this.latest.set(q, target);
        return;
      }
    }
    this.blocks.push({ qubits: [...gate.qubits], matrix: gate.matrix, names: [gate.name], fusable: small });
    for (const q of gate.qubits) this.latest.set(q, this.blocks.length - 1);
  }

  /** The fused applications, in an order equivalent to the input order. */
  result(): GateApplication[] {
    return this.blocks.map((b) => ({
      name: b.names.length === 1 ? b.names[0] : "fused",
      qubits: b.qubits,
      matrix: b.matrix,
    }));
  }
}

/** Fuses a gate list (see the module comment for the rule). */
export function fuseGates(gates: readonly GateApplication[], maxQubits = 2): GateApplication[] {
  const fuser = new GateFuser(maxQubits);
  for (const g of gates) fuser.add(g);
  return fuser.result();
}

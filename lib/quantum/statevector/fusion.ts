/**
 * Gate fusion: merges gates into blocks of at most two qubits so one memory pass applies
 * several gates, choosing merges with a cost model of the kernels (kernel-cost.ts).
 *
 * Rules (each keeps the product equal to the original sequence):
 * - 1-qubit gates are held "pending" per qubit and multiplied together (P_q ← U_g · P_q).
 *   Holding them is exact: nothing emitted later touches that qubit until the pending
 *   product itself is emitted.
 * - A 2-qubit gate G on (a, b) either absorbs the pending P_a and/or P_b
 *   (G · (P_a ⊗ P_b)), or lets them be emitted first as 1-qubit blocks; or, when the
 *   latest block on both a and b is one block B on exactly {a, b}, it joins B
 *   (B ← G·(P_a ⊗ P_b)·B: nothing after B touches a or b, so the product commutes to B).
 *   The option with the lowest total cost wins (ties: fewer passes). E.g. a cx absorbs the
 *   1-qubit gates on its target and becomes a "two-block" gate as cheap as one 1q pass.
 * - Gates on ≥ 3 qubits are emitted as they are (after the pending gates on their qubits).
 * - At the end, a pending product joins the latest 2-qubit block on its qubit when that is
 *   cheaper, otherwise it is emitted as a 1-qubit block.
 */
import type { GateApplication } from "../types";
import { gateCost } from "./kernel-cost";
import { embedMatrix, multiplyMatrices } from "./matrix-ops";

interface Block {
  qubits: number[];
  matrix: Float64Array;
  names: string[];
  /** Indices (in `add` order) of the gates multiplied into the block, first applied first. */
  sources: number[];
  fusable: boolean;
}

interface Pending {
  matrix: Float64Array;
  names: string[];
  sources: number[];
}

/** A fused application and the input gates it is the product of (see GateFuser.sources). */
export interface FusedBlock {
  gate: GateApplication;
  /** Indices of the input gates in an order whose product (first applied first) is the block. */
  sources: number[];
}

/** Small per-pass overhead (loop set-up, a sweep of the state): prefers fewer passes on ties. */
const PASS_PENALTY = 0.05;

export class GateFuser {
  private readonly blocks: Block[] = [];
  private readonly latest = new Map<number, number>();
  private readonly pending = new Map<number, Pending>();
  private count = 0;

  add(gate: GateApplication): void {
    const k = gate.qubits.length;
    const index = this.count++;
    if (k === 1) {
      const q = gate.qubits[0];
      const p = this.pending.get(q);
      if (p)
        this.pending.set(q, {
          matrix: multiplyMatrices(gate.matrix, p.matrix, 2),
          names: [...p.names, gate.name],
          sources: [...p.sources, index],
        });
      else this.pending.set(q, { matrix: gate.matrix, names: [gate.name], sources: [index] });
      return;
    }
    if (k > 2) {
      for (const q of gate.qubits) this.emitPending(q);
      this.push({
        qubits: [...gate.qubits],
        matrix: gate.matrix,
        names: [gate.name],
        sources: [index],
        fusable: false,
      });
      return;
    }
    this.addTwoQubit(gate, index);
  }

  private addTwoQubit(gate: GateApplication, index: number): void {
    const [a, b] = gate.qubits;
    const pa = this.pending.get(a);
    const pb = this.pending.get(b);
    const withPending = (useA: boolean, useB: boolean): Float64Array => {
      let m = gate.matrix;
      if (useA && pa) m = multiplyMatrices(m, embedMatrix(pa.matrix, [a], gate.qubits), 4);
      if (useB && pb) m = multiplyMatrices(m, embedMatrix(pb.matrix, [b], gate.qubits), 4);
      return m;
    };
    type Choice = { cost: number; run: () => void };
    const choices: Choice[] = [];
    for (const useA of pa ? [true, false] : [false]) {
      for (const useB of pb ? [true, false] : [false]) {
        const m = withPending(useA, useB);
        let cost = gateCost(m, 2) + PASS_PENALTY;
        if (pa && !useA) cost += gateCost(pa.matrix, 1) + PASS_PENALTY;
        if (pb && !useB) cost += gateCost(pb.matrix, 1) + PASS_PENALTY;
        choices.push({
          cost,
          run: () => {
            if (!useA) this.emitPending(a);
            if (!useB) this.emitPending(b);
            this.pending.delete(a);
            this.pending.delete(b);
            const names = [
              ...(useA && pa ? pa.names : []),
              ...(useB && pb ? pb.names : []),
              gate.name,
            ];
            const sources = [
              ...(useA && pa ? pa.sources : []),
              ...(useB && pb ? pb.sources : []),
              index,
            ];
            this.push({ qubits: [a, b], matrix: m, names, sources, fusable: true });
          },
        });
      }
    }
    const target = this.latest.get(a);
    const block = target === undefined ? undefined : this.blocks[target];
    if (block && target === this.latest.get(b) && block.fusable && block.qubits.length === 2) {
      const g = embedMatrix(withPending(true, true), gate.qubits, block.qubits);
      const merged = multiplyMatrices(g, block.matrix, 4);
      choices.push({
        cost: gateCost(merged, 2) - gateCost(block.matrix, 2),
        run: () => {
          this.pending.delete(a);
          this.pending.delete(b);
          block.matrix = merged;
          block.names.push(...(pa ? pa.names : []), ...(pb ? pb.names : []), gate.name);
          block.sources.push(...(pa ? pa.sources : []), ...(pb ? pb.sources : []), index);
        },
      });
    }
    let best = choices[0];
    for (const c of choices) if (c.cost < best.cost - 1e-9) best = c;
    best.run();
  }

  private push(block: Block): void {
    this.blocks.push(block);
    for (const q of block.qubits) this.latest.set(q, this.blocks.length - 1);
  }

  /** Emits qubit q's pending product as a 1-qubit block (if any). */
  private emitPending(q: number): void {
    const p = this.pending.get(q);
    if (!p) return;
    this.pending.delete(q);
    this.push({ qubits: [q], matrix: p.matrix, names: p.names, sources: p.sources, fusable: true });
  }

  /** Places every pending product: into the latest 2-qubit block on its qubit when cheaper. */
  private flushPending(): void {
    for (const [q, p] of [...this.pending.entries()].sort((x, y) => x[0] - y[0])) {
      const target = this.latest.get(q);
      const block = target === undefined ? undefined : this.blocks[target];
      if (block && block.fusable && block.qubits.length === 2) {
        const merged = multiplyMatrices(embedMatrix(p.matrix, [q], block.qubits), block.matrix, 4);
        if (
          gateCost(merged, 2) <
          gateCost(block.matrix, 2) + gateCost(p.matrix, 1) + PASS_PENALTY - 1e-9
        ) {
          block.matrix = merged;
          block.names.push(...p.names);
          block.sources.push(...p.sources);
          this.pending.delete(q);
          continue;
        }
      }
      this.emitPending(q);
    }
  }

  /** The fused applications, in an order equivalent to the input order. */
  result(): GateApplication[] {
    return this.blocksWithSources().map((b) => b.gate);
  }

  /** As result(), each block with the input gates it multiplies (adjoint gradients use them). */
  blocksWithSources(): FusedBlock[] {
    this.flushPending();
    return this.blocks.map((b) => ({
      gate: {
        name: b.names.length === 1 ? b.names[0] : "fused",
        qubits: b.qubits,
        matrix: b.matrix,
      },
      sources: b.sources,
    }));
  }
}

/** Fuses a gate list (see the module comment for the rules). */
export function fuseGates(gates: readonly GateApplication[]): GateApplication[] {
  const fuser = new GateFuser();
  for (const g of gates) fuser.add(g);
  return fuser.result();
}

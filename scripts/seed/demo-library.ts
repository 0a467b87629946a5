/**
 * The demo organisation's saved library: an invented scenario of Halcyon Materials Lab
 * (a Bell-type correlator, Ketwise's invented three-spin cluster with its ansatz, a small
 * transverse-field lattice with its ansatz), so the new-run page's library is never empty.
 * Idempotent: items whose name already exists are left alone. Every item is checked by
 * the engine on the way in (library validate), like an item saved through the API.
 */
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { circuits, observables, users } from "@/db/schema";
import { CLUSTER_ANSATZ, CLUSTER_TERMS } from "@/lib/examples/three-spin-cluster";
import { createCircuit, createObservable } from "@/lib/library/mutations";
import { circuitCreateSchema, observableCreateSchema } from "@/lib/library/schemas";
import { circuitQubits, observableQubits } from "@/lib/library/validate";
import { DEMO_USERS } from "./demo-data";

export const DEMO_CIRCUITS = [
  {
    name: "Bell pair",
    description:
      "Two qubits in (|00⟩ + |11⟩)/√2. Pair it with the correlator to check qubit order and sampling.",
    tags: ["starter", "bell"],
    format: "qasm2",
    source: 'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[2];\nh q[0];\ncx q[0], q[1];\n',
  },
  {
    name: "Three-spin ansatz (θ)",
    description:
      "One-parameter ansatz for the three-spin cluster: cos(θ/2)|000⟩ + sin(θ/2)|111⟩, qubit 0 first.",
    tags: ["ansatz", "cluster"],
    format: "qasm3",
    source: CLUSTER_ANSATZ,
  },
  {
    name: "Four-site lattice layer (a, b)",
    description:
      "One hardware-style layer for the four-site chain: y rotations, a ladder of cx, z rotations.",
    tags: ["ansatz", "lattice"],
    format: "qasm3",
    source:
      'OPENQASM 3.0;\ninclude "stdgates.inc";\nqubit[4] q;\ninput angle a;\ninput angle b;\n\nry(a) q[0];\nry(a) q[1];\nry(a) q[2];\nry(a) q[3];\ncx q[0], q[1];\ncx q[1], q[2];\ncx q[2], q[3];\nrz(b) q[0];\nrz(b) q[1];\nrz(b) q[2];\nrz(b) q[3];\n',
  },
  {
    name: "Four-qubit cat state",
    description:
      "(|0000⟩ + |1111⟩)/√2 — every ZZ pair correlates, every single Z averages to zero.",
    tags: ["starter"],
    format: "qasm2",
    source:
      'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[4];\nh q[0];\ncx q[0], q[1];\ncx q[1], q[2];\ncx q[2], q[3];\n',
  },
] as const;

export const DEMO_OBSERVABLES = [
  {
    name: "Correlator ZZ + XX",
    description: "Bell-type correlator: +2 on the Bell pair, the largest value it can take.",
    tags: ["starter", "bell"],
    format: "pauli",
    terms: "Z0 Z1 + X0 X1",
  },
  {
    name: "Three-spin cluster (invented)",
    description:
      "A three-spin chain with Ising coupling, two fields and two three-body terms; every coefficient invented for Ketwise. Try it with the three-spin ansatz and a sweep of θ.",
    tags: ["cluster", "invented"],
    format: "pauli",
    terms: CLUSTER_TERMS,
  },
  {
    name: "Transverse-field chain, 4 sites",
    description: "Open chain with coupling J = 1 and field h = 0.7: −J Σ ZᵢZᵢ₊₁ − h Σ Xᵢ.",
    tags: ["lattice"],
    format: "pauli",
    terms: "-Z0 Z1 - Z1 Z2 - Z2 Z3 - 0.7 X0 - 0.7 X1 - 0.7 X2 - 0.7 X3",
  },
  {
    name: "Parity of two qubits (matrix)",
    description:
      "Z⊗Z written as a matrix, to try matrix observables (sampled in their eigenbasis).",
    tags: ["matrix"],
    format: "matrix",
    real: [
      [1, 0, 0, 0],
      [0, -1, 0, 0],
      [0, 0, -1, 0],
      [0, 0, 0, 1],
    ],
  },
] as const;

export async function seedDemoLibrary(orgId: string): Promise<{ created: number }> {
  const [author] = await db
    .select({ id: users.id })
    .from(users)
    .where(eq(users.email, DEMO_USERS[1].email))
    .limit(1);
  const haveCircuits = new Set(
    (await db.select({ name: circuits.name }).from(circuits).where(eq(circuits.orgId, orgId))).map(
      (r) => r.name,
    ),
  );
  const haveObservables = new Set(
    (
      await db
        .select({ name: observables.name })
        .from(observables)
        .where(eq(observables.orgId, orgId))
    ).map((r) => r.name),
  );
  let created = 0;
  for (const item of DEMO_CIRCUITS) {
    if (haveCircuits.has(item.name)) continue;
    const input = circuitCreateSchema.parse(item);
    await createCircuit(orgId, author?.id ?? null, input, circuitQubits(input));
    created++;
  }
  for (const item of DEMO_OBSERVABLES) {
    if (haveObservables.has(item.name)) continue;
    const input = observableCreateSchema.parse(item);
    await createObservable(orgId, author?.id ?? null, input, observableQubits(input));
    created++;
  }
  return { created };
}

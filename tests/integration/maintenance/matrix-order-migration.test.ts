/**
 * The data migration that keeps stored matrix observables' physical meaning when the
 * written order became "qubit 0 is the leftmost Kronecker factor": a legacy matrix
 * (index bit k = qubit k) is re-indexed by n-bit reversal, in saved library observables
 * and in stored run requests; eigenbasis count keys of stored results are re-read most
 * significant digit first. The step is recorded in `data_migrations` and never re-applied.
 * The physical check uses the textbook value ⟨1|Z|1⟩ = −1.
 */
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db";
import { dataMigrations, observables, runs } from "@/db/schema";
import {
  applyDataMigrations,
  applyStepUnrecorded,
  DATA_MIGRATIONS,
  matrixQubitOrder,
} from "@/lib/maintenance/mutations";
import { estimate } from "@/lib/quantum";
import { createUserWithOrg } from "../../support/factories";
import { insertRawRun } from "../runs/support/db-helpers";

let orgId: string;
// Legacy reading (index bit 0 = qubit 0): diag(1, −1, 1, −1) was Z on qubit 0.
const LEGACY_Z0 = [
  [1, 0, 0, 0],
  [0, -1, 0, 0],
  [0, 0, 1, 0],
  [0, 0, 0, -1],
];
const WRITTEN_Z0 = [
  [1, 0, 0, 0],
  [0, 1, 0, 0],
  [0, 0, -1, 0],
  [0, 0, 0, -1],
];
const SOURCE = 'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[2];\nx q[0];\n';

beforeAll(async () => {
  ({ orgId } = await createUserWithOrg("migration"));
});
afterAll(() => closeDb());

describe("matrix observables keep their meaning across the qubit-order change", () => {
  it("re-indexes library matrices, run requests and eigenbasis histograms; re-running gives the same number", async () => {
    const obsId = randomUUID();
    await db.insert(observables).values({
      id: obsId,
      orgId,
      name: `legacy ${obsId}`,
      description: "",
      tags: [],
      format: "matrix",
      matrix: { real: LEGACY_Z0 },
      qubits: 2,
    });
    const request = {
      circuit: { format: "qasm2", source: SOURCE },
      observable: {
        format: "matrix",
        real: LEGACY_Z0,
        imag: [
          [0, 0, 0, 0],
          [0, 0, 0, 0],
          [0, 0, 0, 0],
          [0, 0, 0, 0],
        ],
      },
    };
    const runId = await insertRawRun(orgId, request, {
      status: "succeeded",
      result: {
        exact: { value: -1 },
        groups: [
          {
            bases: "eigenbasis",
            terms: [],
            shots: 5,
            counts: { "10": 5 },
            eigenvalues: [-1, -1, 1, 1],
          },
        ],
      },
    });
    const pauliRunId = await insertRawRun(orgId, {
      circuit: { format: "qasm2", source: SOURCE },
      observable: { format: "pauli", terms: "Z0" },
    });

    expect(await applyStepUnrecorded(matrixQubitOrder, { orgId })).toBe(2);

    const [obs] = await db
      .select()
      .from(observables)
      .where(and(eq(observables.orgId, orgId), eq(observables.id, obsId)));
    expect(obs.matrix).toEqual({ real: WRITTEN_Z0 });
    const [run] = await db
      .select()
      .from(runs)
      .where(and(eq(runs.orgId, orgId), eq(runs.id, runId)));
    const observable = (run.request as { observable: { real: number[][] } }).observable;
    expect(observable.real).toEqual(WRITTEN_Z0);
    expect(
      (run.result as { groups: { counts: Record<string, number> }[] }).groups[0].counts,
    ).toEqual({ "01": 5 });
    // re-running the migrated request gives the stored value (−1: qubit 0 is in |1⟩)
    const again = await estimate(run.request);
    expect(again.exact.value).toBe(-1);
    const [pauli] = await db
      .select()
      .from(runs)
      .where(and(eq(runs.orgId, orgId), eq(runs.id, pauliRunId)));
    expect(pauli.request).toEqual({
      circuit: { format: "qasm2", source: SOURCE },
      observable: { format: "pauli", terms: "Z0" },
    });
  });

  it("is recorded once: the migrator applies nothing the second time", async () => {
    await applyDataMigrations();
    const rows = await db.select().from(dataMigrations);
    for (const step of DATA_MIGRATIONS) expect(rows.map((r) => r.name)).toContain(step.name);
    expect(await applyDataMigrations()).toEqual([]);
  });
});

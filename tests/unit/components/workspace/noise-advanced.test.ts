/**
 * The noise card's per-qubit / per-gate / idle rows ⇄ the request's noise model: a round
 * trip keeps every rate, blank fields stay unset, and bad rows name their form field.
 */
import { describe, expect, it } from "vitest";
import {
  DEFAULT_VALUES,
  fromRequest,
  toRequest,
  type RunBuilderValues,
} from "@/components/workspace/run-builder-model";
import { estimateRequestSchema } from "@/lib/quantum/schemas";

const base = (noise: Partial<RunBuilderValues["noise"]>): RunBuilderValues => ({
  ...DEFAULT_VALUES,
  method: "density_matrix",
  noiseEnabled: true,
  noise: { ...DEFAULT_VALUES.noise, ...noise },
});

describe("per-qubit and per-gate noise in the run builder", () => {
  it("builds readout.qubits, gates and idle, which the request schema accepts, and reads them back", () => {
    const v = base({
      depolarizing1q: "0.01",
      perQubit: [{ qubit: "1", p1Given0: "0.02", p0Given1: "" }],
      gates: [{ name: "cx", depolarizing: "0.05", amplitudeDamping: "", phaseDamping: "0.001" }],
      idle: { depolarizing: "", amplitudeDamping: "0.003", phaseDamping: "" },
    });
    const built = toRequest(v);
    expect(built.issues).toEqual([]);
    expect(built.request.noise).toEqual({
      depolarizing1q: 0.01,
      readout: { qubits: { "1": { p1Given0: 0.02 } } },
      gates: { cx: { depolarizing: 0.05, phaseDamping: 0.001 } },
      idle: { amplitudeDamping: 0.003 },
    });
    expect(estimateRequestSchema.safeParse(built.request).success).toBe(true);
    const back = fromRequest(built.request as never);
    expect(back.noise.perQubit).toEqual(v.noise.perQubit);
    expect(back.noise.gates).toEqual(v.noise.gates);
    expect(back.noise.idle).toEqual(v.noise.idle);
  });

  it("names the row field of a bad entry", () => {
    const built = toRequest(
      base({
        perQubit: [{ qubit: "x", p1Given0: "", p0Given1: "" }],
        gates: [{ name: "", depolarizing: "abc", amplitudeDamping: "", phaseDamping: "" }],
      }),
    );
    const paths = built.issues.map((i) => i.path);
    expect(paths).toEqual(
      expect.arrayContaining([
        "noise.perQubit.0.qubit",
        "noise.gates.0.name",
        "noise.gates.0.depolarizing",
      ]),
    );
  });
});

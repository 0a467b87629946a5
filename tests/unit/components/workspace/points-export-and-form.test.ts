/**
 * The points CSV (run page download and `GET /runs/:id/points.csv`) read back with
 * Python's csv module (an outside RFC 4180 reader), and the run builder's points list and
 * gradient toggle: form → request → form round trip, bad JSON as a field message.
 */
import { describe, expect, it } from "vitest";
import {
  DEFAULT_VALUES,
  formPath,
  fromRequest,
  toRequest,
} from "@/components/workspace/run-builder-model";
import { pointsCsv } from "@/lib/export/run-export";
import { pythonReadCsv } from "../../../support/python-csv";

describe("pointsCsv", () => {
  it("one row per point in request order, gradient columns per input", () => {
    const text = pointsCsv({
      kind: "points",
      parameters: ["theta"],
      points: [
        {
          params: { theta: 0.5, phi: 1 },
          ideal: 0.25,
          exact: 0.2,
          sampled: { mean: 0.21, stdErr: 0.01, ci95: [0.19, 0.23], shots: 100 },
          gradient: {
            theta: { exact: -0.5, sampled: { mean: -0.48, stdErr: 0.03 } },
            phi: { exact: 0.1 },
          },
          gradientShots: 400,
        },
        {
          params: { theta: -1, phi: 1 },
          ideal: 0.5,
          exact: 0.5,
          sampled: null,
          gradient: { theta: { exact: 0 }, phi: { exact: 0 } },
        },
      ],
    });
    const rows = pythonReadCsv(text);
    expect(rows[0]).toEqual([
      "point",
      "theta",
      "ideal",
      "exact",
      "sampled_mean",
      "std_err",
      "shots",
      "ci95_low",
      "ci95_high",
      "d_exact_theta",
      "d_sampled_theta",
      "d_std_err_theta",
      "d_exact_phi",
      "d_sampled_phi",
      "d_std_err_phi",
      "gradient_shots",
    ]);
    expect(rows[1]).toEqual([
      "0",
      "0.5",
      "0.25",
      "0.2",
      "0.21",
      "0.01",
      "100",
      "0.19",
      "0.23",
      "-0.5",
      "-0.48",
      "0.03",
      "0.1",
      "",
      "",
      "400",
    ]);
    expect(rows[2].slice(0, 4)).toEqual(["1", "-1", "0.5", "0.5"]);
    expect(rows).toHaveLength(3);
  });

  it("a grid without gradients has no gradient columns", () => {
    const rows = pythonReadCsv(
      pointsCsv({
        parameters: ["a"],
        points: [{ params: { a: 1 }, ideal: 1, exact: 1, sampled: null }],
      }),
    );
    expect(rows[0]).toEqual([
      "point",
      "a",
      "ideal",
      "exact",
      "sampled_mean",
      "std_err",
      "shots",
      "ci95_low",
      "ci95_high",
    ]);
  });
});

describe("run builder: points and gradient", () => {
  const q3 = {
    format: "qasm3" as const,
    source: 'OPENQASM 3.0;\ninclude "stdgates.inc";\nqubit[1] q;\ninput float t;\nrx(t) q[0];\n',
  };

  it("turns the points text and the toggle into the request, and back", () => {
    const v = {
      ...DEFAULT_VALUES,
      circuit: q3,
      parameters: { t: "0.1" },
      pointsText: '[{"t": 0.2}, {"t": 0.4}]',
      gradient: true,
    };
    const { request, issues } = toRequest(v, ["t"]);
    expect(issues).toEqual([]);
    expect(request.points).toEqual([{ t: 0.2 }, { t: 0.4 }]);
    expect(request.gradient).toBe(true);
    const back = fromRequest(request);
    expect(back.gradient).toBe(true);
    expect(JSON.parse(back.pointsText)).toEqual([{ t: 0.2 }, { t: 0.4 }]);
  });

  it("reports bad points text on its field, and maps request paths to the form fields", () => {
    const { issues } = toRequest(
      { ...DEFAULT_VALUES, circuit: q3, parameters: { t: "0" }, pointsText: "[{t: 1}" },
      ["t"],
    );
    expect(issues[0].path).toBe("pointsText");
    expect(formPath("points.3.t")).toBe("pointsText");
    expect(formPath("points[3].t")).toBe("pointsText");
    expect(formPath("gradient")).toBe("gradient");
  });
});

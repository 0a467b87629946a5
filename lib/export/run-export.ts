/**
 * Run downloads: the whole run as JSON, the per-term table and the per-setting counts
 * as CSV. Structural input types, so the engine's EstimateResult and the
 * API's run resource fit without a conversion.
 *
 * Conventions kept in the files: Pauli words and bitstrings read qubit 0 first
 * (the leftmost character); a setting is named by its bases word (e.g. "XXI"), one letter per qubit.
 */
import { toCsv, type CsvCell } from "./csv";

export type ExportTerm = {
  pauli: string;
  coefficient: number;
  exact: number | null;
  sampledMean?: number | null;
  stdErr?: number | null;
  ci95?: readonly [number, number] | null;
  group?: number | null;
};

export type ExportGroup = {
  bases: string;
  terms?: readonly number[];
  shots: number;
  counts?: Record<string, number> | null;
};

export type ExportResult = { terms: readonly ExportTerm[]; groups: readonly ExportGroup[] };

/** Pretty JSON (two-space indent, trailing newline) of any run resource. */
export function runJson(run: unknown): string {
  return `${JSON.stringify(run, null, 2)}\n`;
}

/**
 * One row per Pauli term: word, coefficient, exact ⟨P⟩, sampled ⟨P⟩, its standard error
 * (posterior sd), setting, then the 95 % interval of ⟨P⟩ (same method as the run's).
 */
export function termsCsv(result: ExportResult): string {
  const rows: CsvCell[][] = [
    [
      "pauli",
      "coefficient",
      "exact",
      "sampled_mean",
      "std_err",
      "setting",
      "setting_bases",
      "ci95_low",
      "ci95_high",
    ],
  ];
  for (const t of result.terms) {
    const g = typeof t.group === "number" ? result.groups[t.group] : undefined;
    rows.push([
      t.pauli,
      t.coefficient,
      t.exact,
      t.sampledMean,
      t.stdErr,
      t.group,
      g?.bases,
      t.ci95?.[0],
      t.ci95?.[1],
    ]);
  }
  return toCsv(rows);
}

/**
 * One row per (setting, bitstring) with its count, bitstrings sorted in reading order
 * (as binary numbers with qubit 0 as the most significant character).
 */
export function countsCsv(result: ExportResult): string {
  const rows: CsvCell[][] = [["setting", "setting_bases", "bitstring", "count", "setting_shots"]];
  result.groups.forEach((g, i) => {
    const entries = Object.entries(g.counts ?? {}).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    for (const [bits, count] of entries) rows.push([i, g.bases, bits, count, g.shots]);
  });
  return toCsv(rows);
}

/** A file-name stem from a run name and id: lower-case letters, digits and dashes only. */
export function fileStem(name: string | null | undefined, id: string): string {
  const slug = (name ?? "")
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 48);
  const shortId = id.replace(/[^A-Za-z0-9]/g, "").slice(0, 8);
  return slug ? `${slug}-${shortId}` : `run-${shortId}`;
}

type ExportGradient = Record<string, { exact: number; sampled?: { mean: number; stdErr: number } }>;

export type ExportSweep = {
  kind?: "grid" | "points";
  parameters: readonly string[];
  points: readonly {
    params: Record<string, number>;
    ideal: number;
    exact: number;
    sampled: {
      mean: number;
      stdErr: number;
      ci95?: readonly [number, number];
      shots: number;
    } | null;
    gradient?: ExportGradient;
    gradientShots?: number;
  }[];
};

/**
 * One row per parameter point, in request order (the file the run page downloads and
 * `GET /api/v1/runs/:id/points.csv` serves). Columns: `point` (0-based index), the inputs
 * the grid or list sets, ideal, exact, sampled_mean, std_err, shots, ci95_low, ci95_high;
 * with gradients, per input x: `d_exact_x`, `d_sampled_x`, `d_std_err_x`, then
 * `gradient_shots`.
 */
export function pointsCsv(sweep: ExportSweep): string {
  const inputs = Object.keys(sweep.points.find((p) => p.gradient)?.gradient ?? {});
  const gradientColumns = inputs.flatMap((n) => [
    `d_exact_${n}`,
    `d_sampled_${n}`,
    `d_std_err_${n}`,
  ]);
  const rows: CsvCell[][] = [
    [
      "point",
      ...sweep.parameters,
      "ideal",
      "exact",
      "sampled_mean",
      "std_err",
      "shots",
      "ci95_low",
      "ci95_high",
      ...(inputs.length ? [...gradientColumns, "gradient_shots"] : []),
    ],
  ];
  sweep.points.forEach((p, i) => {
    rows.push([
      i,
      ...sweep.parameters.map((n) => p.params[n]),
      p.ideal,
      p.exact,
      p.sampled?.mean,
      p.sampled?.stdErr,
      p.sampled?.shots,
      p.sampled?.ci95?.[0],
      p.sampled?.ci95?.[1],
      ...(inputs.length
        ? [
            ...inputs.flatMap((n) => {
              const g = p.gradient?.[n];
              return [g?.exact, g?.sampled?.mean, g?.sampled?.stdErr];
            }),
            p.gradientShots,
          ]
        : []),
    ]);
  });
  return toCsv(rows);
}

/** The points file of a sweep (the same bytes as pointsCsv). */
export const sweepCsv = pointsCsv;

/**
 * Caps on what a preview or a submission may ask the web process to check
 * (parse, group, plan). They keep the heaviest allowed request within a
 * bounded, measured cost (`npm run bench:api`, heavy-preview row); anything
 * above answers 422 naming the cap. Source sizes are checked before any
 * parsing; gate applications, terms and settings on the engine's preview.
 * Gate applications count top-level gates after loops are unrolled and
 * broadcasts expanded (a call of a user `gate` counts once).
 */
import { validationFailed } from "@/lib/api/problem";
import type { PreviewResult } from "@/lib/quantum/schemas";
import { formatCount } from "@/lib/format";

export const PREVIEW_CAPS = {
  /** Characters of OpenQASM source. */
  circuitSourceChars: 200_000,
  /** Characters of Pauli-sum text. */
  observableTextChars: 250_000,
  gateApplications: 100_000,
  terms: 5_000,
  /** Measurement settings (qubit-wise commuting groups). */
  settings: 2_000,
} as const;

const fmt = formatCount;

function capExceeded(path: string, what: string, actual: number, cap: number) {
  return validationFailed(`The request has ${fmt(actual)} ${what}; the limit is ${fmt(cap)}.`, [
    { path, message: `${fmt(actual)} ${what} (at most ${fmt(cap)})` },
  ]);
}

type SizedRequest = {
  circuit?: { source?: unknown };
  observable?: { format?: unknown; terms?: unknown };
};

/** Before parsing: the sizes of the texts to parse. */
export function assertSourceCaps(request: SizedRequest): void {
  const source = request.circuit?.source;
  if (typeof source === "string" && source.length > PREVIEW_CAPS.circuitSourceChars) {
    throw capExceeded(
      "circuit.source",
      "characters of circuit source",
      source.length,
      PREVIEW_CAPS.circuitSourceChars,
    );
  }
  const terms = request.observable?.terms;
  if (
    request.observable?.format === "pauli" &&
    typeof terms === "string" &&
    terms.length > PREVIEW_CAPS.observableTextChars
  ) {
    throw capExceeded(
      "observable.terms",
      "characters of Pauli-sum text",
      terms.length,
      PREVIEW_CAPS.observableTextChars,
    );
  }
}

/** After the engine's preview: gate applications, terms and measurement settings. */
export function assertPreviewCaps(preview: Pick<PreviewResult, "totalGates" | "observable">): void {
  if (preview.totalGates > PREVIEW_CAPS.gateApplications) {
    throw capExceeded(
      "circuit.source",
      "gate applications",
      preview.totalGates,
      PREVIEW_CAPS.gateApplications,
    );
  }
  if (preview.observable.terms > PREVIEW_CAPS.terms) {
    throw capExceeded(
      "observable.terms",
      "Pauli terms",
      preview.observable.terms,
      PREVIEW_CAPS.terms,
    );
  }
  if (preview.observable.settings > PREVIEW_CAPS.settings) {
    throw capExceeded(
      "observable",
      "measurement settings",
      preview.observable.settings,
      PREVIEW_CAPS.settings,
    );
  }
}

/**
 * User-chosen names (runs, library items, noise profiles, API keys,
 * organisations, people): one rule everywhere, client-safe, so forms, server
 * actions and the API refuse the same strings with the same message.
 *
 * Refused: C0/C1 control characters (NUL, tab, CR, LF, ESC …, DEL) and the
 * Unicode bidirectional formatting characters (embeddings, overrides,
 * isolates and the implicit marks, Unicode Standard Annex #9, §2), which can
 * make a name display differently from what it is ("Trojan Source",
 * CVE-2021-42574). Surrounding whitespace is trimmed first.
 */
import { z } from "zod";

// C0 controls, DEL and C1 controls; ALM, LRM, RLM; LRE…RLO; LRI…PDI.
const FORBIDDEN_IN_NAMES =
  /[\u0000-\u001f\u007f-\u009f\u061c\u200e\u200f\u202a-\u202e\u2066-\u2069]/u;

export const NAME_CHARACTERS_MESSAGE =
  "Names cannot contain control characters (such as tabs, line breaks or NUL) or text-direction overrides.";

/** True when `value` has no control or bidi formatting character. */
export function isCleanName(value: string): boolean {
  return !FORBIDDEN_IN_NAMES.test(value);
}

/** A trimmed, non-empty name of at most `max` characters, without control or bidi characters. */
export function nameSchema(options: { max: number; empty: string; tooLong?: string }) {
  return z
    .string({ error: options.empty })
    .trim()
    .min(1, options.empty)
    .max(options.max, options.tooLong ?? `Use at most ${options.max} characters.`)
    .refine(isCleanName, NAME_CHARACTERS_MESSAGE);
}

/** An organisation's name (the `organizations.name` column holds 120 characters). */
export const orgNameSchema = nameSchema({ max: 120, empty: "Name the organisation." });

/**
 * A name made safe for one line of plain text (an e-mail subject): control and
 * bidi characters become spaces, runs of whitespace collapse, and anything
 * beyond `max` characters is cut with an ellipsis.
 */
export function subjectSafeName(value: string | null | undefined, max = 40): string {
  const flat = (value ?? "")
    .replace(new RegExp(FORBIDDEN_IN_NAMES.source, "gu"), " ")
    .replace(/\s+/gu, " ")
    .trim();
  const chars = Array.from(flat);
  return chars.length > max
    ? `${chars
        .slice(0, max - 1)
        .join("")
        .trimEnd()}…`
    : flat;
}

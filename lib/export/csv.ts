/**
 * CSV text per RFC 4180 ("Common Format and MIME Type for CSV Files"): fields separated
 * by commas, records by CRLF; a field containing a comma, a double quote, CR or LF is
 * enclosed in double quotes, and a double quote inside it is written twice.
 *
 * Numbers are written in JavaScript's shortest round-trip form (`String(x)`), so a
 * reader parsing them as IEEE doubles gets the exact same value back; non-finite
 * numbers and null/undefined become empty fields.
 */

export type CsvCell = string | number | boolean | null | undefined;

const NEEDS_QUOTES = /[",\r\n]/;

/** One field, quoted only when RFC 4180 requires it. */
export function csvField(value: CsvCell): string {
  if (value === null || value === undefined) return "";
  if (typeof value === "number") return Number.isFinite(value) ? String(value) : "";
  const text = String(value);
  // A leading =, +, − or @ is left as is: these files hold numbers and Pauli words, and
  // quoting does not stop spreadsheet formula evaluation anyway.
  return NEEDS_QUOTES.test(text) ? `"${text.replaceAll('"', '""')}"` : text;
}

/** Records (first one usually the header) → CSV text ending with CRLF. */
export function toCsv(rows: readonly (readonly CsvCell[])[]): string {
  return rows.map((row) => row.map(csvField).join(",")).join("\r\n") + (rows.length ? "\r\n" : "");
}

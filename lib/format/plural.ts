/**
 * English plurals: a count and the noun that agrees with it. Only exactly 1 takes the
 * singular ("1 run", "0 runs", "1.5 runs", "1,000 runs"); irregular plurals are given
 * explicitly (plural(n, "person", "people")).
 */
import { formatCount, formatNumber } from "./numbers";

/** The noun alone: pluralWord(2, "qubit") → "qubits"; pluralWord(1, "was", "were") → "was". */
export function pluralWord(n: number, singular: string, pluralForm = `${singular}s`): string {
  return n === 1 ? singular : pluralForm;
}

/**
 * The count with its noun: plural(1, "run") → "1 run", plural(1000, "shot") → "1,000 shots",
 * plural(2, "person", "people") → "2 people". Whole counts get thousands separators; a
 * fractional count keeps up to one decimal.
 */
export function plural(n: number, singular: string, pluralForm = `${singular}s`): string {
  const count = Number.isInteger(n) ? formatCount(n) : formatNumber(n, 1);
  return `${count} ${pluralWord(n, singular, pluralForm)}`;
}

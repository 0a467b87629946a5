/**
 * The one place where values become user-visible text: numbers and counts, signs (U+2212),
 * plurals, percentages, money, durations, sizes, dates, and values with uncertainties.
 * Everything here is pure and locale-fixed, so server and browser render the same text.
 */
export * from "./numbers";
export * from "./plural";
export * from "./dates";
export * from "./units";
export * from "./uncertainty";

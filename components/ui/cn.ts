/**
 * Joins class names, skipping falsy entries. There is no conflict merging: when a
 * caller's `className` must override a primitive's default, prefer props (variant,
 * size) or an `!` important utility.
 */
export function cn(...parts: Array<string | false | null | undefined | 0>): string {
  return parts.filter(Boolean).join(" ");
}

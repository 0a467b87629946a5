/**
 * Keyset cursors for newest-first lists ordered by (time DESC, id DESC): the
 * cursor is base64url of `[timeMs, id]` of the last row of the page. Stable
 * under inserts, O(page) with the (org_id, time, id) indexes.
 */
import { badRequest } from "@/lib/api/problem";

export type CursorKey = { time: Date; id: string };

export function encodeCursor(key: CursorKey): string {
  return Buffer.from(JSON.stringify([key.time.getTime(), key.id])).toString("base64url");
}

export function decodeCursor(cursor: string): CursorKey {
  try {
    const value: unknown = JSON.parse(Buffer.from(cursor, "base64url").toString("utf8"));
    if (
      Array.isArray(value) &&
      value.length === 2 &&
      Number.isSafeInteger(value[0]) &&
      typeof value[1] === "string" &&
      value[1].length <= 64
    ) {
      return { time: new Date(value[0] as number), id: value[1] };
    }
  } catch {
    // fall through
  }
  throw badRequest("The cursor is malformed; pass the nextCursor of a previous page unchanged.", [
    { path: "cursor", message: "not a cursor this API issued" },
  ]);
}

/** Splits a `limit + 1` fetch into the page and the next cursor. */
export function paginate<T>(
  rows: T[],
  limit: number,
  key: (row: T) => CursorKey,
): { page: T[]; nextCursor: string | null } {
  if (rows.length <= limit) return { page: rows, nextCursor: null };
  const page = rows.slice(0, limit);
  return { page, nextCursor: encodeCursor(key(page[page.length - 1])) };
}

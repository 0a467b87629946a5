/**
 * List objects as the provider returns them:
 * `{ object: "list", data, has_more, url }`, newest first, cursor
 * pagination with `limit` (1–100, default 10), `starting_after` and
 * `ending_before` (object ids from the previous page).
 */
import { invalidRequest } from "../core/errors";

export interface ListParams {
  limit?: number;
  starting_after?: string;
  ending_before?: string;
}

export interface ListObject<T> {
  object: "list";
  data: T[];
  has_more: boolean;
  url: string;
}

/** `records` must already be filtered and ordered newest first. */
export function paginate<R extends { id?: string }, T>(
  records: R[],
  params: ListParams,
  url: string,
  render: (record: R) => T,
  idOf: (record: R) => string = (r) => r.id ?? "",
): ListObject<T> {
  const limit = params.limit ?? 10;
  let start = 0;
  let end = records.length;
  if (params.starting_after !== undefined && params.ending_before !== undefined) {
    throw invalidRequest(
      "You may only specify one of these parameters: starting_after, ending_before.",
    );
  }
  if (params.starting_after !== undefined) {
    const i = records.findIndex((r) => idOf(r) === params.starting_after);
    if (i < 0)
      throw invalidRequest(
        `No object with id '${params.starting_after}' in this list.`,
        "starting_after",
      );
    start = i + 1;
  }
  if (params.ending_before !== undefined) {
    const i = records.findIndex((r) => idOf(r) === params.ending_before);
    if (i < 0)
      throw invalidRequest(
        `No object with id '${params.ending_before}' in this list.`,
        "ending_before",
      );
    end = i;
    start = Math.max(0, end - limit);
    return {
      object: "list",
      data: records.slice(start, end).map(render),
      has_more: start > 0,
      url,
    };
  }
  const page = records.slice(start, start + limit);
  return { object: "list", data: page.map(render), has_more: start + limit < end, url };
}

/** Values of an id-keyed collection, newest first. */
export function newestFirst<R>(collection: Record<string, R>): R[] {
  return Object.values(collection).reverse();
}

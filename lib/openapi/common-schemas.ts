/**
 * Schemas every API v1 resource shares: the RFC 9457 problem document (defined once
 * in lib/api/problem-schema.ts) and the cursor-paginated list envelope. Plain zod;
 * lib/openapi registers them.
 */
import { z } from "zod";

export {
  problemFieldErrorSchema,
  problemSchema,
  type ProblemDocument,
} from "@/lib/api/problem-schema";

/** Opaque cursor from a previous page's `nextCursor`. */
export const cursorParamSchema = z
  .string()
  .min(1)
  .max(200)
  .describe("Opaque cursor from the previous page's nextCursor");

export const limitParamSchema = z.coerce
  .number()
  .int()
  .min(1)
  .max(100)
  .default(20)
  .describe("Page size, 1–100 (default 20)");

export function pageSchema<T extends z.ZodType>(item: T) {
  return z.object({
    data: z.array(item),
    nextCursor: z
      .string()
      .nullable()
      .describe("Pass as `cursor` for the next page; null on the last page"),
  });
}

export const timestampSchema = z.iso
  .datetime({ offset: true })
  .describe("ISO 8601 timestamp (UTC)");

/** Filters of the audit page, read from the query string (client-safe). */
import { z } from "zod";
import { AUDIT_GROUPS } from "./catalog";

const day = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, "Use a date like 2026-05-01.")
  .optional()
  .or(z.literal("").transform(() => undefined));

export const auditFilterSchema = z.object({
  group: z
    .enum(
      Object.keys(AUDIT_GROUPS) as [keyof typeof AUDIT_GROUPS, ...(keyof typeof AUDIT_GROUPS)[]],
    )
    .optional()
    .or(z.literal("").transform(() => undefined)),
  actor: z
    .uuid()
    .optional()
    .or(z.literal("").transform(() => undefined)),
  from: day,
  to: day,
  /** Keyset cursor: the id of the last event on the previous page. */
  before: z.coerce.number().int().positive().optional(),
});

export type AuditFilter = z.infer<typeof auditFilterSchema>;

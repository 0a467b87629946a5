/**
 * Request shapes of the member operations, shared by the forms and the
 * server actions. Role changes never grant `owner`: ownership moves only by
 * an explicit transfer.
 */
import { z } from "zod";

export const ASSIGNABLE_ROLES = ["viewer", "member", "admin"] as const;
export type AssignableRole = (typeof ASSIGNABLE_ROLES)[number];

const userId = z.uuid({ error: "Choose a member." });

export const changeRoleSchema = z.object({
  userId,
  role: z.enum(ASSIGNABLE_ROLES, {
    error: "Choose viewer, member or admin (ownership is transferred separately).",
  }),
});

export const removeMemberSchema = z.object({ userId });

export const transferOwnershipSchema = z.object({
  userId,
  /** The organisation's name typed again, so a slip of the mouse cannot hand it over. */
  confirm: z.string().trim().min(1, "Type the organisation's name to confirm."),
});

export type ChangeRoleInput = z.infer<typeof changeRoleSchema>;

/** Request shapes of the invitation forms and actions (client-safe). */
import { z } from "zod";
import { emailSchema, passwordSchema, personNameSchema } from "@/lib/auth/schemas";
import { ASSIGNABLE_ROLES } from "@/lib/members/schemas";

export const inviteSchema = z.object({
  email: emailSchema,
  role: z.enum(ASSIGNABLE_ROLES, { error: "Choose viewer, member or admin." }),
});

export const invitationIdSchema = z.object({
  invitationId: z.uuid({ error: "Choose an invitation." }),
});

export const acceptInvitationSchema = z.object({ token: z.string().min(10).max(400) });

export const acceptWithSignUpSchema = acceptInvitationSchema.extend({
  name: personNameSchema,
  password: passwordSchema,
});

export type InviteInput = z.infer<typeof inviteSchema>;

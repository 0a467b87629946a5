/** Invitation operations behind the members page (shape: lib/api/operation.ts). */
import "server-only";
import { defineOperation } from "@/lib/api/operation";
import { ROLE_LABELS } from "@/lib/orgs/roles";
import { createInvitation, resendInvitation, revokeInvitation } from "./mutations";
import { invitationIdSchema, inviteSchema } from "./schemas";

export const inviteOp = defineOperation({
  name: "invitation.create",
  role: "admin",
  schema: inviteSchema,
  run: async (input, access) => {
    await createInvitation(access, input);
    return {
      status: "success",
      message: `Invitation sent to ${input.email} as ${ROLE_LABELS[input.role]}.`,
    };
  },
});

export const resendInvitationOp = defineOperation({
  name: "invitation.resend",
  role: "admin",
  schema: invitationIdSchema,
  run: async (input, access) => {
    const { email } = await resendInvitation(access, input.invitationId);
    return {
      status: "success",
      message: `A new link was sent to ${email}; the previous one no longer works.`,
    };
  },
});

export const revokeInvitationOp = defineOperation({
  name: "invitation.revoke",
  role: "admin",
  schema: invitationIdSchema,
  run: async (input, access) => {
    const { email } = await revokeInvitation(access, input.invitationId);
    return { status: "success", message: `The invitation to ${email} was revoked.` };
  },
});

"use server";

import { inviteOp, resendInvitationOp, revokeInvitationOp } from "@/lib/invitations/operations";
import { operationAction } from "@/lib/api/operation";
import { changeRoleOp, removeMemberOp, transferOwnershipOp } from "@/lib/members/operations";

export const changeRoleAction = operationAction(changeRoleOp, "/app/members");
export const removeMemberAction = operationAction(removeMemberOp, "/app/members");
export const transferOwnershipAction = operationAction(transferOwnershipOp, "/app", "layout");
export const inviteAction = operationAction(inviteOp, "/app/members");
export const resendInvitationAction = operationAction(resendInvitationOp, "/app/members");
export const revokeInvitationAction = operationAction(revokeInvitationOp, "/app/members");

/** The member operations behind the members page (shape: lib/api/operation.ts). */
import "server-only";
import { conflict } from "@/lib/api/problem";
import { ROLE_LABELS } from "@/lib/orgs/roles";
import { changeMemberRole, removeMember, transferOwnership } from "./mutations";
import { defineOperation } from "@/lib/api/operation";
import { changeRoleSchema, removeMemberSchema, transferOwnershipSchema } from "./schemas";
import { plural } from "@/lib/format";

const who = (t: { name: string | null; email: string | null }) =>
  t.name ?? t.email ?? "That member";

export const changeRoleOp = defineOperation({
  name: "member.change-role",
  role: "admin",
  schema: changeRoleSchema,
  run: async (input, access) => {
    const { changed, target } = await changeMemberRole(access, input.userId, input.role);
    return {
      status: "success",
      message: changed
        ? `${who(target)} is now ${ROLE_LABELS[input.role]}.`
        : `${who(target)} already is ${ROLE_LABELS[input.role]}.`,
    };
  },
});

export const removeMemberOp = defineOperation({
  name: "member.remove",
  role: "admin",
  schema: removeMemberSchema,
  run: async (input, access) => {
    const { target, revokedKeys } = await removeMember(access, input.userId);
    const keys = revokedKeys
      ? ` ${plural(revokedKeys, "personal API key was", "personal API keys were")} revoked.`
      : "";
    return {
      status: "success",
      message: `${who(target)} was removed from ${access.org.name}.${keys}`,
    };
  },
});

export const transferOwnershipOp = defineOperation({
  name: "org.transfer-ownership",
  role: "owner",
  schema: transferOwnershipSchema,
  run: async (input, access) => {
    if (input.confirm.trim().toLowerCase() !== access.org.name.trim().toLowerCase()) {
      throw conflict(`Type the organisation's name, "${access.org.name}", to confirm.`, [
        { path: "confirm", message: `Type "${access.org.name}" exactly.` },
      ]);
    }
    const { target } = await transferOwnership(access, input.userId);
    return {
      status: "success",
      message: `${who(target)} now owns ${access.org.name}; you are an admin.`,
    };
  },
});

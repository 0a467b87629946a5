/**
 * Role order and what each role may do (cumulative, each role may do what the ones below may):
 *   viewer reads; member also creates runs/library items and own API keys;
 *   admin also manages members, invitations, org API keys, plan and billing;
 *   owner also transfers ownership and deletes the organisation.
 * Roles are cumulative, so "may do X" is "rank ≥ rank of X's minimum role".
 */
import { ROLES, type Role } from "@/db/schema/orgs";

export { ROLES, type Role };

const RANK: Record<Role, number> = { viewer: 0, member: 1, admin: 2, owner: 3 };

/** True when `role` is `min` or stronger. */
export function roleAtLeast(role: Role, min: Role): boolean {
  return RANK[role] >= RANK[min];
}

export function isRole(value: unknown): value is Role {
  return typeof value === "string" && (ROLES as readonly string[]).includes(value);
}

export const ROLE_LABELS: Record<Role, string> = {
  owner: "Owner",
  admin: "Admin",
  member: "Member",
  viewer: "Viewer",
};

export const ROLE_DESCRIPTIONS: Record<Role, string> = {
  owner: "Everything, including transferring ownership and deleting the organisation.",
  admin: "Manages members, invitations, organisation API keys, plan and billing.",
  member: "Creates runs, saved circuits and observables, and personal API keys.",
  viewer: "Reads runs, results and the library.",
};

"use client";
/**
 * The organisation the workspace pages act in, handed down from the server page (which
 * resolved it from the session and the org cookie). Client hooks read it to build SWR
 * keys `[orgId, path]` and the `X-Ketwise-Org` header.
 */
import { createContext, useContext, type ReactNode } from "react";
import type { Role } from "@/lib/orgs/roles";

export type WorkspaceMember = { id: string; name: string };

export type WorkspaceOrg = {
  orgId: string;
  orgName: string;
  role: Role;
  userId: string;
  /** Members of the organisation (for "submitted by" names and filters). */
  members: WorkspaceMember[];
};

const OrgContext = createContext<WorkspaceOrg | null>(null);

export function WorkspaceOrgProvider({
  value,
  children,
}: {
  value: WorkspaceOrg;
  children: ReactNode;
}) {
  return <OrgContext.Provider value={value}>{children}</OrgContext.Provider>;
}

export function useWorkspaceOrg(): WorkspaceOrg {
  const v = useContext(OrgContext);
  if (!v) throw new Error("useWorkspaceOrg needs a <WorkspaceOrgProvider> above it");
  return v;
}

/** Members and above may create runs and library items; viewers only read. */
export function canWrite(role: Role): boolean {
  return role !== "viewer";
}

/** Display name of a run's submitter. */
export function submitterName(
  members: readonly WorkspaceMember[],
  createdBy: { type: "user" | "api_key"; id: string } | null | undefined,
): string {
  if (!createdBy) return "deleted user";
  if (createdBy.type === "api_key") return "API key";
  return members.find((m) => m.id === createdBy.id)?.name ?? "former member";
}

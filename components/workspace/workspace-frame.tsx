/**
 * Server wrapper of every workspace page: resolves the signed-in user's current
 * organisation and role (the layout has already required both) and hands them to the
 * client hooks through WorkspaceOrgProvider.
 */
import type { ReactNode } from "react";
import { getCurrentOrg } from "@/lib/auth/guards";
import { listMembers } from "@/lib/orgs/queries";
import { WorkspaceOrgProvider } from "@/lib/swr/org-context";

export async function WorkspaceFrame({ children }: { children: ReactNode }) {
  const { current, user } = await getCurrentOrg();
  if (!current) return null;
  const members = (await listMembers(current.org.id)).map((m) => ({
    id: m.userId,
    name: m.name ?? m.email ?? "member",
  }));
  return (
    <WorkspaceOrgProvider
      value={{
        orgId: current.org.id,
        orgName: current.org.name,
        role: current.role,
        userId: user.id,
        members,
      }}
    >
      {children}
    </WorkspaceOrgProvider>
  );
}

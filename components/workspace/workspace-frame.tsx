/**
 * Server wrapper of every workspace page: resolves the signed-in user's current
 * organisation and role (the layout has already required both) and hands them to the
 * client hooks through WorkspaceOrgProvider.
 */
import type { ReactNode } from "react";
import { getCurrentOrg } from "@/lib/auth/guards";
import { WorkspaceOrgProvider } from "@/lib/swr/org-context";

export async function WorkspaceFrame({ children }: { children: ReactNode }) {
  const { current, user } = await getCurrentOrg();
  if (!current) return null;
  return (
    <WorkspaceOrgProvider
      value={{
        orgId: current.org.id,
        orgName: current.org.name,
        role: current.role,
        userId: user.id,
      }}
    >
      {children}
    </WorkspaceOrgProvider>
  );
}

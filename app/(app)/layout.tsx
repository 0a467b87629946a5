import type { ReactNode } from "react";
import { AppShell } from "@/components/shell/app-shell";
import { Alert } from "@/components/ui/alert";
import { getPlan, isPlanId } from "@/lib/billing/plans";
import { getCurrentOrgOrRedirect } from "@/lib/auth/guards";
import { ROLE_LABELS } from "@/lib/orgs/roles";
import { signOutAction, signOutEverywhereAction } from "../(auth)/sign-out/actions";
import { switchOrgAction } from "./actions";

function planName(id: string): string {
  return isPlanId(id) ? getPlan(id).name : id;
}

/** The signed-in frame: every page below it has a user and a current organisation. */
export default async function AppLayout({ children }: { children: ReactNode }) {
  const { user, current, memberships } = await getCurrentOrgOrRedirect("/app");
  const orgs = memberships.map((m) => ({
    id: m.org.id,
    name: m.org.name,
    role: ROLE_LABELS[m.role],
    plan: planName(m.org.plan),
  }));
  return (
    <AppShell
      user={{ name: user.name, email: user.email ?? "" }}
      orgs={orgs}
      currentOrgId={current?.org.id ?? ""}
      switchOrgAction={switchOrgAction}
      signOutAction={signOutAction}
      signOutEverywhereAction={signOutEverywhereAction}
    >
      {current ? (
        children
      ) : (
        <Alert tone="warning" title="No organisation">
          You are not a member of any organisation. Ask an admin for an invitation.
        </Alert>
      )}
    </AppShell>
  );
}

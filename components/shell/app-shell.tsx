"use client";
/**
 * AppShell — the frame of the signed-in area: sidebar navigation, a top bar with the
 * organisation switcher and the user menu, a skip link and the <main> landmark.
 *
 * Mount it once in app/(app)/layout.tsx (a Server Component):
 *
 *   import { AppShell } from "@/components/shell/app-shell";
 *
 *   export default async function AppLayout({ children }: { children: React.ReactNode }) {
 *     const { user, orgs, currentOrgId } = await loadShellData();   // your session/org lookup
 *     return (
 *       <AppShell
 *         user={{ name: user.name, email: user.email }}
 *         orgs={orgs.map((o) => ({ id: o.id, name: o.name, role: o.role, plan: o.planName }))}
 *         currentOrgId={currentOrgId}
 *         switchOrgAction={switchOrgAction}   // "use server"; reads formData.get("orgId")
 *         signOutAction={signOutAction}       // "use server"; e.g. await signOut({ redirectTo: "/" })
 *       >
 *         {children}
 *       </AppShell>
 *     );
 *   }
 *
 * Optional props: `nav` (NavSection[]; default `defaultNavSections` from ./nav-items —
 * filter it by role if some pages are admin-only), `createOrgHref`, `accountHref`,
 * `sidebarFooter` (e.g. a usage Meter), `topbarActions`, `banner` (full-width notice).
 * Inside pages use <PageHeader> from ./page-header for the title row.
 * Breakpoint: the sidebar is fixed from `lg` (1024 px) up; below it opens as a modal drawer.
 */
import Link from "next/link";
import { useEffect, useRef, useState, type ReactNode } from "react";
import { Button } from "@/components/ui/button";
import { IconClose, IconMenu } from "@/components/ui/icons";
import { Logo, LogoMark } from "@/components/ui/logo";
import { defaultNavSections, type NavSection } from "./nav-items";
import { OrgSwitcher, type ShellOrg, type SwitchOrgAction } from "./org-switcher";
import { SidebarNav } from "./sidebar-nav";
import { UserMenu, type ShellUser, type SignOutAction } from "./user-menu";

export type AppShellProps = {
  user: ShellUser;
  orgs: ShellOrg[];
  currentOrgId: string;
  switchOrgAction: SwitchOrgAction;
  signOutAction: SignOutAction;
  signOutEverywhereAction?: SignOutAction;
  nav?: NavSection[];
  createOrgHref?: string;
  accountHref?: string;
  sidebarFooter?: ReactNode;
  topbarActions?: ReactNode;
  banner?: ReactNode;
  children: ReactNode;
};

export type { NavSection, ShellOrg, ShellUser, SignOutAction, SwitchOrgAction };

export function AppShell({
  user,
  orgs,
  currentOrgId,
  switchOrgAction,
  signOutAction,
  signOutEverywhereAction,
  nav = defaultNavSections,
  createOrgHref,
  accountHref,
  sidebarFooter,
  topbarActions,
  banner,
  children,
}: AppShellProps) {
  const [drawerOpen, setDrawerOpen] = useState(false);
  const drawer = useRef<HTMLDialogElement>(null);

  useEffect(() => {
    const d = drawer.current;
    if (!d) return;
    if (drawerOpen && !d.open) d.showModal();
    if (!drawerOpen && d.open) d.close();
  }, [drawerOpen]);

  const sidebar = (onNavigate?: () => void) => (
    <>
      <div className="flex-1 overflow-y-auto px-3 py-4">
        <SidebarNav sections={nav} onNavigate={onNavigate} />
      </div>
      {sidebarFooter ? <div className="border-t border-line p-3">{sidebarFooter}</div> : null}
    </>
  );

  return (
    <div className="min-h-dvh lg:grid lg:grid-cols-[15rem_minmax(0,1fr)]">
      <a
        href="#main"
        className="sr-only z-[60] rounded-md bg-surface px-3 py-2 text-sm font-medium text-ink shadow-pop focus:not-sr-only focus:fixed focus:top-3 focus:left-3 focus:px-3 focus:py-2"
      >
        Skip to content
      </a>

      <aside
        aria-label="Sidebar"
        className="sticky top-0 hidden h-dvh flex-col border-r border-line bg-surface-2/50 lg:flex"
      >
        <div className="flex h-14 shrink-0 items-center px-5">
          <Link href="/app" aria-label="Ketwise dashboard" className="rounded-md">
            <Logo size="sm" />
          </Link>
        </div>
        {sidebar()}
      </aside>

      <dialog
        ref={drawer}
        aria-label="Navigation"
        onClose={() => setDrawerOpen(false)}
        onClick={(e) => {
          if (e.target === e.currentTarget) setDrawerOpen(false);
        }}
        className="m-0 h-dvh max-h-dvh w-72 max-w-[85vw] flex-col border-r border-line bg-surface p-0 text-ink open:flex lg:hidden"
      >
        <div className="flex h-14 shrink-0 items-center justify-between px-4">
          <Link href="/app" onClick={() => setDrawerOpen(false)} aria-label="Ketwise dashboard">
            <Logo size="sm" />
          </Link>
          <Button
            variant="ghost"
            size="icon-sm"
            aria-label="Close navigation"
            onClick={() => setDrawerOpen(false)}
          >
            <IconClose />
          </Button>
        </div>
        {sidebar(() => setDrawerOpen(false))}
      </dialog>

      <div className="flex min-w-0 flex-col">
        <header className="sticky top-0 z-30 flex h-14 shrink-0 items-center gap-1.5 border-b border-line bg-canvas/85 px-3 backdrop-blur-md sm:px-4 lg:px-6">
          <Button
            variant="ghost"
            size="icon"
            className="lg:hidden"
            aria-label="Open navigation"
            aria-expanded={drawerOpen}
            onClick={() => setDrawerOpen(true)}
          >
            <IconMenu />
          </Button>
          <Link href="/app" aria-label="Ketwise dashboard" className="mr-1 rounded-md lg:hidden">
            <LogoMark className="size-6" />
          </Link>
          <span aria-hidden className="mr-0.5 text-lg font-light text-line-strong lg:hidden">
            /
          </span>
          <OrgSwitcher
            orgs={orgs}
            currentOrgId={currentOrgId}
            switchOrgAction={switchOrgAction}
            createOrgHref={createOrgHref}
          />
          <div className="ml-auto flex items-center gap-1.5">
            {topbarActions}
            <UserMenu
              user={user}
              signOutAction={signOutAction}
              signOutEverywhereAction={signOutEverywhereAction}
              accountHref={accountHref}
            />
          </div>
        </header>
        {banner}
        <main
          id="main"
          tabIndex={-1}
          className="w-full flex-1 px-4 py-6 outline-none sm:px-6 lg:px-8 lg:py-8"
        >
          <div className="mx-auto w-full max-w-[88rem]">{children}</div>
        </main>
      </div>
    </div>
  );
}

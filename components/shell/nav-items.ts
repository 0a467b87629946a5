/**
 * Navigation of the signed-in area. Icons are named (not components) so the list can be
 * built in a Server Component and passed to the client shell.
 */
export type NavIconName =
  | "dashboard"
  | "runs"
  | "new-run"
  | "library"
  | "compare"
  | "api-keys"
  | "members"
  | "billing"
  | "audit"
  | "webhooks"
  | "docs";

export type NavItem = {
  href: string;
  label: string;
  icon: NavIconName;
  /** Active only on an exact path match (otherwise a prefix match activates it). */
  exact?: boolean;
  /** Small text at the right end (e.g. a count). */
  badge?: string;
};

export type NavSection = { title?: string; items: NavItem[] };

export const defaultNavSections: NavSection[] = [
  {
    items: [
      { href: "/app", label: "Dashboard", icon: "dashboard", exact: true },
      { href: "/app/runs/new", label: "New run", icon: "new-run", exact: true },
      { href: "/app/runs", label: "Runs", icon: "runs" },
      { href: "/app/library", label: "Library", icon: "library" },
      { href: "/app/compare", label: "Compare", icon: "compare" },
    ],
  },
  {
    title: "Organisation",
    items: [
      { href: "/app/members", label: "Members", icon: "members" },
      { href: "/app/api-keys", label: "API keys", icon: "api-keys" },
      { href: "/app/webhooks", label: "Webhooks", icon: "webhooks" },
      { href: "/app/billing", label: "Billing", icon: "billing" },
      { href: "/app/audit", label: "Audit log", icon: "audit" },
    ],
  },
  {
    title: "Developers",
    items: [{ href: "/app/docs/api", label: "API docs", icon: "docs" }],
  },
];

/**
 * Whether `item` is the current page. "Runs" (prefix /app/runs) must not light up on
 * /app/runs/new, which has its own entry: the longest matching href among all items wins.
 */
export function isActive(item: NavItem, pathname: string, all: NavItem[]): boolean {
  const matches = (i: NavItem) =>
    i.exact ? pathname === i.href : pathname === i.href || pathname.startsWith(`${i.href}/`);
  if (!matches(item)) return false;
  return !all.some((o) => o !== item && o.href.length > item.href.length && matches(o));
}

"use client";

import { cn } from "@/components/ui/cn";
import { IconCheck, IconChevronDown, IconPlus } from "@/components/ui/icons";
import { Menu, MenuItem, MenuLabel, MenuLink, MenuSeparator } from "@/components/ui/menu";

export type ShellOrg = {
  id: string;
  name: string;
  /** The signed-in user's role in it (owner/admin/member/viewer). */
  role?: string;
  /** Plan name shown under the organisation (Sandbox/Lab/Institute). */
  plan?: string;
};

/** Server action receiving FormData with `orgId`; it sets the current organisation. */
export type SwitchOrgAction = (formData: FormData) => void | Promise<void>;

/** A two-letter monogram tile; hue derived from the id so each org keeps its colour. */
export function OrgMonogram({
  org,
  className,
}: {
  org: Pick<ShellOrg, "id" | "name">;
  className?: string;
}) {
  let h = 0;
  for (const ch of org.id) h = (h * 31 + ch.charCodeAt(0)) % 360;
  const letters = org.name
    .split(/\s+/)
    .filter(Boolean)
    .slice(0, 2)
    .map((w) => w[0]!.toUpperCase())
    .join("");
  return (
    <span
      aria-hidden
      style={{ backgroundColor: `oklch(0.62 0.09 ${h})` }}
      className={cn(
        "inline-flex size-6 shrink-0 items-center justify-center rounded-md text-[10.5px] font-semibold text-white",
        className,
      )}
    >
      {letters || "·"}
    </span>
  );
}

/**
 * Organisation switcher (presentational). Choosing an organisation submits a form to
 * `switchOrgAction` with field `orgId`; the current one is marked and not submittable.
 */
export function OrgSwitcher({
  orgs,
  currentOrgId,
  switchOrgAction,
  createOrgHref,
}: {
  orgs: ShellOrg[];
  currentOrgId: string;
  switchOrgAction: SwitchOrgAction;
  createOrgHref?: string;
}) {
  const current = orgs.find((o) => o.id === currentOrgId) ?? orgs[0];
  if (!current) return null;
  return (
    <Menu
      triggerLabel={`Organisation: ${current.name}. Switch organisation`}
      triggerClassName="flex h-9 max-w-72 items-center gap-2 rounded-md px-2 text-left hover:bg-surface-3/60 aria-expanded:bg-surface-3/60"
      trigger={
        <>
          <OrgMonogram org={current} />
          <span className="min-w-0 truncate text-sm font-medium text-ink">{current.name}</span>
          {current.plan ? (
            <span className="hidden rounded border border-line px-1.5 text-2xs font-medium text-ink-2 sm:inline">
              {current.plan}
            </span>
          ) : null}
          <IconChevronDown className="size-3.5 shrink-0 text-ink-3" />
        </>
      }
      panelClassName="w-72"
    >
      <MenuLabel>Organisations</MenuLabel>
      <form action={switchOrgAction}>
        {orgs.map((org) => {
          const isCurrent = org.id === current.id;
          return (
            <MenuItem
              key={org.id}
              role="menuitemradio"
              aria-checked={isCurrent}
              type={isCurrent ? "button" : "submit"}
              name="orgId"
              value={org.id}
            >
              <OrgMonogram org={org} />
              <span className="grid min-w-0 flex-1">
                <span className="truncate">{org.name}</span>
                {org.role || org.plan ? (
                  <span className="truncate text-xs text-ink-3">
                    {[org.role, org.plan].filter(Boolean).join(" · ")}
                  </span>
                ) : null}
              </span>
              {isCurrent ? <IconCheck className="size-4 text-accent" /> : null}
            </MenuItem>
          );
        })}
      </form>
      {createOrgHref ? (
        <>
          <MenuSeparator />
          <MenuLink href={createOrgHref}>
            <IconPlus className="size-4 text-ink-3" />
            New organisation
          </MenuLink>
        </>
      ) : null}
    </Menu>
  );
}

"use client";

import { useSyncExternalStore } from "react";
import { cn } from "@/components/ui/cn";
import { IconSignOut } from "@/components/ui/icons";
import { Menu, MenuItem, MenuLabel, MenuLink, MenuSeparator } from "@/components/ui/menu";
import { applyTheme, readTheme, subscribeTheme, type ThemePreference } from "./theme";

export type ShellUser = { name?: string | null; email: string };

/** Server action that signs the user out (receives an empty FormData). */
export type SignOutAction = (formData: FormData) => void | Promise<void>;

function initials(user: ShellUser): string {
  const source = user.name?.trim() || user.email;
  const parts = source.split(/[\s@._-]+/).filter(Boolean);
  return ((parts[0]?.[0] ?? "?") + (parts[1]?.[0] ?? "")).toUpperCase();
}

const themes: { value: ThemePreference; label: string }[] = [
  { value: "system", label: "System" },
  { value: "light", label: "Light" },
  { value: "dark", label: "Dark" },
];

/** Avatar button → name/e-mail, theme choice, optional account link, sign out. */
export function UserMenu({
  user,
  signOutAction,
  signOutEverywhereAction,
  accountHref,
}: {
  user: ShellUser;
  signOutAction: SignOutAction;
  /** Ends every session of the user (all browsers and devices), then this one. */
  signOutEverywhereAction?: SignOutAction;
  accountHref?: string;
}) {
  const theme = useSyncExternalStore(subscribeTheme, readTheme, () => "system" as ThemePreference);

  return (
    <Menu
      align="end"
      triggerLabel={`Account: ${user.name || user.email}`}
      triggerClassName="flex size-9 items-center justify-center rounded-full hover:bg-surface-3/60 aria-expanded:bg-surface-3/60"
      trigger={
        <span className="inline-flex size-7 items-center justify-center rounded-full border border-line-strong bg-surface-2 text-[11px] font-semibold text-ink-2">
          {initials(user)}
        </span>
      }
      panelClassName="w-64"
    >
      <div className="grid px-2.5 pt-2 pb-2">
        {user.name ? (
          <span className="truncate text-sm font-medium text-ink">{user.name}</span>
        ) : null}
        <span className="truncate text-xs text-ink-2">{user.email}</span>
      </div>
      <MenuSeparator />
      <MenuLabel>Theme</MenuLabel>
      <div className="flex gap-1 px-1.5 pb-1.5">
        {themes.map((t) => (
          <MenuItem
            key={t.value}
            role="menuitemradio"
            aria-checked={theme === t.value}
            onClick={(e) => {
              e.stopPropagation();
              applyTheme(t.value);
            }}
            className={cn(
              "flex-1 justify-center px-1.5 py-1 text-[13px]",
              theme === t.value && "bg-accent-soft! font-medium text-accent-ink!",
            )}
          >
            {t.label}
          </MenuItem>
        ))}
      </div>
      <MenuSeparator />
      {accountHref ? <MenuLink href={accountHref}>Account settings</MenuLink> : null}
      <form action={signOutAction}>
        <MenuItem type="submit">
          <IconSignOut className="size-4 text-ink-3" />
          Sign out
        </MenuItem>
      </form>
      {signOutEverywhereAction ? (
        <form action={signOutEverywhereAction}>
          <MenuItem type="submit" title="Ends your sessions in every browser and device">
            <IconSignOut className="size-4 text-ink-3" />
            Sign out everywhere
          </MenuItem>
        </form>
      ) : null}
    </Menu>
  );
}

"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { cn } from "@/components/ui/cn";
import {
  IconAudit,
  IconBilling,
  IconCompare,
  IconDashboard,
  IconDocs,
  IconExternal,
  IconKey,
  IconLibrary,
  IconMembers,
  IconNewRun,
  IconRuns,
} from "@/components/ui/icons";
import { isActive, type NavIconName, type NavSection } from "./nav-items";

const icons: Record<NavIconName, typeof IconRuns> = {
  dashboard: IconDashboard,
  runs: IconRuns,
  "new-run": IconNewRun,
  library: IconLibrary,
  compare: IconCompare,
  "api-keys": IconKey,
  members: IconMembers,
  billing: IconBilling,
  audit: IconAudit,
  webhooks: IconExternal,
  docs: IconDocs,
};

/** Sidebar links; the current page gets aria-current="page" and the accent rail. */
export function SidebarNav({
  sections,
  onNavigate,
}: {
  sections: NavSection[];
  onNavigate?: () => void;
}) {
  const pathname = usePathname() ?? "";
  const all = sections.flatMap((s) => s.items);
  return (
    <nav aria-label="Main" className="grid gap-5">
      {sections.map((section, si) => (
        <div key={section.title ?? si} className="grid gap-0.5">
          {section.title ? (
            <p className="px-3 pb-1 text-2xs font-semibold tracking-[0.08em] text-ink-3 uppercase">
              {section.title}
            </p>
          ) : null}
          <ul className="grid gap-0.5">
            {section.items.map((item) => {
              const active = isActive(item, pathname, all);
              const Icon = icons[item.icon];
              return (
                <li key={item.href}>
                  <Link
                    href={item.href}
                    onClick={onNavigate}
                    aria-current={active ? "page" : undefined}
                    className={cn(
                      "group relative flex h-8 items-center gap-2.5 rounded-md px-3 text-[13.5px] transition-colors",
                      active
                        ? "bg-surface-3/80 font-medium text-ink"
                        : "text-ink-2 hover:bg-surface-3/50 hover:text-ink",
                    )}
                  >
                    <span
                      aria-hidden
                      className={cn(
                        "absolute top-1.5 bottom-1.5 -left-3 w-0.5 rounded-r bg-accent transition-opacity",
                        active ? "opacity-100" : "opacity-0",
                      )}
                    />
                    <Icon
                      className={cn(
                        "size-4 shrink-0",
                        active ? "text-accent" : "text-ink-3 group-hover:text-ink-2",
                      )}
                    />
                    <span className="truncate">{item.label}</span>
                    {item.badge ? (
                      <span className="figures ml-auto text-2xs text-ink-3">{item.badge}</span>
                    ) : null}
                  </Link>
                </li>
              );
            })}
          </ul>
        </div>
      ))}
    </nav>
  );
}

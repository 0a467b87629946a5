import Link from "next/link";
import { buttonClasses } from "@/components/ui/button";
import { Logo } from "@/components/ui/logo";

const links = [
  { href: "/#values", label: "Product" },
  { href: "/#planning", label: "Shot planning" },
  { href: "/#api", label: "API" },
  { href: "/#pricing", label: "Pricing" },
];

/** Public header: logo, section links (hidden on narrow screens), sign in / sign up. */
export function SiteHeader() {
  return (
    <header className="sticky top-0 z-40 border-b border-line/80 bg-canvas/80 backdrop-blur-md">
      <div className="mx-auto flex h-15 max-w-6xl items-center gap-6 px-5 sm:px-8">
        <Link href="/" aria-label="Ketwise home" className="rounded-md">
          <Logo />
        </Link>
        <nav aria-label="Sections" className="hidden md:block">
          <ul className="flex items-center gap-1">
            {links.map((l) => (
              <li key={l.href}>
                <Link
                  href={l.href}
                  className="rounded-md px-2.5 py-1.5 text-[13.5px] text-ink-2 transition-colors hover:text-ink"
                >
                  {l.label}
                </Link>
              </li>
            ))}
          </ul>
        </nav>
        <div className="ml-auto flex items-center gap-2">
          <Link href="/sign-in" className={buttonClasses({ variant: "ghost", size: "sm" })}>
            Sign in
          </Link>
          <Link href="/sign-up" className={buttonClasses({ variant: "primary", size: "sm" })}>
            Start free
          </Link>
        </div>
      </div>
    </header>
  );
}

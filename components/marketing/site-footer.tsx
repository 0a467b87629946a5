import Link from "next/link";
import { Logo } from "@/components/ui/logo";

const footerColumns = [
  {
    title: "Product",
    links: [
      { href: "/#values", label: "Three numbers" },
      { href: "/#planning", label: "Shot planning" },
      { href: "/#sweeps", label: "Sweeps" },
      { href: "/#pricing", label: "Pricing" },
    ],
  },
  {
    title: "Developers",
    links: [
      { href: "/#api", label: "REST API" },
      { href: "/api/v1/openapi.json", label: "OpenAPI document" },
    ],
  },
  {
    title: "Account",
    links: [
      { href: "/sign-in", label: "Sign in" },
      { href: "/sign-up", label: "Create an account" },
    ],
  },
];

/** Public footer: mark, short links, and the simulation caution in plain words. */
export function SiteFooter() {
  return (
    <footer className="border-t border-line bg-surface-2/40">
      <div className="mx-auto grid max-w-6xl gap-8 px-5 py-10 sm:px-8 md:grid-cols-[1fr_auto]">
        <div className="grid max-w-md gap-3">
          <Logo size="sm" />
          <p className="text-[13px] leading-6 text-ink-2">
            Expectation values of observables on circuit states — exact, sampled and under noise —
            for people who have to decide where hardware time goes.
          </p>
          <p className="text-xs leading-5 text-ink-3">
            Every number Ketwise shows is computed by simulation. It is not a measurement on a
            quantum device, and its noise models are idealised.
          </p>
        </div>
        <nav aria-label="Footer" className="grid grid-cols-3 gap-x-12 text-[13px]">
          {footerColumns.map((col) => (
            <div key={col.title} className="grid content-start gap-2.5">
              <p className="text-2xs font-semibold tracking-[0.08em] text-ink-3 uppercase">
                {col.title}
              </p>
              {col.links.map((l) => (
                <Link key={l.href} href={l.href} className="text-ink-2 hover:text-ink">
                  {l.label}
                </Link>
              ))}
            </div>
          ))}
        </nav>
      </div>
    </footer>
  );
}

import type { Metadata, Viewport } from "next";
import { headers } from "next/headers";
import type { ReactNode } from "react";
import { themeInitScript } from "@/components/shell/theme";
import { fontVariables } from "./fonts/fonts";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Ketwise — expectation values you can trust", template: "%s · Ketwise" },
  description:
    "Compute ⟨ψ|A|ψ⟩ for your circuits: the exact value, what N shots would report with error bars, and what a noisy device would report — side by side.",
  applicationName: "Ketwise",
};

export const viewport: Viewport = {
  themeColor: [
    { media: "(prefers-color-scheme: light)", color: "#f7f9fc" },
    { media: "(prefers-color-scheme: dark)", color: "#0b0f13" },
  ],
};

/** Root layout: fonts, global tokens, the theme choice; route groups add their own chrome. */
export default async function RootLayout({ children }: { children: ReactNode }) {
  // The per-request CSP nonce from proxy.ts (reading it also keeps every page dynamic, as nonces need).
  const nonce = (await headers()).get("x-nonce") ?? undefined;
  return (
    <html lang="en" className={fontVariables} suppressHydrationWarning>
      <head>
        {/* Applies a stored light/dark choice before first paint (see components/shell/theme.ts). */}
        <script nonce={nonce} dangerouslySetInnerHTML={{ __html: themeInitScript }} />
      </head>
      <body className="min-h-dvh">{children}</body>
    </html>
  );
}

import type { Metadata, Viewport } from "next";
import type { ReactNode } from "react";
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

/** Root layout: fonts, global tokens, nothing else (route groups add their own chrome). */
export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en" className={fontVariables} suppressHydrationWarning>
      <body className="min-h-dvh">{children}</body>
    </html>
  );
}

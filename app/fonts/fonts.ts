/**
 * Ketwise type faces, shipped in the repository (no font downloads at build or run time).
 *
 * - Inter (variable weight 100–900) for text; JetBrains Mono (variable 100–800) for
 *   figures, code and identifiers. Both under the SIL Open Font License 1.1 (see the
 *   LICENSE-*.txt files beside them); the woff2 files are the latin and greek subsets
 *   copied from @fontsource-variable/inter and @fontsource-variable/jetbrains-mono.
 * - `next/font/local` cannot attach a unicode-range to one file of a family, so the
 *   greek subset (ψ, φ, θ, λ, γ …) is its own family placed right after the latin one in
 *   the font stacks of app/globals.css: the browser only fetches it when a glyph needs it.
 */
import localFont from "next/font/local";

export const fontSans = localFont({
  src: "./inter-latin-wght-normal.woff2",
  weight: "100 900",
  style: "normal",
  display: "swap",
  variable: "--font-inter",
});

export const fontSansGreek = localFont({
  src: "./inter-greek-wght-normal.woff2",
  weight: "100 900",
  style: "normal",
  display: "swap",
  preload: false,
  adjustFontFallback: false,
  variable: "--font-inter-greek",
});

export const fontMono = localFont({
  src: "./jetbrains-mono-latin-wght-normal.woff2",
  weight: "100 800",
  style: "normal",
  display: "swap",
  variable: "--font-jetbrains-mono",
});

export const fontMonoGreek = localFont({
  src: "./jetbrains-mono-greek-wght-normal.woff2",
  weight: "100 800",
  style: "normal",
  display: "swap",
  preload: false,
  adjustFontFallback: false,
  variable: "--font-jetbrains-mono-greek",
});

/** Class names that define the four CSS variables; put them on <html>. */
export const fontVariables = [fontSans, fontSansGreek, fontMono, fontMonoGreek]
  .map((f) => f.variable)
  .join(" ");

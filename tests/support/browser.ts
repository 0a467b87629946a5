/**
 * Headless Debian Chromium driven by playwright-core, and screenshots into
 * tests/artifacts/ (git-ignored) for a person to look at.
 */
import { mkdirSync } from "node:fs";
import { chromium, type Browser, type Page } from "playwright-core";

export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium";
export const CHROMIUM_FLAGS = [
  "--headless",
  "--no-sandbox",
  "--disable-gpu",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
  "--no-first-run",
];

export function launchBrowser(): Promise<Browser> {
  return chromium.launch({ executablePath: CHROMIUM_PATH, headless: true, args: CHROMIUM_FLAGS });
}

/** Saves a full-page PNG as tests/artifacts/<name>.png. */
export async function screenshot(page: Page, name: string): Promise<void> {
  mkdirSync("tests/artifacts", { recursive: true });
  await page.screenshot({ path: `tests/artifacts/${name}.png`, fullPage: true });
}

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

/** Content-Security-Policy violations any page of any context reported (checked after each e2e file). */
export const cspViolations: string[] = [];

// Libraries probe once whether eval works (zod's fast path) and fall back when the policy says no; the
// policy working as meant is not a failure, so eval probes are left out.
const REPORT_VIOLATIONS = `document.addEventListener("securitypolicyviolation", (e) => {
  if (e.blockedURI === "eval") return;
  console.error("CSP violation: " + e.violatedDirective + " blocked " + (e.blockedURI || "inline") + " at " + e.sourceFile + ":" + e.lineNumber);
});`;

/** Chromium whose every new context records CSP violations into `cspViolations`. */
export async function launchBrowser(): Promise<Browser> {
  const browser = await chromium.launch({
    executablePath: CHROMIUM_PATH,
    headless: true,
    args: CHROMIUM_FLAGS,
  });
  const newContext = browser.newContext.bind(browser);
  browser.newContext = async (...args: Parameters<Browser["newContext"]>) => {
    const context = await newContext(...args);
    await context.addInitScript(REPORT_VIOLATIONS);
    context.on("console", (message) => {
      const text = message.text();
      if (
        message.type() === "error" &&
        /Content Security Policy|CSP violation/.test(text) &&
        !/evaluate a string as JavaScript/.test(text)
      ) {
        cspViolations.push(`${message.page()?.url() ?? "?"}: ${text}`);
      }
    });
    return context;
  };
  return browser;
}

/** Saves a full-page PNG as tests/artifacts/<name>.png. */
export async function screenshot(page: Page, name: string): Promise<void> {
  mkdirSync("tests/artifacts", { recursive: true });
  await page.screenshot({ path: `tests/artifacts/${name}.png`, fullPage: true });
}
